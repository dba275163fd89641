"use client";

import { memo } from "react";
import { MAX_WAVELENGTHS } from "@/lib/physics/schema";
import type { FieldErrors, RangeDrafts } from "@/lib/workbench/validate";

const INPUT =
  "block w-full rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm tabular-nums " +
  "focus:border-lux aria-[invalid=true]:border-ember";

function RangeControlsImpl({
  drafts,
  errors,
  requestError,
  onChange,
}: {
  drafts: RangeDrafts;
  errors: FieldErrors<"fromNm" | "toNm" | "points">;
  requestError: string | null;
  onChange: (next: RangeDrafts) => void;
}) {
  const field = (key: "fromNm" | "toNm" | "points", label: string) => {
    const id = `range-${key}`;
    const error = errors[key];
    return (
      <div>
        <label htmlFor={id} className="text-sm font-medium">
          {label}
        </label>
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          className={`mt-1 ${INPUT}`}
          value={drafts[key]}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(e) => onChange({ ...drafts, [key]: e.target.value })}
        />
        {error ? (
          <p id={`${id}-error`} className="mt-1 text-xs text-ember">
            {error}
          </p>
        ) : null}
      </div>
    );
  };
  return (
    <fieldset className="space-y-2">
      <legend className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Wavelength range</legend>
      <div className="grid grid-cols-2 gap-2">
        {field("fromNm", "From (nm)")}
        {field("toNm", "To (nm)")}
      </div>
      <div className="grid grid-cols-2 items-end gap-2">
        {field("points", `Points (≤ ${MAX_WAVELENGTHS})`)}
        <div>
          <label htmlFor="range-spacing" className="text-sm font-medium">
            Spacing
          </label>
          <select
            id="range-spacing"
            className={`mt-1 ${INPUT}`}
            value={drafts.spacing}
            onChange={(e) => onChange({ ...drafts, spacing: e.target.value === "linear" ? "linear" : "log" })}
          >
            <option value="log">log</option>
            <option value="linear">linear</option>
          </select>
        </div>
      </div>
      {requestError ? (
        <p role="alert" className="text-xs text-ember">
          {requestError}
        </p>
      ) : null}
    </fieldset>
  );
}

export const RangeControls = memo(RangeControlsImpl);
