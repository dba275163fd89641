"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { describeError } from "@/lib/query/fetcher";
import { formatTimeOfDay } from "@/lib/text/date-time";
import type { ViewSaveStatus } from "./use-view-state";

/*
 * Says whose view is on screen and offers "Reset view" and, to editors, "Share this view with the
 * lab". Both replace something (one's own view; everyone's starting view), so both ask first.
 */

const STATUS_TEXT: Record<ViewSaveStatus, string> = {
  local: "View kept in this browser only.",
  default: "Default view. Changes you make are saved as your own view; no one else sees them.",
  lab: "The lab's shared view. Changes you make are saved as your own view; no one else sees them.",
  mine: "Your own view, saved for you only.",
  saving: "Saving your view…",
  error: "Your view was not saved",
};

export function ViewControls({
  status,
  error,
  scratch,
  canShare,
  resetting,
  sharing,
  onReset,
  onShare,
}: {
  status: ViewSaveStatus;
  error: string | null;
  scratch: boolean;
  canShare: boolean;
  resetting: boolean;
  sharing: boolean;
  onReset: () => Promise<void>;
  onShare: () => Promise<void>;
}) {
  const [asking, setAsking] = useState<"reset" | "share" | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  const run = (action: () => Promise<void>, done: string | null) => {
    setActionError(null);
    action().then(
      () => {
        setAsking(null);
        setNotice(done);
      },
      (e: unknown) => setActionError(describeError(e)),
    );
  };

  return (
    <div className="mt-1 flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-ink-soft">
      <span role="status" data-testid="view-status">
        {STATUS_TEXT[status]}
        {status === "error" && error ? `: ${error}` : ""}
        {notice ? ` ${notice}` : ""}
      </span>
      <Button
        variant="quiet"
        className="text-xs"
        disabled={resetting || status === "default" || status === "lab"}
        onClick={() => setAsking("reset")}
      >
        Reset view
      </Button>
      {canShare ? (
        <Button variant="quiet" className="text-xs" disabled={sharing} onClick={() => setAsking("share")}>
          Share this view with the lab
        </Button>
      ) : null}
      <ConfirmDialog
        open={asking === "reset"}
        title="Reset your view?"
        confirmLabel="Reset view"
        destructive
        pending={resetting}
        error={asking === "reset" ? actionError : null}
        onCancel={() => setAsking(null)}
        onConfirm={() => run(onReset, null)}
      >
        {scratch
          ? "Axes, units, markers, open panels and the range go back to their defaults."
          : "Your own view of this set (axes, units, markers, open panels, spin-trace inputs, range) is deleted " +
            "and you see the lab's shared view again. Parameters are not affected."}
      </ConfirmDialog>
      <ConfirmDialog
        open={asking === "share"}
        title="Share this view with the lab?"
        confirmLabel="Share with the lab"
        pending={sharing}
        error={asking === "share" ? actionError : null}
        onCancel={() => setAsking(null)}
        onConfirm={() => run(onShare, `Shared with the lab at ${formatTimeOfDay(new Date())}.`)}
      >
        Everyone in the lab who has not saved a view of their own will start from this one (axes, units, markers, open panels, spin-trace
        inputs, range). Their own views are not changed.
      </ConfirmDialog>
    </div>
  );
}
