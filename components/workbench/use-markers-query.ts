"use client";

import { useEffect } from "react";
import { MARKERS_QUERY_KEY, parseMarkersQuery } from "@/lib/planner/markers-query";
import { normalizeMarkers } from "@/lib/workbench/derived";
import { MAX_MARKERS, type ViewState } from "@/lib/workbench/view-state";

/**
 * Adds the wavelengths of `?markers=` (a plan opened from the planner) to the view's markers once,
 * on load; markers already there stay.
 */
export function useMarkersFromQuery(setViewState: (update: (v: ViewState) => ViewState) => void): void {
  useEffect(() => {
    const extra = parseMarkersQuery(new URLSearchParams(window.location.search).get(MARKERS_QUERY_KEY), MAX_MARKERS);
    if (extra.length === 0) return;
    setViewState((v) => ({ ...v, markersNm: normalizeMarkers([...extra, ...v.markersNm]).slice(0, MAX_MARKERS) }));
  }, [setViewState]);
}
