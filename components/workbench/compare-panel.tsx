"use client";

import { useQueries, useQuery } from "@tanstack/react-query";
import { useEffect, useMemo, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { DateTime } from "@/components/ui/date-time";
import { LinePlot, type PlotSeries } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { modelParamsSchema, type ModelParams, type SpectrumRequest } from "@/lib/physics/schema";
import type { SpectrumResult } from "@/lib/physics/types";
import { describeError } from "@/lib/query/fetcher";
import { parameterSetQuery, parameterSetVersionsQuery, useParameterSets, useParameterSetVersions } from "@/lib/query/parameter-sets";
import { normalizeMarkers } from "@/lib/workbench/derived";
import { isAbortError, type WorkbenchPool } from "@/lib/workbench/engine";
import {
  compareAxisTitle,
  compareHeader,
  compareOptionLabel,
  compareValue,
  COMPARE_QUANTITIES,
  isVerdetQuantity,
  type CompareQuantity,
} from "@/lib/workbench/compare";
import { fmt, fmtDelta, fmtDifference, fmtPercent, magneticScaleLabel } from "@/lib/workbench/format";
import { COMPARE_COLORS, COMPARE_DASHES } from "@/lib/workbench/palette";
import { fromNm, wavelengthGrid, X_AXIS_TITLE } from "@/lib/workbench/units";
import { checkedSpectrumRequest, computableMarkers } from "@/lib/workbench/validate";
import type { ViewState, WavelengthRange } from "@/lib/workbench/view-state";

/*
 * Overlay of the Verdet constant (or one of its parts, or a raw rotation) of several parameter
 * sets, or of versions of this set, on the same axes, with a table of differences at the markers. Analytic method (the overlay is about
 * differences between parameter sets, far larger than the 1e-5 LLG–Polder deviation).
 * Selections are stored in the view state as "set:<id>" or "version:<n>".
 */

const MAX_COMPARE = 5;
const COMPARE_POINTS = 256;

/** A legend and table label that carries the magneticScale label of physics-model §4.3 when it applies. */
function entryLabel(label: string, params: ModelParams): string {
  const scale = magneticScaleLabel(params.magneticScale);
  // Temperature and field tell apart versions that differ only in them, in the legend and in exports.
  const conditions = `${fmt(params.temperatureK, 5)} K, ${fmt(params.fieldT, 4)} T`;
  return scale ? `${label} (${conditions}; ${scale})` : `${label} (${conditions})`;
}

interface Entry {
  key: string;
  label: string;
  params: ModelParams;
}

interface Computed {
  entry: Entry;
  grid: SpectrumResult;
  markers: SpectrumResult | null;
}

export function ComparePanel({
  pool,
  current,
  setId,
  range,
  view,
  onView,
  fileBase,
}: {
  pool: WorkbenchPool | null;
  current: { label: string; params: ModelParams } | null;
  setId: string | null;
  range: WavelengthRange | null;
  view: ViewState;
  onView: (patch: Partial<ViewState>) => void;
  fileBase: string;
}) {
  const sets = useParameterSets({});
  const selected = view.compareSetIds;
  const setIds = selected.filter((k) => k.startsWith("set:")).map((k) => k.slice(4));
  const setQueries = useQueries({ queries: setIds.map((id) => parameterSetQuery(id)) });

  const toggle = (key: string, on: boolean) => {
    const next = on ? [...selected, key].slice(0, MAX_COMPARE) : selected.filter((k) => k !== key);
    onView({ compareSetIds: next });
  };

  return (
    <div className="space-y-4">
      <label className="flex flex-col gap-1 text-sm">
        <span className="text-xs font-medium text-ink-soft">Compare</span>
        <select
          className="max-w-full rounded-md border border-ink/25 bg-paper-raised px-2 py-1 text-sm focus:border-lux sm:w-fit"
          value={view.compareQuantity}
          onChange={(e) => onView({ compareQuantity: COMPARE_QUANTITIES.find((q) => q === e.target.value) ?? view.compareQuantity })}
        >
          {COMPARE_QUANTITIES.map((q) => (
            <option key={q} value={q}>
              {compareOptionLabel(q, view.yMode)}
            </option>
          ))}
        </select>
      </label>
      <div className="grid gap-4 md:grid-cols-2">
        <fieldset className="space-y-1 text-sm">
          <legend className="mb-1 font-medium">Parameter sets</legend>
          {sets.isPending ? <p className="text-ink-soft">Loading sets…</p> : null}
          {sets.isError ? <p className="text-ember">{describeError(sets.error)}</p> : null}
          {sets.data?.filter((s) => s.id !== setId).length === 0 ? (
            <p className="text-ink-soft">No other parameter sets in your labs.</p>
          ) : null}
          <div className="max-h-48 space-y-1 overflow-y-auto">
            {sets.data
              ?.filter((s) => s.id !== setId)
              .map((s) => (
                <label key={s.id} className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    checked={selected.includes(`set:${s.id}`)}
                    disabled={!selected.includes(`set:${s.id}`) && selected.length >= MAX_COMPARE}
                    onChange={(e) => toggle(`set:${s.id}`, e.target.checked)}
                  />
                  {s.name}{" "}
                  <span className="text-xs text-ink-soft">
                    ({s.labName}, v{s.version})
                  </span>
                </label>
              ))}
          </div>
        </fieldset>
        {setId ? <VersionPicker setId={setId} selected={selected} onToggle={toggle} /> : null}
      </div>
      <CompareResults
        pool={pool}
        current={current}
        selected={selected}
        setEntries={setQueries.flatMap((q) => {
          if (!q.data) return [];
          const parsed = modelParamsSchema.safeParse(q.data.params);
          return parsed.success
            ? [{ key: `set:${q.data.id}`, label: entryLabel(`${q.data.name} v${q.data.version}`, parsed.data), params: parsed.data }]
            : [];
        })}
        setId={setId}
        setName={(sets.data ?? []).find((s) => s.id === setId)?.name ?? null}
        range={range}
        view={view}
        fileBase={fileBase}
        loading={setQueries.some((q) => q.isPending)}
      />
    </div>
  );
}

function VersionPicker({
  setId,
  selected,
  onToggle,
}: {
  setId: string;
  selected: readonly string[];
  onToggle: (key: string, on: boolean) => void;
}) {
  const versions = useParameterSetVersions(setId);
  return (
    <fieldset className="space-y-1 text-sm">
      <legend className="mb-1 font-medium">Versions of this set</legend>
      {versions.isPending ? <p className="text-ink-soft">Loading versions…</p> : null}
      {versions.isError ? <p className="text-ember">{describeError(versions.error)}</p> : null}
      <div className="max-h-48 space-y-1 overflow-y-auto">
        {versions.data?.map((v) => (
          <label key={v.version} className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={selected.includes(`version:${v.version}`)}
              disabled={!selected.includes(`version:${v.version}`) && selected.length >= MAX_COMPARE}
              onChange={(e) => onToggle(`version:${v.version}`, e.target.checked)}
            />
            Version {v.version}{" "}
            <span className="text-xs text-ink-soft">
              (<DateTime iso={v.createdAt} />, {v.createdBy.name})
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function CompareResults({
  pool,
  current,
  selected,
  setEntries,
  setId,
  setName,
  range,
  view,
  fileBase,
  loading,
}: {
  pool: WorkbenchPool | null;
  current: { label: string; params: ModelParams } | null;
  selected: readonly string[];
  setEntries: Entry[];
  setId: string | null;
  /** This set's name, so its versions read "TGG v2", not a bare "Version 2". */
  setName: string | null;
  range: WavelengthRange | null;
  view: ViewState;
  fileBase: string;
  loading: boolean;
}) {
  // Shares the cache entry of the VersionPicker's query; disabled in scratch mode.
  const versions = useQuery({ ...parameterSetVersionsQuery(setId ?? ""), enabled: setId !== null });
  const versionEntries: Entry[] = setId
    ? (versions.data ?? []).flatMap((v) => {
        if (!selected.includes(`version:${v.version}`)) return [];
        const parsed = modelParamsSchema.safeParse(v.params);
        return parsed.success
          ? [{ key: `version:${v.version}`, label: entryLabel(`${setName ?? "This set"} v${v.version}`, parsed.data), params: parsed.data }]
          : [];
      })
    : [];
  const entries: Entry[] = [
    ...(current ? [{ key: "current", label: entryLabel(current.label, current.params), params: current.params }] : []),
    ...setEntries,
    ...versionEntries,
  ];
  const entriesKey = JSON.stringify(entries.map((e) => [e.key, e.params]));

  const [computed, setComputed] = useState<Computed[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const svg = useRef<SVGSVGElement>(null);

  useEffect(() => {
    if (!pool || !range || entries.length < 2) return;
    const ac = new AbortController();
    const grid = wavelengthGrid(range.fromNm, range.toNm, Math.min(range.points, COMPARE_POINTS), range.spacing);
    setBusy(true);
    setError(null);
    Promise.all(
      entries.map(async (entry) => {
        const markersNm = normalizeMarkers(computableMarkers(entry.params, view.markersNm));
        let gridRequest: SpectrumRequest;
        let markerRequest: SpectrumRequest | null;
        try {
          // Another set may not reach down to this range (Sellmeier pole): say so instead of sending it.
          gridRequest = checkedSpectrumRequest({ ...entry.params, wavelengthsNm: grid, method: "analytic" });
          markerRequest =
            markersNm.length > 0 ? checkedSpectrumRequest({ ...entry.params, wavelengthsNm: markersNm, method: "analytic" }) : null;
        } catch (e) {
          throw new Error(`${entry.label}: ${e instanceof Error ? e.message : String(e)}`);
        }
        const [g, m] = await Promise.all([
          pool.spectrum(gridRequest, { signal: ac.signal }),
          markerRequest ? pool.spectrum(markerRequest, { signal: ac.signal }) : Promise.resolve(null),
        ]);
        return { entry, grid: g, markers: m };
      }),
    ).then(
      (res) => {
        setComputed(res);
        setBusy(false);
      },
      (e: unknown) => {
        if (isAbortError(e)) return;
        setBusy(false);
        setError(e instanceof Error ? e.message : String(e));
      },
    );
    return () => ac.abort();
    // entriesKey stands for `entries`, which is rebuilt on every render.
  }, [pool, range, entriesKey, view.markersNm]);

  const { xUnit, xScale, yMode } = view;
  const quantity: CompareQuantity = view.compareQuantity;
  const series = useMemo<PlotSeries[]>(
    () =>
      computed.map((c, i) => ({
        key: c.entry.key,
        label: c.entry.label,
        color: COMPARE_COLORS[i % COMPARE_COLORS.length]!,
        dash: COMPARE_DASHES[i % COMPARE_DASHES.length],
        width: i === 0 ? 2.4 : 2,
        values: c.grid.points.map((p) =>
          compareValue(quantity, p, { fieldT: c.entry.params.fieldT, lengthM: c.entry.params.lengthM }, yMode),
        ),
      })),
    [computed, quantity, yMode],
  );
  const xs = useMemo(() => (computed[0]?.grid.points ?? []).map((p) => fromNm(p.wavelengthNm, xUnit)), [computed, xUnit]);

  if (entries.length < 2) {
    return (
      <p className="text-sm text-ink-soft">
        {loading ? "Loading the chosen sets…" : "Choose at least one set or version to compare with this view."}
      </p>
    );
  }
  const base = computed[0];
  return (
    <div ref={wrapRef} className="space-y-3">
      {error ? (
        <Alert tone="warning" title="Comparison failed">
          {error}
        </Alert>
      ) : null}
      {busy ? (
        <p role="status" className="text-xs text-ink-soft">
          Computing the comparison in a worker…
        </p>
      ) : null}
      {computed.length >= 2 ? (
        <>
          <LinePlot
            title={`${compareAxisTitle(quantity, yMode)}, compared (analytic)`}
            width={width}
            height={320}
            svgRef={svg}
            series={{ xs, curves: series }}
            axes={{ x: { type: xScale, label: X_AXIS_TITLE[xUnit] }, y: { label: compareAxisTitle(quantity, yMode) } }}
          />
          <PlotExportButtons svgRef={svg} fileBase={`${fileBase}-compare`} plotName="comparison plot" />
          <div className="relative overflow-x-auto">
            <table className="w-full text-sm tabular-nums">
              <caption className="pb-1 text-left font-semibold">Differences at markers (against “{base?.entry.label}”)</caption>
              <thead className="text-left text-xs text-ink-soft">
                <tr className="border-b border-ink/10">
                  <th scope="col" className="px-2 py-1 font-medium">
                    Wavelength
                  </th>
                  <th scope="col" className="px-2 py-1 font-medium">
                    Set
                  </th>
                  <th scope="col" className="px-2 py-1 font-medium">
                    {compareHeader(quantity, yMode)}
                  </th>
                  <th scope="col" className="px-2 py-1 font-medium">
                    Δ{compareHeader(quantity, yMode).split(" ")[0]}
                  </th>
                  {isVerdetQuantity(quantity) ? null : (
                    <th scope="col" className="px-2 py-1 font-medium">
                      V (rad/(T·m))
                    </th>
                  )}
                  <th scope="col" className="px-2 py-1 font-medium">
                    Magnetic share
                  </th>
                  <th scope="col" className="px-2 py-1 font-medium">
                    Δ share
                  </th>
                </tr>
              </thead>
              <tbody>
                {normalizeMarkers(view.markersNm).flatMap((nm) =>
                  computed.map((c, i) => {
                    const p = c.markers?.points.find((q) => q.wavelengthNm === nm);
                    const b = base?.markers?.points.find((q) => q.wavelengthNm === nm);
                    const qv = p
                      ? compareValue(quantity, p, { fieldT: c.entry.params.fieldT, lengthM: c.entry.params.lengthM }, yMode)
                      : null;
                    const qb =
                      b && base
                        ? compareValue(quantity, b, { fieldT: base.entry.params.fieldT, lengthM: base.entry.params.lengthM }, yMode)
                        : null;
                    const dQ = qv !== null && qb !== null ? qv - qb : null;
                    const dS = p?.magneticShare != null && b?.magneticShare != null ? p.magneticShare - b.magneticShare : null;
                    return (
                      <tr key={`${nm}-${c.entry.key}`} className={i === 0 ? "border-t border-ink/10" : ""}>
                        {i === 0 ? (
                          <th
                            scope="rowgroup"
                            rowSpan={computed.length}
                            className="px-2 py-1 text-left align-top font-medium"
                          >{`${nm} nm`}</th>
                        ) : null}
                        <td className="px-2 py-1">{c.entry.label}</td>
                        <td className="px-2 py-1">{fmt(qv)}</td>
                        <td className="px-2 py-1 whitespace-nowrap">{i === 0 ? "—" : fmtDifference(dQ, qb)}</td>
                        {isVerdetQuantity(quantity) ? null : <td className="px-2 py-1">{fmt(p?.verdetRadPerTm)}</td>}
                        <td className="px-2 py-1">{fmtPercent(p?.magneticShare, 2)}</td>
                        <td className="px-2 py-1">{i === 0 ? "—" : dS === null ? "–" : `${fmtDelta(dS * 100, 2)} pp`}</td>
                      </tr>
                    );
                  }),
                )}
              </tbody>
            </table>
          </div>
        </>
      ) : null}
    </div>
  );
}
