"use client";

import { useEffect, useMemo, useState } from "react";
import type { SpectrumPoint } from "@/lib/physics/types";
import { normalizeMarkers } from "@/lib/workbench/derived";
import { computeAnalyticNow, type WorkbenchPool } from "@/lib/workbench/engine";
import { exactPoint, interpolatePoint } from "@/lib/workbench/markers";
import { computableMarkers } from "@/lib/workbench/validate";
import type { ComputedSpectrum } from "./use-spectrum-run";

/*
 * Values at the markers, read from the result on screen without touching its run. A marker on a
 * grid point takes that point. Otherwise the one wavelength is computed with the result's own
 * method: the analytic form on this thread (microseconds), the numerical LLG as a small job in
 * the pool (a few ms per wavelength, too long for the page's thread when there are many). Until
 * a numerical value arrives the row shows values interpolated between grid neighbours, marked.
 */

export type MarkerSource = "grid" | "computed" | "interpolated" | "unavailable";

export interface MarkerRow {
  nm: number;
  point: SpectrumPoint | null;
  source: MarkerSource;
}

interface Cache {
  key: string;
  points: ReadonlyMap<number, SpectrumPoint>;
}

export function useMarkerValues({
  shown,
  markersNm,
  pool,
}: {
  shown: ComputedSpectrum | null;
  markersNm: readonly number[];
  pool: WorkbenchPool | null;
}): {
  rows: MarkerRow[];
  computing: boolean;
} {
  const [cache, setCache] = useState<Cache | null>(null);
  const [inFlight, setInFlight] = useState<string | null>(null);
  const sorted = useMemo(() => normalizeMarkers(markersNm), [markersNm]);

  // Markers the grid does not hold and the model can compute (not below the Sellmeier pole, …).
  const missing = useMemo(() => {
    if (!shown) return [];
    const computable = new Set(computableMarkers(shown.params, sorted));
    return sorted.filter((nm) => computable.has(nm) && !exactPoint(shown.result.points, nm));
  }, [shown, sorted]);

  // Analytic results: compute the missing wavelengths right here.
  const analytic = useMemo<ReadonlyMap<number, SpectrumPoint>>(() => {
    if (shown?.method !== "analytic" || missing.length === 0) return new Map();
    try {
      const r = computeAnalyticNow({ ...shown.params, wavelengthsNm: missing, method: "analytic" });
      return new Map(r.points.map((p) => [p.wavelengthNm, p]));
    } catch {
      return new Map();
    }
  }, [shown, missing]);

  // Numerical results: one small pool job for the wavelengths not yet computed for this result.
  const pendingNm = useMemo(() => {
    if (shown?.method !== "llg") return [];
    const have = cache && cache.key === shown.key ? cache.points : null;
    return missing.filter((nm) => !have?.has(nm));
  }, [shown, missing, cache]);
  const jobKey = shown && pendingNm.length > 0 ? `${shown.key}|${pendingNm.join(",")}` : null;

  useEffect(() => {
    if (!shown || !pool || !jobKey || pendingNm.length === 0) return;
    let live = true;
    setInFlight(jobKey);
    // No abort signal: the pool's cancel reaches every job on a worker, and must never stop the
    // spectrum run. A result that arrives for an older spectrum is simply not used.
    pool.spectrum({ ...shown.params, wavelengthsNm: pendingNm, method: "llg" }).then(
      (r) => {
        setCache((old) => {
          const base = old && old.key === shown.key ? old.points : new Map<number, SpectrumPoint>();
          const next = new Map(base);
          for (const p of r.points) next.set(p.wavelengthNm, p);
          return { key: shown.key, points: next };
        });
        if (live) setInFlight(null);
      },
      () => {
        // Cancelled with a superseded run, or failed: the interpolated values stay, marked.
        if (live) setInFlight(null);
      },
    );
    return () => {
      live = false;
    };
    // jobKey stands for shown.key and pendingNm.
  }, [jobKey, pool]);

  const rows = useMemo<MarkerRow[]>(() => {
    if (!shown) return sorted.map((nm) => ({ nm, point: null, source: "unavailable" }));
    const llg = cache && cache.key === shown.key ? cache.points : null;
    return sorted.map((nm): MarkerRow => {
      const onGrid = exactPoint(shown.result.points, nm);
      if (onGrid) return { nm, point: onGrid, source: "grid" };
      const computed = analytic.get(nm) ?? llg?.get(nm);
      if (computed) return { nm, point: computed, source: "computed" };
      const between = interpolatePoint(shown.result.points, nm);
      return between ? { nm, point: between, source: "interpolated" } : { nm, point: null, source: "unavailable" };
    });
  }, [shown, sorted, analytic, cache]);

  return { rows, computing: inFlight !== null && inFlight === jobKey };
}
