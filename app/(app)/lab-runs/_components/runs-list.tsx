"use client";

import Link from "next/link";
import { useState } from "react";
import { DateTime } from "@/components/ui/date-time";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { useLabs } from "@/lib/query/labs";
import { useRuns } from "@/lib/query/lab-runs";
import { CancelRun } from "./cancel-run";
import { RunState } from "./run-state";

/** /runs: the lab's runs, newest first, polled every second while any is queued or running. */
export function RunsList() {
  const [labId, setLabId] = useState<string | null>(null);
  const labs = useLabs();
  const runs = useRuns(labId);

  return (
    <div>
      <PageHeader
        title="Lab runs"
        lead={
          "Long computations (numerical maps, long spectra) computed by the lab's worker machines and kept for everyone in the lab. " +
          "Submit one from a parameter set's workbench (“Run on the lab’s machines”)."
        }
        actions={
          <label className="flex items-center gap-2 text-sm">
            Lab
            <select
              className="rounded-md border border-ink/25 bg-paper-raised px-2 py-1.5 text-sm focus:border-lux"
              value={labId ?? ""}
              onChange={(e) => setLabId(e.target.value || null)}
            >
              <option value="">All my labs</option>
              {(labs.data ?? []).map((lab) => (
                <option key={lab.id} value={lab.id}>
                  {lab.name}
                </option>
              ))}
            </select>
          </label>
        }
      />
      {runs.isPending ? (
        <SkeletonRows rows={4} label="Loading runs…" />
      ) : runs.isError ? (
        <ErrorPanel error={runs.error} retry={() => void runs.refetch()} />
      ) : runs.data.length === 0 ? (
        <div role="status" className="rounded-lg border border-dashed border-ink/20 px-6 py-10 text-center text-sm text-ink-soft">
          No runs yet. Open a parameter set in the workbench and use “Run on the lab’s machines” below the plots.
        </div>
      ) : (
        <ul className="divide-y divide-ink/10 rounded-lg border border-ink/10 bg-paper-raised" aria-label="Runs">
          {runs.data.map((run) => (
            <li key={run.id} className="flex flex-wrap items-start justify-between gap-3 px-4 py-3" data-testid="run-row">
              <div className="min-w-0 space-y-0.5">
                <Link href={`/lab-runs/${run.id}`} className="font-medium text-lux-dark underline-offset-4 hover:underline">
                  {run.title}
                </Link>
                <p className="text-xs text-ink-soft">
                  {run.labName} · submitted by {run.submittedBy.name} · <DateTime iso={run.createdAt} />
                  {run.parameterSet
                    ? ` · ${run.parameterSet.name} v${run.parameterSet.version}${run.parameterSet.edited ? " with edits" : ""}`
                    : ""}
                  {run.workerId ? ` · worker ${run.workerId}` : ""}
                  {run.attempt > 1 ? ` · attempt ${run.attempt}` : ""}
                  {` · engine ${run.engineVersion}`}
                </p>
              </div>
              <div className="flex items-start gap-3">
                <RunState run={run} />
                <CancelRun run={run} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
