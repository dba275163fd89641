"use client";

import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { INPUT_CLASS } from "@/components/ui/text-field";
import type { LightSource } from "@/lib/contracts/light-sources";
import { useCreateLightSource, useDeleteLightSource } from "@/lib/query/planner";
import { RequestError } from "@/lib/query/fetcher";
import { parseNumber } from "@/lib/workbench/validate";

/** The lab's lines: everyone sees them; editors add and remove (with a confirmation). */
export function LightSourcesPanel({
  labId,
  labName,
  sources,
  canEdit,
}: {
  labId: string;
  labName: string;
  sources: LightSource[];
  canEdit: boolean;
}) {
  const base = useId();
  const create = useCreateLightSource(labId);
  const remove = useDeleteLightSource(labId);
  const [draft, setDraft] = useState({ name: "", wavelengthNm: "", powerMw: "" });
  const [error, setError] = useState<string | null>(null);
  const [toDelete, setToDelete] = useState<LightSource | null>(null);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const wavelengthNm = parseNumber(draft.wavelengthNm);
    const powerMw = draft.powerMw.trim() === "" ? null : parseNumber(draft.powerMw);
    if (draft.name.trim() === "") return setError("Give the line a name.");
    if (wavelengthNm === null || wavelengthNm <= 0) return setError("Enter the wavelength in nm, e.g. 1064.");
    if (powerMw !== null && powerMw < 0) return setError("Power must be ≥ 0 mW (or leave it empty).");
    setError(null);
    create.mutate(
      { name: draft.name.trim(), wavelengthNm, powerW: powerMw === null ? null : powerMw / 1000 },
      {
        onSuccess: () => setDraft({ name: "", wavelengthNm: "", powerMw: "" }),
        onError: (err) =>
          setError(err instanceof RequestError ? (Object.values(err.fields ?? {})[0] ?? err.message) : "Could not add the line."),
      },
    );
  };

  return (
    <details className="rounded-lg border border-ink/15 bg-paper-raised p-4">
      <summary className="cursor-pointer font-semibold">
        Light sources of {labName} ({sources.length})
      </summary>
      {sources.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No lines yet.{canEdit ? " Add the lasers your lab owns below." : ""}</p>
      ) : null}
      <ul className="mt-2 divide-y divide-ink/10 text-sm">
        {sources.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5">
            <span>
              {s.name} — {s.wavelengthNm} nm
              {s.tunableMinNm !== null ? ` (tunable ${s.tunableMinNm}–${s.tunableMaxNm} nm)` : ""}
              {s.powerW !== null ? `, ${Number((s.powerW * 1000).toPrecision(3))} mW` : ""}
            </span>
            {canEdit ? (
              <Button variant="quiet" onClick={() => setToDelete(s)} aria-label={`Remove ${s.name}`}>
                Remove
              </Button>
            ) : null}
          </li>
        ))}
      </ul>
      {canEdit ? (
        <form onSubmit={submit} className="mt-3 grid gap-2 sm:grid-cols-[2fr_1fr_1fr_auto] sm:items-end" aria-label="Add a light source">
          <label className="grid gap-1 text-sm" htmlFor={`${base}-name`}>
            Name
            <input
              id={`${base}-name`}
              className={INPUT_CLASS}
              value={draft.name}
              onChange={(e) => setDraft((d) => ({ ...d, name: e.target.value }))}
            />
          </label>
          <label className="grid gap-1 text-sm" htmlFor={`${base}-nm`}>
            Wavelength (nm)
            <input
              id={`${base}-nm`}
              inputMode="decimal"
              className={INPUT_CLASS}
              value={draft.wavelengthNm}
              onChange={(e) => setDraft((d) => ({ ...d, wavelengthNm: e.target.value }))}
            />
          </label>
          <label className="grid gap-1 text-sm" htmlFor={`${base}-mw`}>
            Power (mW, optional)
            <input
              id={`${base}-mw`}
              inputMode="decimal"
              className={INPUT_CLASS}
              value={draft.powerMw}
              onChange={(e) => setDraft((d) => ({ ...d, powerMw: e.target.value }))}
            />
          </label>
          <Button type="submit" variant="secondary" disabled={create.isPending}>
            {create.isPending ? "Adding…" : "Add line"}
          </Button>
          {error ? (
            <p role="alert" className="text-sm text-ember sm:col-span-4">
              {error}
            </p>
          ) : null}
        </form>
      ) : (
        <p className="mt-2 text-xs text-ink-soft">Editors of the lab can add and remove lines.</p>
      )}
      <ConfirmDialog
        open={toDelete !== null}
        title={`Remove “${toDelete?.name ?? ""}”?`}
        confirmLabel="Remove line"
        destructive
        pending={remove.isPending}
        error={remove.error ? remove.error.message : null}
        onCancel={() => setToDelete(null)}
        onConfirm={() => toDelete && remove.mutate(toDelete.id, { onSuccess: () => setToDelete(null) })}
      >
        The line leaves the lab&apos;s list for everyone. Saved plans keep their own copy of the wavelengths.
      </ConfirmDialog>
    </details>
  );
}
