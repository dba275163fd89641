"use client";

import { useSyncExternalStore } from "react";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { modelParamsSchema } from "@/lib/physics/schema";
import { RunOriginNote, useRunOrigin } from "./run-origin";
import { readLocalViewState } from "./use-view-state";
import { Workbench } from "./workbench";

const subscribe = () => () => {};

/**
 * Scratch mode: terbium-garnet defaults, view state from this browser. Rendered only after
 * hydration, because the remembered view lives in localStorage, which the server cannot see.
 */
export function ScratchWorkbench({ runId = null }: { runId?: string | null }) {
  const mounted = useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
  // `?run=`: a lab run whose parameters came with it (no set) opens here with those parameters.
  const origin = useRunOrigin(runId);
  if (!mounted || origin.pending) return <SkeletonRows rows={6} label="Loading the workbench…" />;
  if (origin.error) return <ErrorPanel error={origin.error} retry={origin.retry} />;
  const start = origin.start;
  const params = start ? modelParamsSchema.safeParse(start.params) : null;
  const local = readLocalViewState(null) as Record<string, unknown>;
  return (
    <>
      {origin.run && start && params?.success ? <RunOriginNote run={origin.run} start={start} currentVersion={null} /> : null}
      <Workbench
        key={runId ?? "scratch"}
        set={null}
        initialParams={params?.success ? params.data : TERBIUM_GARNET_DEFAULTS}
        view={{ initial: start ? { ...local, range: start.range } : local, shared: null, own: false }}
      />
    </>
  );
}
