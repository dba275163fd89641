"use client";

import Link from "next/link";
import { useQueries } from "@tanstack/react-query";
import { memo, useMemo } from "react";
import type { PlotLayer } from "@/components/plots/line-plot";
import {
  type ConditionGroup,
  conditionGroups,
  conditionKey,
  describeConversion,
  type OverlayPoint,
  toPlotUnits,
} from "@/lib/measurements/overlay";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { describeError } from "@/lib/query/fetcher";
import { measurementPointsQuery, useMeasurementSets } from "@/lib/query/measurement-sets";
import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import { fmt } from "@/lib/workbench/format";
import type { Geometry, XUnit, YMode } from "@/lib/workbench/units";
import { countOf, noun } from "@/lib/text/plural";

/*
 * Measured points with ±σ error bars on the spectrum plot: a picker of the caller's measurement
 * sets and the plot layers for the chosen ones (their unmasked points), converted to the plot's x
 * and y units (lib/measurements/overlay.ts says how). Colour tells the set, marker shape the
 * point's (T, B); points at conditions other than the curve's are hollow and the legend says so.
 */

/** Fill colours per set (Okabe–Ito family, apart from the curves' colours). */
const SET_FILLS = ["#e69f00", "#56b4e9", "#009e73", "#f0e442", "#cc79a7"] as const;
/** Marker shapes per measurement condition (T, B), so 77 K and 293 K points differ in grey too. */
const SHAPES = ["circle", "square", "diamond", "triangle", "triangle-down", "hexagon"] as const;
type Shape = (typeof SHAPES)[number];
const INK = "#1d2433";
const HOLLOW = "#ffffff";
/** At most this many sets on the plot at once: more would be unreadable. */
export const MAX_OVERLAY_SETS = SET_FILLS.length;

const fillOf = (index: number) => SET_FILLS[index % SET_FILLS.length]!;
const shapeOf = (index: number): Shape => SHAPES[index % SHAPES.length]!;

/** A point's marker: its set's colour, its condition's shape; hollow when the curve was computed at other conditions. */
function Marker({ x, y, fill, shape, hollow }: { x: number; y: number; fill: string; shape: Shape; hollow: boolean }) {
  const common = hollow
    ? { fill: HOLLOW, stroke: fill === "#f0e442" ? INK : fill, strokeWidth: 2 }
    : { fill, stroke: INK, strokeWidth: 1.2 };
  switch (shape) {
    case "square":
      return <rect x={x - 3.5} y={y - 3.5} width={7} height={7} {...common} />;
    case "diamond":
      return <path d={`M${x},${y - 4.5}L${x + 4.5},${y}L${x},${y + 4.5}L${x - 4.5},${y}Z`} {...common} />;
    case "triangle":
      return <path d={`M${x},${y - 4.5}L${x + 4.5},${y + 3.5}L${x - 4.5},${y + 3.5}Z`} {...common} />;
    case "triangle-down":
      return <path d={`M${x},${y + 4.5}L${x + 4.5},${y - 3.5}L${x - 4.5},${y - 3.5}Z`} {...common} />;
    case "hexagon":
      return (
        <path
          d={`M${x - 4},${y}L${x - 2},${y - 3.8}L${x + 2},${y - 3.8}L${x + 4},${y}L${x + 2},${y + 3.8}L${x - 2},${y + 3.8}Z`}
          {...common}
        />
      );
    default:
      return <circle cx={x} cy={y} r={3.8} {...common} />;
  }
}

function formatPoint(p: OverlayPoint, yUnit: string, matches: boolean): string {
  return (
    `line ${p.point.line}: ${fmt(p.point.wavelengthNm, 5)} nm, ` +
    `${fmt(p.y, 4)} ± ${fmt(p.sigma, 2)} ${yUnit} at ${fmt(p.point.temperatureK, 5)} K, ${fmt(p.point.fieldT, 4)} T` +
    (matches ? "" : " (not the curve's conditions)")
  );
}

// Module-level, so TanStack Query keeps the combined array stable while the data is unchanged.
const pointsOf = (results: { data?: MeasuredPoint[] }[]) => results.map((r) => r.data);

/** The unmasked points of the chosen sets and their condition groups, shared by the layers and the legend. */
function useOverlayPoints(setIds: readonly string[], curve: { temperatureK: number; fieldT: number }) {
  const stable = useQueries({ queries: setIds.map((id) => measurementPointsQuery(id)), combine: pointsOf });
  const groups = useMemo(
    () =>
      conditionGroups(
        stable.map((points) => points ?? []),
        curve,
      ),
    [stable, curve.temperatureK, curve.fieldT],
  );
  return { stable, groups };
}

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
  /** The curve's temperature: points measured at other conditions are drawn hollow. */
  curveTemperatureK: number;
}): PlotLayer[] {
  const { setIds, xUnit, yMode, yUnit, geometry, rangeNm, curveTemperatureK } = options;
  const { stable, groups } = useOverlayPoints(setIds, { temperatureK: curveTemperatureK, fieldT: geometry.fieldT });
  return useMemo(() => {
    const byKey = new Map(groups.map((g) => [g.key, g]));
    return setIds.flatMap((id, index) => {
      const points = stable[index];
      if (!points) return [];
      const shown = points.map((p) => toPlotUnits(p, { xUnit, yMode, geometry })).filter((p): p is OverlayPoint => p !== null);
      const inRange = rangeNm ? shown.filter((p) => p.point.wavelengthNm >= rangeNm[0] && p.point.wavelengthNm <= rangeNm[1]) : shown;
      const fill = fillOf(index);
      const layer: PlotLayer = {
        key: `measured-${id}`,
        yExtent: inRange.flatMap((p) => [p.y - p.sigma, p.y + p.sigma]),
        render: ({ x, y }) => (
          <g data-testid={`overlay-${id}`} aria-hidden="true">
            {shown.map((p) => {
              const group = byKey.get(conditionKey(p.point));
              const matches = group?.matchesCurve ?? false;
              const px = x(p.x);
              const lo = y(p.y - p.sigma);
              const hi = y(p.y + p.sigma);
              return (
                <g key={p.point.line} data-testid="measured-point">
                  <title>{formatPoint(p, yUnit, matches)}</title>
                  <line x1={px} x2={px} y1={lo} y2={hi} stroke={INK} strokeWidth={1} />
                  <line x1={px - 3} x2={px + 3} y1={lo} y2={lo} stroke={INK} strokeWidth={1} />
                  <line x1={px - 3} x2={px + 3} y1={hi} y2={hi} stroke={INK} strokeWidth={1} />
                  <Marker x={px} y={y(p.y)} fill={fill} shape={shapeOf(group?.shape ?? 0)} hollow={!matches} />
                </g>
              );
            })}
          </g>
        ),
      };
      return [layer];
    });
  }, [setIds, stable, groups, xUnit, yMode, yUnit, geometry, rangeNm]);
}

function Swatch({ fill, shape, hollow }: { fill: string; shape: Shape; hollow: boolean }) {
  return (
    <svg width="14" height="14" aria-hidden="true" className="shrink-0">
      <Marker x={7} y={7} fill={fill} shape={shape} hollow={hollow} />
    </svg>
  );
}

/** Which shape is which (T, B), and which of them the curve was computed at. */
function ConditionLegend({ groups }: { groups: ConditionGroup[] }) {
  if (groups.length === 0) return null;
  const others = groups.filter((g) => !g.matchesCurve);
  return (
    <div className="mt-2" data-testid="overlay-conditions">
      <p className="text-xs font-medium">Marker shape: the point&apos;s temperature and field</p>
      <ul className="mt-1 space-y-1 text-xs">
        {groups.map((g) => (
          <li key={g.key} className="flex items-center gap-2">
            <Swatch fill="#8a8f99" shape={shapeOf(g.shape)} hollow={!g.matchesCurve} />
            <span>
              {fmt(g.temperatureK, 5)} K, {fmt(g.fieldT, 4)} T · {g.count} {g.count === 1 ? "point" : "points"}
              {g.matchesCurve ? " · the curve's conditions" : " · hollow: not the curve's conditions"}
            </span>
          </li>
        ))}
      </ul>
      {others.length > 0 ? (
        <p className="mt-1 text-xs text-ember" role="note">
          {others.reduce((n, g) => n + g.count, 0)} of the points were measured at other conditions than the curve&apos;s; the curve does
          not predict them. Set the workbench&apos;s temperature and field to theirs to compare.
        </p>
      ) : null}
    </div>
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
  const { groups } = useOverlayPoints(selected, { temperatureK, fieldT: geometry.fieldT });
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
                      {index >= 0 ? (
                        <Swatch fill={fillOf(index)} shape="square" hollow={false} />
                      ) : (
                        <span className="w-3.5 shrink-0" aria-hidden="true" />
                      )}
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
              Unmasked points with ±σ error bars, coloured by set. {describeConversion({ yMode, geometry, quantities })} Points outside the
              plotted range are not drawn. The curve is at {fmt(temperatureK, 5)} K, {fmt(geometry.fieldT, 4)} T.
            </p>
          ) : null}
          {chosen.length > 0 ? <ConditionLegend groups={groups} /> : null}
        </>
      )}
    </section>
  );
});
