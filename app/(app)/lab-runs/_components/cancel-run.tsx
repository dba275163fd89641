"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { describeError } from "@/lib/query/fetcher";
import { useCancelRun } from "@/lib/query/lab-runs";
import { roleAtLeast } from "@/lib/contracts/roles";
import { type LabRunSummary, isActiveLabRun } from "@/lib/contracts/lab-runs";

/** Cancel with a confirmation (the work done so far is dropped); editors and owners only. */
export function CancelRun({ run }: { run: LabRunSummary }) {
  const [open, setOpen] = useState(false);
  const cancel = useCancelRun();
  if (!roleAtLeast(run.role, "editor") || !isActiveLabRun(run.state) || run.cancelRequested) return null;
  return (
    <>
      <Button variant="quiet" onClick={() => setOpen(true)}>
        Cancel run
      </Button>
      <ConfirmDialog
        open={open}
        title="Cancel this run?"
        confirmLabel="Cancel the run"
        destructive
        pending={cancel.isPending}
        error={cancel.isError ? describeError(cancel.error) : null}
        onConfirm={() => cancel.mutate(run.id, { onSuccess: () => setOpen(false) })}
        onCancel={() => setOpen(false)}
      >
        <p className="text-sm">
          {run.title}. The work done so far is dropped and nothing is stored; a running run stops within a few seconds.
        </p>
      </ConfirmDialog>
    </>
  );
}
