import type { ModelParams, SpinTraceRequest } from "@/lib/physics/schema";
import { PARAM_META, FLAG_META } from "@/lib/model/param-meta";

/*
 * Whether a spin trace (or ΔMz curve) on screen still belongs to the inputs. A result keeps the
 * inputs it came from; when the inputs move on, the panel marks it stale and says what changed,
 * as the spectrum does, until it is run again.
 */

export interface TraceInputs {
  params: ModelParams;
  wavelengthNm: number;
  /** Spin trace only. */
  intensityWPerM2?: number;
  periods?: number;
}

export function traceInputsOf(r: SpinTraceRequest): TraceInputs {
  const { wavelengthNm, intensityWPerM2, periods, ...params } = r;
  return { params, wavelengthNm, intensityWPerM2, periods };
}

function num(v: number): string {
  const r = Number(v.toPrecision(6));
  return r !== 0 && (Math.abs(r) >= 1e5 || Math.abs(r) < 1e-3) ? r.toExponential().replace("e+", "e") : String(r);
}

/**
 * What differs between the inputs a result came from and the inputs now, in words (empty: current).
 * `now` null means the inputs are invalid at the moment, which also makes the result stale.
 */
export function staleReasons(was: TraceInputs, now: TraceInputs | null): string[] {
  if (!now) return ["the inputs are incomplete or out of range"];
  const out: string[] = [];
  if (was.wavelengthNm !== now.wavelengthNm) out.push(`wavelength ${num(was.wavelengthNm)} → ${num(now.wavelengthNm)} nm`);
  if (was.intensityWPerM2 !== undefined && now.intensityWPerM2 !== undefined && was.intensityWPerM2 !== now.intensityWPerM2) {
    out.push(`intensity ${num(was.intensityWPerM2)} → ${num(now.intensityWPerM2)} W/m²`);
  }
  if (was.periods !== undefined && now.periods !== undefined && was.periods !== now.periods)
    out.push(`lock-in periods ${was.periods} → ${now.periods}`);
  const changed = PARAM_META.filter((m) => was.params[m.key] !== now.params[m.key]).map((m) => m.label);
  changed.push(...FLAG_META.filter((m) => (was.params[m.key] === true) !== (now.params[m.key] === true)).map((m) => m.label));
  if (changed.length > 0) out.push(`${changed.length === 1 ? "parameter" : "parameters"} ${changed.join(", ")}`);
  return out;
}

/** The stale caption, or null when the result belongs to the inputs on screen. */
export function staleText(what: string, was: TraceInputs, now: TraceInputs | null): string | null {
  const reasons = staleReasons(was, now);
  if (reasons.length === 0) return null;
  return (
    `Stale: this ${what} was computed at ${num(was.wavelengthNm)} nm ` +
    `with earlier inputs (changed since: ${reasons.join("; ")}). Run it again to update.`
  );
}
