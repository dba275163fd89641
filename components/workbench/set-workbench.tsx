"use client";

import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { zodIssueLines } from "@/lib/contracts/validation";
import { modelParamsSchema } from "@/lib/physics/schema";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { useMyWorkbenchView } from "@/lib/query/workbench-views";
import { RunOriginNote, useRunOrigin } from "./run-origin";
import type { ViewSource } from "./use-view-state";
import { Workbench } from "./workbench";

/**
 * /workbench/{setId}: loads the set through TanStack Query, then hands it to the workbench. With
 * `?run=` (a lab run's "Open in the workbench") it starts from that run's parameters and range.
 */
export function SetWorkbench({ setId, runId = null }: { setId: string; runId?: string | null }) {
  const query = useParameterSet(setId);
  const myView = useMyWorkbenchView(setId);
  const origin = useRunOrigin(runId);
  const item = query.data;
  const mine = myView.data;
  const start = origin.start;

  // A person's own view wins; without one they start from the lab's shared view (or the defaults).
  // Opened from a run, the run's wavelength range replaces the view's (nothing is saved until changed).
  const view = useMemo<ViewSource | null>(() => {
    if (!mine) return null;
    const initial = (mine.viewState ?? mine.sharedViewState ?? {}) as Record<string, unknown>;
    return {
      initial: start ? { ...initial, range: start.range } : (mine.viewState ?? mine.sharedViewState),
      shared: mine.sharedViewState,
      own: mine.viewState !== null,
    };
  }, [mine, start]);

  if (query.isPending || myView.isPending || origin.pending) return <SkeletonRows rows={8} label="Loading the parameter set…" />;
  if (query.isError) return <ErrorPanel error={query.error} retry={() => void query.refetch()} />;
  if (myView.isError) return <ErrorPanel error={myView.error} retry={() => void myView.refetch()} />;
  if (origin.error) return <ErrorPanel error={origin.error} retry={origin.retry} />;
  if (!item || !view) return null;

  // Stored params passed the server's schema; parse again so defaults (magneticScale) are filled in.
  const parsed = modelParamsSchema.safeParse(start?.params ?? item.params);
  if (!parsed.success) {
    return (
      <Alert tone="warning" title="This parameter set cannot be opened in the workbench">
        Its stored parameters are not valid: {zodIssueLines(parsed.error.issues).join("; ")}
      </Alert>
    );
  }

  return (
    <>
      {origin.run && start ? <RunOriginNote run={origin.run} start={start} currentVersion={item.version} /> : null}
      <Workbench
        // A new version of the set starts a fresh workbench with its parameters.
        key={`${item.id}:${item.version}:${runId ?? ""}`}
        set={{ id: item.id, name: item.name, version: item.version, labName: item.labName, role: item.role }}
        initialParams={parsed.data}
        view={view}
      />
    </>
  );
}
