"use client";

import { INPUT_CLASS } from "@/components/ui/text-field";
import type { CalibrationDraft } from "@/lib/workbench/fit-draft";

/*
 * Each chosen measurement set's calibration as nuisances of the fit: the σ of its field × length
 * scale (a factor with prior 1 ± σ on the set's model values), a relative error floor added in
 * quadrature to its points' σ, and the σ of its sample temperature. Empty fields mean none.
 */

const FIELDS = [
  { key: "scalePercent", label: "Field × length σ (%)", placeholder: "e.g. 1" },
  { key: "floorPercent", label: "Error floor (%)", placeholder: "none" },
  { key: "temperatureSigmaK", label: "Temperature σ (K)", placeholder: "none" },
] as const;

export function FitCalibration({
  sets,
  drafts,
  errors,
  onChange,
}: {
  sets: { id: string; name: string }[];
  drafts: Record<string, CalibrationDraft>;
  errors: Record<string, string>;
  onChange: (id: string, patch: Partial<CalibrationDraft>) => void;
}) {
  if (sets.length === 0) return null;
  return (
    <details className="rounded border border-ink/10 px-3 py-2 text-sm" open={Object.keys(errors).length > 0 ? true : undefined}>
      <summary className="cursor-pointer font-semibold">Calibration of each set (optional)</summary>
      <p className="mt-1 text-xs text-ink-soft">
        The fit then varies each set&apos;s field × length scale within its σ and weighs its points by the floor and by ∂value/∂T × the
        temperature σ; every reported σ includes them.
      </p>
      <div className="relative mt-2 overflow-x-auto">
        <table className="w-full min-w-[28rem]">
          <thead>
            <tr className="text-left text-xs text-ink-soft">
              <th className="py-1 pr-2 font-medium">Set</th>
              {FIELDS.map((f) => (
                <th key={f.key} className="py-1 pr-2 font-medium">
                  {f.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {sets.map((s) => (
              <tr key={s.id} className="border-t border-ink/10 align-top">
                <td className="py-1 pr-2">
                  {s.name}
                  {errors[s.id] ? (
                    <p className="text-xs text-ember" role="alert">
                      {errors[s.id]}
                    </p>
                  ) : null}
                </td>
                {FIELDS.map((f) => (
                  <td key={f.key} className="py-1 pr-2">
                    <input
                      className={`${INPUT_CLASS} w-24 py-1`}
                      aria-label={`${f.label} of ${s.name}`}
                      aria-invalid={errors[s.id] ? true : undefined}
                      inputMode="decimal"
                      placeholder={f.placeholder}
                      value={drafts[s.id]?.[f.key] ?? ""}
                      onChange={(e) => onChange(s.id, { [f.key]: e.target.value })}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
