"use client";

import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS, TextField } from "@/components/ui/text-field";
import { type EditablePointField, MASK_REASON_MAX, NOTE_MAX, type PointChange, type StoredPoint } from "@/lib/contracts/measurement-sets";
import { changeFromDraft, draftOf, FIELD_LABELS } from "@/lib/measurements/point-table";
import { EDITABLE_POINT_FIELDS } from "@/lib/measurements/point";
import { fmtStored } from "@/lib/workbench/format";

/** Mask, note and values of one point; saving makes a new revision of the set. */
export function PointEditor({
  point,
  unit,
  saving,
  onCancel,
  onSave,
}: {
  point: StoredPoint;
  unit: string;
  saving: boolean;
  onCancel: () => void;
  onSave: (change: PointChange) => Promise<void>;
}) {
  const id = useId();
  const [draft, setDraft] = useState(() => draftOf(point));
  const [tried, setTried] = useState(false);
  const { change, errors } = changeFromDraft(point, draft);
  const label = (field: EditablePointField) =>
    field === "value" || field === "sigma" ? `${FIELD_LABELS[field]} (${unit})` : FIELD_LABELS[field];

  return (
    <form
      aria-label={`Edit the point on line ${point.line}`}
      className="mb-4 rounded-lg border border-lux/40 bg-paper-raised p-4"
      onSubmit={(event) => {
        event.preventDefault();
        setTried(true);
        if (change) void onSave(change).catch(() => undefined);
      }}
      onKeyDown={(event) => {
        if (event.key === "Escape") onCancel();
      }}
    >
      <h2 className="text-base font-semibold">Point on line {point.line}</h2>
      <div className="mt-3 grid gap-3 sm:grid-cols-2">
        <div>
          <label className="flex items-center gap-2 text-sm font-medium">
            <input type="checkbox" checked={draft.masked} onChange={(e) => setDraft({ ...draft, masked: e.target.checked })} />
            Mask this point (leave it out of fits and overlays)
          </label>
          {draft.masked ? (
            <TextField
              id={`${id}-reason`}
              className="mt-2"
              label="Why"
              maxLength={MASK_REASON_MAX}
              value={draft.maskReason}
              onChange={(e) => setDraft({ ...draft, maskReason: e.target.value })}
              error={tried ? errors.maskReason : undefined}
            />
          ) : null}
        </div>
        <div>
          <label htmlFor={`${id}-note`} className="block text-sm font-medium">
            Note
          </label>
          <textarea
            id={`${id}-note`}
            className={`mt-1 ${INPUT_CLASS}`}
            rows={2}
            maxLength={NOTE_MAX}
            value={draft.note}
            onChange={(e) => setDraft({ ...draft, note: e.target.value })}
          />
        </div>
      </div>
      <fieldset className="mt-3">
        <legend className="text-sm font-medium">Values (SI; a change makes a new revision, the file stays as uploaded)</legend>
        <div className="mt-2 grid gap-3 sm:grid-cols-3">
          {EDITABLE_POINT_FIELDS.map((field) => (
            <TextField
              key={field}
              id={`${id}-${field}`}
              label={label(field)}
              inputMode="decimal"
              value={draft.values[field]}
              onChange={(e) => setDraft({ ...draft, values: { ...draft.values, [field]: e.target.value } })}
              error={errors[field]}
              hint={point.original?.[field] !== undefined ? `In the file: ${fmtStored(point.original[field])}` : undefined}
            />
          ))}
        </div>
      </fieldset>
      <div className="mt-4 flex flex-wrap items-center gap-2">
        <Button type="submit" disabled={saving || (tried && change === null)}>
          {saving ? "Saving…" : "Save as a new revision"}
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={saving}>
          Cancel
        </Button>
        {tried && change === null && Object.keys(errors).length === 0 ? (
          <span className="text-sm text-ink-soft">Nothing changed.</span>
        ) : null}
      </div>
    </form>
  );
}
