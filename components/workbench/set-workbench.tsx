"use client";

import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { modelParamsSchema } from "@/lib/physics/schema";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { readLocalViewState } from "./use-view-state";
import { Workbench } from "./workbench";

/** /workbench/{setId}: loads the set through TanStack Query, then hands it to the workbench. */
export function SetWorkbench({ setId }: { setId: string }) {
  const query = useParameterSet(setId);
  const item = query.data;
  const canSaveView = item ? item.role === "owner" || item.role === "editor" : false;

  // Viewers cannot save the view with the set, so their own copy (if any) wins over the set's.
  const initialView = useMemo(() => {
    if (!item) return null;
    if (!canSaveView) return readLocalViewState(item.id) ?? item.viewState;
    return item.viewState;
  }, [item, canSaveView]);

  if (query.isPending) return <SkeletonRows rows={8} label="Loading the parameter set…" />;
  if (query.isError) return <ErrorPanel error={query.error} retry={() => void query.refetch()} />;
  if (!item) return null;

  // Stored params passed the server's schema; parse again so defaults (magneticScale) are filled in.
  const parsed = modelParamsSchema.safeParse(item.params);
  if (!parsed.success) {
    return (
      <Alert tone="warning" title="This parameter set cannot be opened in the workbench">
        Its stored parameters are not valid: {parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}
      </Alert>
    );
  }

  return (
    <Workbench
      // A new version of the set starts a fresh workbench with its parameters.
      key={`${item.id}:${item.version}`}
      set={{ id: item.id, name: item.name, version: item.version, labName: item.labName, role: item.role }}
      initialParams={parsed.data}
      initialViewState={initialView}
      canSaveView={canSaveView}
    />
  );
}
