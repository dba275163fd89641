import type { LabRunDetail } from "@/lib/contracts/lab-runs";
import { MAX_WAVELENGTHS } from "@/lib/physics/schema";
import type { WavelengthRange } from "@/lib/workbench/view-state";

/*
 * "Open in the workbench" from a lab run: the workbench starts from the run's own parameters (what
 * was computed, what-if edits included) and its wavelength axis, so its curves are the run's
 * computation again, by the same engine code, in the browser.
 */

export interface WorkbenchStart {
  /** The run's parameters, to be parsed by the model's schema like any stored set. */
  params: unknown;
  range: WavelengthRange;
  /** Set when the workbench shows fewer wavelengths than the run computed. */
  thinned: string | null;
}

export function workbenchStartFromRun(run: Pick<LabRunDetail, "payload">): WorkbenchStart | null {
  const p = run.payload as { params?: unknown; wavelengths?: { fromNm: number; toNm: number; count: number; spacing?: string } };
  const w = p.wavelengths;
  if (!p.params || !w || !(w.toNm > w.fromNm)) return null;
  const points = Math.min(MAX_WAVELENGTHS, Math.max(2, w.count));
  return {
    params: p.params,
    range: { fromNm: w.fromNm, toNm: w.toNm, points, spacing: w.spacing === "linear" ? "linear" : "log" },
    thinned:
      w.count > MAX_WAVELENGTHS
        ? `The run computed ${w.count} wavelengths; the workbench draws ${MAX_WAVELENGTHS} over the same range.`
        : null,
  };
}

/** Where a run opens: its set's workbench, or the scratch workbench for parameters given with the run. */
export function workbenchHrefOfRun(run: Pick<LabRunDetail, "id" | "parameterSet">): string {
  const setId = run.parameterSet?.id;
  return `${setId ? `/workbench/${encodeURIComponent(setId)}` : "/workbench"}?run=${encodeURIComponent(run.id)}`;
}
