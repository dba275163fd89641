"use client";

import Link from "next/link";
import { useQueries } from "@tanstack/react-query";
import { memo, useMemo } from "react";
import type { PlotLayer } from "@/components/plots/line-plot";
import { describeConversion, toPlotUnits, type OverlayPoint } from "@/lib/measurements/overlay";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { describeError } from "@/lib/query/fetcher";
import { measurementPointsQuery, useMeasurementSets } from "@/lib/query/measurement-sets";
import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import { fmt } from "@/lib/workbench/format";
import type { Geometry, XUnit, YMode } from "@/lib/workbench/units";
import { agree, countOf, noun } from "@/lib/text/plural";

/*
 * Measured points with ±σ error bars on the spectrum plot: a picker of the caller's measurement
 * sets and the plot layers for the chosen ones, converted to the plot's x and y units
 * (lib/measurements/overlay.ts says how).
 */

/** Fill colours (Okabe–Ito family, apart from the curves' colours) and marker shapes, so sets differ in grey too. */
const OVERLAY_STYLES = [
  { fill: "#e69f00", shape: "circle" },
  { fill: "#56b4e9", shape: "square" },
  { fill: "#009e73", shape: "diamond" },
  { fill: "#f0e442", shape: "triangle" },
  { fill: "#cc79a7", shape: "circle" },
] as const;
type OverlayStyle = (typeof OVERLAY_STYLES)[number];
const INK = "#1d2433";
/** At most this many sets on the plot at once: more would be unreadable. */
export const MAX_OVERLAY_SETS = OVERLAY_STYLES.length;

const styleOf = (index: number): OverlayStyle => OVERLAY_STYLES[index % OVERLAY_STYLES.length]!;

function Marker({ x, y, style }: { x: number; y: number; style: OverlayStyle }) {
  const common = { fill: style.fill, stroke: INK, strokeWidth: 1.2 };
  switch (style.shape) {
    case "square":
      return <rect x={x - 3.5} y={y - 3.5} width={7} height={7} {...common} />;
    case "diamond":
      return <path d={`M${x},${y - 4.5}L${x + 4.5},${y}L${x},${y + 4.5}L${x - 4.5},${y}Z`} {...common} />;
    case "triangle":
      return <path d={`M${x},${y - 4.5}L${x + 4.5},${y + 3.5}L${x - 4.5},${y + 3.5}Z`} {...common} />;
    default:
      return <circle cx={x} cy={y} r={3.8} {...common} />;
  }
}

function formatPoint(p: OverlayPoint, yUnit: string): string {
  return (
    `line ${p.point.line}: ${fmt(p.point.wavelengthNm, 5)} nm, ` +
    `${fmt(p.y, 4)} ± ${fmt(p.sigma, 2)} ${yUnit} at ${fmt(p.point.temperatureK, 5)} K`
  );
}

// Module-level, so TanStack Query keeps the combined array stable while the data is unchanged.
const pointsOf = (results: { data?: MeasuredPoint[] }[]) => results.map((r) => r.data);

/**
 * Plot layers for the chosen sets. Only points inside the plotted wavelength range count for the
 * y domain, so a far-away point does not squash the curves.
 */
export function useMeasurementLayers(options: {
  setIds: readonly string[];
  xUnit: XUnit;
  yMode: YMode;
  yUnit: string;
  geometry: Geometry;
  rangeNm: readonly [number, number] | null;
}): PlotLayer[] {
  const { setIds, xUnit, yMode, yUnit, geometry, rangeNm } = options;
  const stable = useQueries({ queries: setIds.map((id) => measurementPointsQuery(id)), combine: pointsOf });
  return useMemo(() => {
    return setIds.flatMap((id, index) => {
      const points = stable[index];
      if (!points) return [];
      const shown = points.map((p) => toPlotUnits(p, { xUnit, yMode, geometry })).filter((p): p is OverlayPoint => p !== null);
      const inRange = rangeNm ? shown.filter((p) => p.point.wavelengthNm >= rangeNm[0] && p.point.wavelengthNm <= rangeNm[1]) : shown;
      const style = styleOf(index);
      const layer: PlotLayer = {
        key: `measured-${id}`,
        yExtent: inRange.flatMap((p) => [p.y - p.sigma, p.y + p.sigma]),
        render: ({ x, y }) => (
          <g data-testid={`overlay-${id}`} aria-hidden="true">
            {shown.map((p) => {
              const px = x(p.x);
              const lo = y(p.y - p.sigma);
              const hi = y(p.y + p.sigma);
              return (
                <g key={p.point.line} data-testid="measured-point">
                  <title>{formatPoint(p, yUnit)}</title>
                  <line x1={px} x2={px} y1={lo} y2={hi} stroke={INK} strokeWidth={1} />
                  <line x1={px - 3} x2={px + 3} y1={lo} y2={lo} stroke={INK} strokeWidth={1} />
                  <line x1={px - 3} x2={px + 3} y1={hi} y2={hi} stroke={INK} strokeWidth={1} />
                  <Marker x={px} y={y(p.y)} style={style} />
                </g>
              );
            })}
          </g>
        ),
      };
      return [layer];
    });
  }, [setIds, stable, xUnit, yMode, yUnit, geometry, rangeNm]);
}

function Swatch({ index }: { index: number }) {
  const style = styleOf(index);
  return (
    <svg width="14" height="14" aria-hidden="true" className="shrink-0">
      <Marker x={7} y={7} style={style} />
    </svg>
  );
}

function setLabel(set: MeasurementSetSummary): string {
  const t = set.temperaturesK.map((v) => fmt(v, 5)).join(", ");
  return `${countOf(set.rowCount, noun("point"))}, ${fmt(set.wavelengthSpanNm.min, 4)}–${fmt(set.wavelengthSpanNm.max, 4)} nm, ${t} K`;
}

/**
 * The checkboxes that choose which measurement sets lie over the spectrum. Memoized: the workbench
 * re-renders on every progress step of a run, and the list need not.
 */
export const MeasurementOverlayPicker = memo(function MeasurementOverlayPicker({
  selected,
  onChange,
  yMode,
  geometry,
  temperatureK,
}: {
  selected: readonly string[];
  onChange: (ids: string[]) => void;
  yMode: YMode;
  geometry: Geometry;
  temperatureK: number;
}) {
  const sets = useMeasurementSets(undefined);
  const chosen = (sets.data ?? []).filter((s) => selected.includes(s.id));
  const quantities = new Set<MeasuredPoint["quantity"]>(chosen.map((s) => s.quantity));
  const otherTemperature = chosen.filter((s) => s.temperaturesK.some((t) => Math.abs(t - temperatureK) > 0.5));
  const toggle = (id: string, on: boolean) => onChange(on ? [...selected, id].slice(-MAX_OVERLAY_SETS) : selected.filter((s) => s !== id));

  return (
    <section aria-label="Measured data on the plot" className="rounded-lg border border-ink/10 px-4 py-3 text-sm">
      <h2 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Measured data on the plot</h2>
      {sets.isPending ? (
        <p className="mt-2 text-ink-soft" role="status">
          Loading measurement sets…
        </p>
      ) : sets.isError ? (
        <p className="mt-2 text-ember" role="alert">
          {describeError(sets.error)}
        </p>
      ) : (sets.data ?? []).length === 0 ? (
        <p className="mt-2 text-ink-soft">
          No measurement sets in your labs yet.{" "}
          <Link href="/measurement-sets" className="text-lux-dark underline underline-offset-4">
            Upload one on the Measurements page
          </Link>
          .
        </p>
      ) : (
        <>
          <fieldset className="mt-2">
            <legend className="sr-only">Measurement sets to show as points with ±σ error bars</legend>
            <ul className="space-y-1.5">
              {(sets.data ?? []).map((set) => {
                const index = selected.indexOf(set.id);
                return (
                  <li key={set.id}>
                    <label className="flex items-start gap-2">
                      <input type="checkbox" className="mt-1" checked={index >= 0} onChange={(e) => toggle(set.id, e.target.checked)} />
                      {index >= 0 ? <Swatch index={index} /> : <span className="w-3.5 shrink-0" aria-hidden="true" />}
                      <span>
                        <span className="font-medium">{set.name}</span>
                        <span className="block text-xs text-ink-soft">
                          {set.labName} · {setLabel(set)}
                        </span>
                      </span>
                    </label>
                  </li>
                );
              })}
            </ul>
          </fieldset>
          {chosen.length > 0 ? (
            <p className="mt-2 text-xs text-ink-soft" data-testid="overlay-conversion">
              Points with ±σ error bars. {describeConversion({ yMode, geometry, quantities })} Points outside the plotted range are not
              drawn.
              {otherTemperature.length > 0
                ? ` ${otherTemperature.map((s) => `“${s.name}”`).join(", ")} ${agree(otherTemperature.length, "has", "have")} ` +
                  `points at temperatures other than the curve's ${fmt(temperatureK, 5)} K.`
                : ""}
            </p>
          ) : null}
        </>
      )}
    </section>
  );
});
