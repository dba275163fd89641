"use client";

import { useSyncExternalStore } from "react";
import { SkeletonRows } from "@/components/ui/skeleton";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { readLocalViewState } from "./use-view-state";
import { Workbench } from "./workbench";

const subscribe = () => () => {};

/**
 * Scratch mode: terbium-garnet defaults, view state from this browser. Rendered only after
 * hydration, because the remembered view lives in localStorage, which the server cannot see.
 */
export function ScratchWorkbench() {
  const mounted = useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
  if (!mounted) return <SkeletonRows rows={6} label="Loading the workbench…" />;
  return (
    <Workbench set={null} initialParams={TERBIUM_GARNET_DEFAULTS} view={{ initial: readLocalViewState(null), shared: null, own: false }} />
  );
}
