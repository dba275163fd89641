import { formatFlag, formatValue } from "@/lib/model/diff";
import { formatNumberDisplay } from "@/lib/model/number-text";
import { FLAG_META, PARAM_GROUP_LABEL, PARAM_META, type ParamMeta } from "@/lib/model/param-meta";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";

const GROUPS: ParamMeta["group"][] = ["spins", "optics", "conditions"];

/** What a viewer sees: the stored values as text, with units, and no controls that could edit them. */
export function SetReadOnly({ item }: { item: ParameterSet }) {
  return (
    <div className="space-y-6">
      <section aria-labelledby="ro-details" className="rounded-lg border border-ink/10 bg-paper-raised p-5">
        <h2 id="ro-details" className="text-sm font-semibold tracking-wide text-lux-dark uppercase">
          Details
        </h2>
        <dl className="mt-3 grid gap-3 text-sm sm:grid-cols-[10rem_1fr]">
          <dt className="font-medium">Description</dt>
          <dd className="whitespace-pre-line text-ink-soft">{item.description || "—"}</dd>
          <dt className="font-medium">Tags</dt>
          <dd>{item.tags.length > 0 ? item.tags.join(", ") : "—"}</dd>
        </dl>
      </section>
      {GROUPS.map((group) => (
        <section key={group} aria-labelledby={`ro-${group}`} className="rounded-lg border border-ink/10 bg-paper-raised p-5">
          <h2 id={`ro-${group}`} className="text-sm font-semibold tracking-wide text-lux-dark uppercase">
            {PARAM_GROUP_LABEL[group]}
          </h2>
          <dl className="mt-3 grid gap-x-6 gap-y-3 text-sm sm:grid-cols-2 xl:grid-cols-3">
            {PARAM_META.filter((m) => m.group === group).map((meta) => (
              <div key={meta.key}>
                <dt className="font-medium">{meta.label}</dt>
                <dd className="tabular-nums">
                  <span title={formatValue(item.params[meta.key])}>{formatNumberDisplay(item.params[meta.key]) || "—"}</span>{" "}
                  <span className="text-ink-soft">{meta.unit}</span>
                </dd>
              </div>
            ))}
            {FLAG_META.filter((m) => m.group === group).map((meta) => (
              <div key={meta.key}>
                <dt className="font-medium">{meta.label}</dt>
                <dd>{formatFlag(item.params[meta.key])}</dd>
              </div>
            ))}
          </dl>
        </section>
      ))}
    </div>
  );
}
