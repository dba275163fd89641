"use client";

import { DateTime } from "@/components/ui/date-time";
import { describeChanges } from "@/lib/measurements/point-table";
import { describeError } from "@/lib/query/fetcher";
import { usePointHistory } from "@/lib/query/measurement-sets";

/** Every revision's changes, newest first: who changed which point, how, and when. */
export function PointHistory({ id }: { id: string }) {
  const history = usePointHistory(id);
  return (
    <section aria-labelledby="point-history-heading" className="mt-8">
      <h2 id="point-history-heading" className="text-lg font-semibold">
        Revisions
      </h2>
      {history.isPending ? (
        <p role="status" className="mt-2 text-sm text-ink-soft">
          Loading the revisions…
        </p>
      ) : history.isError ? (
        <p role="alert" className="mt-2 text-sm text-ember">
          {describeError(history.error)}
        </p>
      ) : history.data.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">Revision 1: the points as uploaded. No point has been changed.</p>
      ) : (
        <ol className="mt-2 space-y-1.5 text-sm">
          {history.data.map((entry) => (
            <li key={`${entry.revision}-${entry.ordinal}`}>
              <span className="font-medium">Revision {entry.revision}</span>, line {entry.line}: {describeChanges(entry.changes)}
              <span className="text-ink-soft">
                {" "}
                — {entry.actor?.name ?? "a former member"}, <DateTime iso={entry.at} />
              </span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
