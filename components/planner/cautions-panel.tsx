import { useId } from "react";
import type { Caution } from "@/lib/planner/cautions";

/**
 * The safety cautions, as a region named by its heading so they can be found (and printed) as one
 * block. A page with two such blocks gives each its own title: two landmarks of one name cannot be
 * told apart by a screen reader's landmark list.
 */
export function CautionsPanel({
  cautions,
  headingLevel = 2,
  title = "Safety cautions",
}: {
  cautions: Caution[];
  headingLevel?: 2 | 3;
  title?: string;
}) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="caution-block rounded-md border border-ember bg-ember-light px-4 py-3 text-sm text-ink">
      <Heading id={headingId} className="font-semibold">
        {title}
      </Heading>
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
