"use client";

import { Alert } from "@/components/ui/alert";
import { Workbench } from "@/components/workbench/workbench";
import type { SharedSet } from "@/lib/contracts/sharing";
import { modelParamsSchema } from "@/lib/physics/schema";

/** The read-only workbench of one shared set: plots, markers and exports, no lab and no saving. */
export function SharedWorkbench({ set }: { set: SharedSet }) {
  const parsed = modelParamsSchema.safeParse(set.params);
  if (!parsed.success) {
    return (
      <Alert tone="warning" title="This parameter set cannot be opened in the workbench">
        Its stored parameters are not valid.
      </Alert>
    );
  }
  return (
    <>
      {set.description ? <p className="mb-4 max-w-3xl text-sm text-ink-soft">{set.description}</p> : null}
      <Workbench
        set={{ id: `shared-${set.name}`, name: set.name, version: set.version, labName: "", role: "viewer" }}
        initialParams={parsed.data}
        view={{ initial: set.viewState, shared: set.viewState, own: false }}
        shared
      />
    </>
  );
}
