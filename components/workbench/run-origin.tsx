"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import type { LabRunDetail } from "@/lib/contracts/lab-runs";
import { type WorkbenchStart, workbenchStartFromRun } from "@/lib/lab-runs/open-in-workbench";
import { runQuery } from "@/lib/query/lab-runs";

/** The lab run a workbench was opened from (`?run=`), and where the workbench starts from it. */
export function useRunOrigin(runId: string | null) {
  const query = useQuery({ ...runQuery(runId ?? ""), enabled: runId !== null });
  const run = runId ? (query.data ?? null) : null;
  const start = run ? workbenchStartFromRun(run) : null;
  return { pending: runId !== null && query.isPending, error: runId ? query.error : null, retry: () => void query.refetch(), run, start };
}

/** Says which run the workbench shows and how it relates to the set as it is now. */
export function RunOriginNote({ run, start, currentVersion }: { run: LabRunDetail; start: WorkbenchStart; currentVersion: number | null }) {
  const set = run.parameterSet;
  const from = set ? `${set.name} v${set.version}${set.edited ? " with what-if edits" : ""}` : "parameters given with the run";
  const later = set && currentVersion !== null && currentVersion !== set.version;
  return (
    <Alert title="Opened from a lab run">
      <p>
        The workbench shows the parameters and wavelength range of the run “{run.title}” ({from}, engine {run.engineVersion}) and computes
        its curves here with the same engine code the lab&apos;s workers ran.{" "}
        <Link href={`/lab-runs/${run.id}`} className="text-lux-dark underline underline-offset-4">
          The run&apos;s stored result
        </Link>
        .
      </p>
      {start.thinned ? <p>{start.thinned}</p> : null}
      {later ? (
        <p>
          The set is at v{currentVersion} now; saving here makes a new version from the run&apos;s parameters (v{set.version}
          {set.edited ? " with edits" : ""}).
        </p>
      ) : null}
    </Alert>
  );
}
