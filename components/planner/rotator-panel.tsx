"use client";

import { useId, useMemo, useState } from "react";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { zodIssueLines } from "@/lib/contracts/validation";
import { cautionsFor } from "@/lib/planner/cautions";
import { isolationDb, rotatorRequestSchema, sizeRotator, type Window } from "@/lib/planner/rotator";
import type { ModelParams } from "@/lib/physics/schema";
import { fmt, fmtPercent, magneticScaleLabel } from "@/lib/workbench/format";
import { parseNumber } from "@/lib/workbench/validate";
import { CautionsPanel } from "./cautions-panel";

const DEG = Math.PI / 180;

function windowText(w: Window | null, unit: string, digits = 4): string {
  if (!w) return "–";
  const low = `${w.lowOpen ? "≤ " : ""}${fmt(w.low, digits)}`;
  const high = `${w.highOpen ? "≥ " : ""}${fmt(w.high, digits)}`;
  return `${low} to ${high} ${unit}`;
}

/** Rotator sizing for the chosen set: length for an angle, V split, sensitivities, isolation windows. */
export function RotatorPanel({ params }: { params: ModelParams }) {
  const base = useId();
  const [drafts, setDrafts] = useState({
    wavelengthNm: "1064",
    temperatureK: String(params.temperatureK),
    fieldT: String(params.fieldT || 1),
    targetAngleDeg: "45",
    isolationTargetDb: "30",
  });
  const parsed = useMemo(() => {
    const values = Object.fromEntries(Object.entries(drafts).map(([k, v]) => [k, parseNumber(v)]));
    return rotatorRequestSchema.safeParse({ params: { ...params, temperatureK: values.temperatureK ?? params.temperatureK }, ...values });
  }, [drafts, params]);
  const result = useMemo(() => {
    if (!parsed.success) return null;
    try {
      return { ok: true as const, value: sizeRotator(parsed.data) };
    } catch (error) {
      return { ok: false as const, message: error instanceof Error ? error.message : "The rotator could not be sized here." };
    }
  }, [parsed]);
  const issues = parsed.success ? [] : zodIssueLines(parsed.error.issues, { label: (path) => FIELD_LABEL[path.split(".").at(-1)!] });
  const scaleLabel = magneticScaleLabel(params.magneticScale);

  const field = (key: keyof typeof drafts, label: string, unit: string) => (
    <label className="grid gap-1 text-sm" htmlFor={`${base}-${key}`}>
      <span>
        {label} <span className="text-ink-soft">({unit})</span>
      </span>
      <input
        id={`${base}-${key}`}
        inputMode="decimal"
        className={INPUT_CLASS}
        value={drafts[key]}
        onChange={(e) => setDrafts((d) => ({ ...d, [key]: e.target.value }))}
      />
    </label>
  );

  const r = result?.ok ? result.value : null;
  return (
    <section aria-labelledby={`${base}-title`} className="grid gap-4 rounded-lg border border-ink/15 bg-paper-raised p-4">
      <h2 id={`${base}-title`} className="text-lg font-semibold">
        Rotator sizing
      </h2>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-5">
        {field("wavelengthNm", "Wavelength", "nm")}
        {field("temperatureK", "Temperature", "K")}
        {field("fieldT", "Field B0", "T")}
        {field("targetAngleDeg", "Target angle", "°")}
        {field("isolationTargetDb", "Isolation target", "dB")}
      </div>
      {issues.length > 0 ? (
        <ul role="alert" className="list-disc pl-5 text-sm text-ember">
          {issues.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      ) : null}
      {result && !result.ok ? (
        <p role="alert" className="text-sm text-ember">
          {result.message}
        </p>
      ) : null}
      {r ? (
        <dl className="grid grid-cols-1 gap-x-6 gap-y-2 text-sm sm:grid-cols-2" aria-label="Rotator figures">
          {/* The 45° line (the isolator's angle) is shown beside the target's only when the target is another angle. */}
          {parsed.data?.targetAngleDeg !== 45 ? (
            <Figure term="Length for 45°" value={r.length45M !== null ? `${fmt(r.length45M * 1000, 4)} mm` : "– (no rotation)"} />
          ) : null}
          <Figure
            term={`Length for ${fmt(parsed.data?.targetAngleDeg, 6)}°`}
            value={r.lengthM !== null ? `${fmt(r.lengthM * 1000, 4)} mm` : "– (no rotation)"}
          />
          <Figure term="Verdet constant V" value={`${fmt(r.verdetRadPerTm, 4)} rad/(T·m)`} />
          <Figure
            term="Magnetic-dipole part of V"
            value={`${fmt(r.magneticVerdetRadPerTm, 4)} rad/(T·m) (share ${fmtPercent(r.magneticShare)})`}
          />
          <Figure term="dθ/dT at that length" value={`${fmt(r.dThetaDTRadPerK / DEG, 4)} °/K`} />
          <Figure term="dθ/dB at that length" value={`${fmt(r.dThetaDBRadPerT / DEG, 4)} °/T`} />
          <Figure term={`Angle error allowed for ${fmt(r.isolationTargetDb, 3)} dB`} value={`±${fmt(r.maxAngleErrorRad / DEG, 4)}°`} />
          <Figure term="Isolation at a 1° error" value={`${fmt(isolationDb(DEG), 3)} dB`} />
          <Figure term="Temperature window (isolation ≥ target)" value={windowText(r.temperatureWindowK, "K")} />
          <Figure term="Field window (isolation ≥ target)" value={windowText(r.fieldWindowT, "T")} />
        </dl>
      ) : null}
      <p className="text-xs text-ink-soft">
        Isolation of an ideal polarizer pair with a rotation error Δθ: −10·log10(sin²Δθ) dB (common practice, no source). Windows search
        0.1–1000 K and up to 10× the field; “≤”/“≥” mark a window that reaches the end of that search. dθ/dT and dθ/dB follow from M0: both
        parts scale with it.
        {scaleLabel ? ` ${scaleLabel}.` : ""}
      </p>
      <CautionsPanel
        headingLevel={3}
        title="Safety cautions for the rotator"
        cautions={cautionsFor({
          lines: [],
          minTemperatureK: r ? (parsed.data?.temperatureK ?? null) : null,
          maxFieldT: r ? Math.abs(parsed.data?.fieldT ?? 0) : null,
        })}
      />
    </section>
  );
}

const FIELD_LABEL: Record<string, string> = {
  wavelengthNm: "Wavelength",
  temperatureK: "Temperature",
  fieldT: "Field",
  targetAngleDeg: "Target angle",
  isolationTargetDb: "Isolation target",
};

function Figure({ term, value }: { term: string; value: string }) {
  return (
    <div className="flex flex-wrap justify-between gap-2 border-b border-ink/10 py-1">
      <dt className="text-ink-soft">{term}</dt>
      <dd className="font-medium tabular-nums">{value}</dd>
    </div>
  );
}
