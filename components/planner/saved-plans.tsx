"use client";

import { useState } from "react";
import { Button, LinkButton } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DateTime } from "@/components/ui/date-time";
import { markersQueryValue } from "@/lib/planner/markers-query";
import { savedPlanSummary } from "@/lib/planner/summary";
import type { SavedPlan } from "@/lib/contracts/plans";
import { useDeletePlan } from "@/lib/query/planner";
import { fmt } from "@/lib/workbench/format";

/** Plans saved with the set, newest first; editors can delete (after a confirmation). */
export function SavedPlans({
  setId,
  plans,
  loading,
  canEdit,
}: {
  setId: string;
  plans: SavedPlan[] | null;
  loading: boolean;
  canEdit: boolean;
}) {
  const remove = useDeletePlan(setId);
  const [toDelete, setToDelete] = useState<SavedPlan | null>(null);
  return (
    <section aria-label="Saved plans" className="grid gap-2">
      <h2 className="text-lg font-semibold">Saved plans</h2>
      {loading ? <p className="text-sm text-ink-soft">Loading…</p> : null}
      {plans && plans.length === 0 ? <p className="text-sm text-ink-soft">No plans saved with this set yet.</p> : null}
      <ul className="grid gap-2">
        {(plans ?? []).map((p) => (
          <li
            key={p.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-ink/15 bg-paper-raised px-3 py-2 text-sm"
          >
            <span>
              <strong>{p.name}</strong> — {p.plan.points.map((pt) => `${pt.wavelengthNm} nm×${pt.count}`).join(", ")}; σ{" "}
              {p.plan.expectedSigma === null ? "∞" : fmt(p.plan.expectedSigma, 3)} {p.plan.criterionUnit} · v{p.setVersion} ·{" "}
              {p.createdBy.name} · <DateTime iso={p.createdAt} />
              {savedPlanSummary(p.plan, p.request).map((line) => (
                <span key={line} className="block text-ink-soft">
                  {line}
                </span>
              ))}
            </span>
            <span className="flex gap-1">
              <LinkButton
                variant="quiet"
                href={`/workbench/${setId}?markers=${encodeURIComponent(markersQueryValue(p.plan.points.map((pt) => pt.wavelengthNm)))}`}
              >
                Open in workbench
              </LinkButton>
              {canEdit ? (
                <Button variant="quiet" onClick={() => setToDelete(p)} aria-label={`Delete plan ${p.name}`}>
                  Delete
                </Button>
              ) : null}
            </span>
          </li>
        ))}
      </ul>
      <ConfirmDialog
        open={toDelete !== null}
        title={`Delete the plan “${toDelete?.name ?? ""}”?`}
        confirmLabel="Delete plan"
        destructive
        pending={remove.isPending}
        error={remove.error ? remove.error.message : null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        The plan is removed for everyone in the lab. The parameter set is not changed.
      </ConfirmDialog>
    </section>
  );
}
