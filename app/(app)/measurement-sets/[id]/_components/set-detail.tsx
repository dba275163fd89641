"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import type { PointChange, StoredPoint } from "@/lib/contracts/measurement-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { undoOf } from "@/lib/measurements/point-table";
import { describeError } from "@/lib/query/fetcher";
import { countOf, noun } from "@/lib/text/plural";
import { originalFileUrl, useEditPoints, useMeasurementSet, useStoredPoints } from "@/lib/query/measurement-sets";
import { fmt } from "@/lib/workbench/format";
import { PointEditor } from "./point-editor";
import { PointHistory } from "./point-history";
import { PointsTable } from "./points-table";

/** What the last save did, so it can be undone with one click (as another revision). */
interface LastSave {
  revision: number;
  undo: PointChange;
  line: number;
}

export function MeasurementSetDetail({ id }: { id: string }) {
  const set = useMeasurementSet(id);
  const points = useStoredPoints(id);
  const edit = useEditPoints(id);
  const [editing, setEditing] = useState<number | null>(null);
  const [showMasked, setShowMasked] = useState(true);
  const [lastSave, setLastSave] = useState<LastSave | null>(null);

  if (set.isError) return <ErrorPanel error={set.error} retry={() => void set.refetch()} />;
  if (points.isError) return <ErrorPanel error={points.error} retry={() => void points.refetch()} />;
  if (!set.data || !points.data) return <SkeletonRows label="Loading the measurement set" />;

  const item = set.data;
  const { revision } = points.data;
  const canEdit = roleAtLeast(item.role, "editor");
  const unit = item.quantity === "verdet" ? "rad/(T·m)" : "rad";
  const shown = showMasked ? points.data.points : points.data.points.filter((p) => !p.masked);
  const editingPoint = editing === null ? null : (points.data.points.find((p) => p.ordinal === editing) ?? null);

  async function save(before: StoredPoint, change: PointChange) {
    const saved = await edit.mutateAsync({ revision, changes: [change] });
    setLastSave({ revision: saved.revision, undo: undoOf(before, change), line: before.line });
    setEditing(null);
  }

  async function undo() {
    if (!lastSave) return;
    await edit.mutateAsync({ revision, changes: [lastSave.undo] });
    setLastSave(null);
  }

  return (
    <div className="max-w-6xl">
      <p className="mb-2 text-sm">
        <Link href="/measurement-sets" className="text-lux-dark underline-offset-4 hover:underline">
          ← Measurements
        </Link>
      </p>
      <PageHeader
        title={item.name}
        lead={
          <>
            {item.sample ? `${item.sample} · ` : ""}
            {item.quantity === "verdet" ? "Verdet constants" : "rotations"} · {item.rowCount} points
            {item.maskedCount > 0 ? `, ${item.maskedCount} masked` : ""} · revision {revision} · {item.labName}. Fits and the workbench
            overlay use the unmasked points; the uploaded file stays as it was.
          </>
        }
        actions={
          <a href={originalFileUrl(item.id)} className="text-sm text-lux-dark underline-offset-4 hover:underline">
            Download the original file ({item.fileName})
          </a>
        }
      />

      {item.signSource ? (
        <p data-testid="sign-source" className="mb-4 rounded-md border border-ink/10 bg-paper-raised px-3 py-2 text-sm">
          Signs taken from the model: the file held magnitudes, and at upload {countOf(item.signSource.changedCount, noun("value"))} took
          the sign that the model of{" "}
          <Link href={`/parameter-sets/${item.signSource.parameterSetId}`} className="text-lux-dark underline underline-offset-4">
            “{item.signSource.parameterSetName}”
          </Link>{" "}
          (version {item.signSource.version}) predicts at their own conditions. The original file keeps the values as they were.
        </p>
      ) : null}

      {lastSave ? (
        <div role="status" className="mb-4 flex flex-wrap items-center gap-3 rounded-md bg-lux-light px-3 py-2 text-sm text-lux-dark">
          Saved the point on line {lastSave.line} as revision {lastSave.revision}.
          <Button variant="secondary" onClick={() => void undo()} disabled={edit.isPending || revision !== lastSave.revision}>
            Undo
          </Button>
        </div>
      ) : null}
      {edit.isError ? (
        <p role="alert" className="mb-4 text-sm text-ember">
          {describeError(edit.error)}
        </p>
      ) : null}

      <div className="mb-3 flex flex-wrap items-center gap-4 text-sm">
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={showMasked} onChange={(e) => setShowMasked(e.target.checked)} />
          Show masked points
        </label>
        <span className="text-ink-soft">
          Values in SI: wavelength nm, value and σ {unit}, temperature K, field T, length m. Sets span {fmt(item.wavelengthSpanNm.min, 5)}–
          {fmt(item.wavelengthSpanNm.max, 5)} nm.
        </span>
      </div>

      {editingPoint ? (
        <PointEditor
          key={`${editingPoint.ordinal}-${revision}`}
          point={editingPoint}
          unit={unit}
          saving={edit.isPending}
          onCancel={() => setEditing(null)}
          onSave={(change) => save(editingPoint, change)}
        />
      ) : null}

      {shown.length === 0 ? (
        <p className="rounded-md border border-ink/10 p-4 text-sm text-ink-soft">
          Every point is masked. Tick “Show masked points” to see them.
        </p>
      ) : (
        <PointsTable points={shown} unit={unit} canEdit={canEdit} editing={editing} onEdit={setEditing} />
      )}

      <PointHistory id={id} />
    </div>
  );
}
