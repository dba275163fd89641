import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { ACCESS_WORDS, buildOpenApiDocument } from "@/lib/api-docs/document";
import { type ApiRouteDoc, ROUTES } from "@/lib/api-docs/registry";
import { FieldTable } from "./_components/field-table";

export const metadata: Metadata = { title: "API" };

type Op = { parameters?: { name: string; in: string; required: boolean; schema: Record<string, unknown>; description?: string }[] };
type Body = { content: Record<string, { schema: Record<string, unknown> }> };
type Answers = Record<string, { description: string; content?: Record<string, { schema: Record<string, unknown> }> }>;

const METHOD_STYLE: Record<string, string> = {
  GET: "bg-lux-light text-lux-dark",
  POST: "bg-ember-light text-ember",
  PUT: "bg-ember-light text-ember",
  PATCH: "bg-ember-light text-ember",
  DELETE: "bg-paper-sunk text-ink",
};

const slug = (text: string) => text.toLowerCase().replace(/[^a-z0-9]+/g, "-");
const anchor = (route: ApiRouteDoc) => `${route.method}-${route.path}`.toLowerCase().replace(/[^a-z0-9]+/g, "-");

function Operation({ route, op }: { route: ApiRouteDoc; op: Record<string, unknown> }) {
  const params = (op as Op).parameters ?? [];
  const body = op.requestBody as Body | undefined;
  const answers = op.responses as Answers;
  const status = String(route.response.status);
  const success = answers[status]!;
  const successSchema = success.content?.["application/json"]?.schema;
  return (
    <article id={anchor(route)} className="scroll-mt-6 rounded-lg border border-ink/10 bg-paper-raised p-4">
      <h3 className="flex flex-wrap items-baseline gap-2">
        <span className={`rounded px-2 py-0.5 font-mono text-xs font-semibold ${METHOD_STYLE[route.method]}`}>{route.method}</span>
        <code className="font-mono text-sm break-all">{route.path}</code>
      </h3>
      <p className="mt-1 font-medium">{route.summary}</p>
      {route.description ? <p className="mt-1 max-w-3xl text-sm text-ink-soft">{route.description}</p> : null}
      <p className="mt-1 text-xs text-ink-soft">Who: {ACCESS_WORDS[route.access]}</p>
      <div className="mt-3 space-y-3">
        {params.length > 0 ? (
          <div className="overflow-x-auto rounded-md border border-ink/10">
            <table className="w-full min-w-[30rem] text-left text-sm">
              <caption className="bg-paper-sunk px-3 py-1.5 text-left text-xs font-semibold text-ink-soft">Parameters</caption>
              <tbody>
                {params.map((p) => (
                  <tr key={`${p.in}-${p.name}`} className="border-t border-ink/5 align-top">
                    <td className="px-3 py-1.5 font-mono text-xs">
                      {p.name}
                      {p.required ? null : <span className="ml-1 font-sans text-ink-faint">(optional)</span>}
                    </td>
                    <td className="px-3 py-1.5 text-xs text-ink-soft">{p.in === "path" ? "in the path" : "query"}</td>
                    <td className="px-3 py-1.5 text-xs text-ink-soft">{p.description ?? ""}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null}
        {body
          ? Object.entries(body.content).map(([type, { schema }]) => <FieldTable key={type} schema={schema} caption={`Body (${type})`} />)
          : null}
        {successSchema ? (
          <details className="rounded-md">
            <summary className="cursor-pointer text-sm text-lux-dark">
              Answer {status}: {success.description}
            </summary>
            <div className="mt-2">
              <FieldTable schema={successSchema} caption={`Answer ${status}`} />
            </div>
          </details>
        ) : (
          <p className="text-sm text-ink-soft">
            Answer {status}: {success.description}
          </p>
        )}
      </div>
    </article>
  );
}

export default function ApiReferencePage() {
  const doc = buildOpenApiDocument();
  const tags = doc.tags.map((t) => t.name);
  return (
    <div className="max-w-5xl">
      <PageHeader
        title="API"
        lead={
          <>
            Everything the screens do is open to scripts. Make a token in{" "}
            <Link href="/settings" className="underline">
              Settings
            </Link>{" "}
            and send it as <code className="font-mono text-sm">Authorization: Bearer …</code>. The machine-readable description is{" "}
            <a href="/api/openapi.json" className="underline">
              /api/openapi.json
            </a>{" "}
            (OpenAPI 3.1); a Python client lives in <code className="font-mono text-sm">clients/python</code>.
          </>
        }
      />
      <nav aria-label="API areas" className="mb-6 flex flex-wrap gap-2">
        {tags.map((tag) => (
          <a key={tag} href={`#${slug(tag)}`} className="rounded-full bg-paper-sunk px-3 py-1 text-sm hover:bg-lux-light">
            {tag}
          </a>
        ))}
      </nav>
      <p className="mb-6 max-w-3xl text-sm text-ink-soft">
        Values are SI unless the name says otherwise (wavelengthNm, fieldT, temperatureK). Errors answer{" "}
        <code className="font-mono">{'{ "error": { "code", "message", "fields" } }'}</code> with one message per invalid field.
      </p>
      {tags.map((tag) => (
        <section key={tag} id={slug(tag)} aria-labelledby={`${slug(tag)}-heading`} className="mb-8 scroll-mt-6">
          <h2 id={`${slug(tag)}-heading`} className="mb-3 text-lg font-semibold">
            {tag}
          </h2>
          <div className="space-y-3">
            {ROUTES.filter((route) => route.tag === tag).map((route) => (
              <Operation key={anchor(route)} route={route} op={doc.paths[route.path]![route.method.toLowerCase()]!} />
            ))}
          </div>
        </section>
      ))}
    </div>
  );
}
