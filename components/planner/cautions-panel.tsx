import type { Caution } from "@/lib/planner/cautions";

/** The safety cautions, as a labelled region so they can be found (and printed) as one block. */
export function CautionsPanel({ cautions, headingLevel = 2 }: { cautions: Caution[]; headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  return (
    <section
      aria-label="Safety cautions"
      className="caution-block rounded-md border border-ember bg-ember-light px-4 py-3 text-sm text-ink"
    >
      <Heading className="font-semibold">Safety cautions</Heading>
      <div className="mt-2 grid gap-3">
        {cautions.map((c) => (
          <div key={c.key}>
            <p className="font-medium">{c.title}</p>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {c.lines.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </div>
        ))}
      </div>
    </section>
  );
}
