"use client";

import Link from "next/link";
import { useCallback, useEffect, useMemo, useState, type ReactNode } from "react";
import type { ModelParamKey, ModelParams } from "@/lib/physics/schema";
import { createPool, type WorkbenchPool } from "@/lib/workbench/engine";
import { magneticScaleLabel } from "@/lib/workbench/format";
import { figureCaption, figureFileBase } from "@/lib/workbench/export";
import {
  buildRequest,
  draftsFromParams,
  draftsFromRange,
  paramsDiffer,
  validateParams,
  validateRange,
  type ParamDrafts,
  type RangeDrafts,
} from "@/lib/workbench/validate";
import { normalizeMarkers } from "@/lib/workbench/derived";
import { checkMarkerNm } from "@/lib/workbench/markers";
import { DEFAULT_MARKERS_NM, MAX_MARKERS, type PanelKey, type ViewState } from "@/lib/workbench/view-state";
import { ExportBar } from "./export-bar";
import { MarkerTable } from "./marker-table";
import { MeasurementOverlayPicker } from "./measurement-overlay";
import { ParameterPanel } from "./parameter-panel";
import { RangeControls } from "./range-controls";
import { RunStatusBar } from "./run-status";
import { SaveAsNew } from "./save-as-new";
import { SpectrumPanels } from "./spectrum-panels";
import { SpinTracePanel } from "./spin-trace-panel";
import { MapsPanel } from "./maps-panel";
import { ComparePanel } from "./compare-panel";
import { AbsorptionPanel, OpaqueNote } from "./absorption-panel";
import { ModelLimits } from "./model-limits";
import { FitPanel } from "./fit-panel";
import { LabRunPanel } from "@/components/lab-runs/lab-run-panel";
import { useSpectrumRun } from "./use-spectrum-run";
import { useMarkerValues } from "./use-marker-values";
import { useViewState, type ViewSource } from "./use-view-state";
import { ViewControls } from "./view-controls";
import { InputsDrawer } from "./inputs-drawer";
import { useMarkersFromQuery } from "./use-markers-query";
import type { LabRole } from "@/lib/contracts/roles";

export interface WorkbenchSetInfo {
  id: string;
  name: string;
  version: number;
  labName: string;
  role: LabRole;
}

export interface WorkbenchProps {
  set: WorkbenchSetInfo | null;
  initialParams: ModelParams;
  view: ViewSource;
  /** Opened through a read-only share link: no lab, no saving, nothing beyond this one set. */
  shared?: boolean;
}

const PANEL_LABEL: Record<PanelKey, string> = {
  share: "Magnetic share",
  spinTrace: "Spin trace",
  maps: "Maps",
  compare: "Compare",
};

export function Workbench({ set, initialParams, view, shared = false }: WorkbenchProps) {
  // Two pools live as long as the page: the main one starts with the first numerical run; the side
  // pool serves maps, compare and the spin trace, so that cancelling the main run never cancels
  // them (see createPool). The side pool is warmed up once (below, after the first run), so the
  // first map runs at the engine's warm speed (a cold worker spent ~0.6 s compiling on the first
  // 64 × 32 map).
  const [pools, setPools] = useState<{ main: WorkbenchPool; side: WorkbenchPool } | null>(null);
  useEffect(() => {
    const next = { main: createPool(), side: createPool() };
    setPools(next);
    return () => {
      next.main.dispose();
      next.side.dispose();
    };
  }, []);
  const pool = pools?.main ?? null;
  const sidePool = pools?.side ?? null;

  const views = useViewState({ setId: set?.id ?? null, source: view, persist: !shared });
  const { viewState, setViewState } = views;
  const onView = useCallback((patch: Partial<ViewState>) => setViewState((v) => ({ ...v, ...patch })), [setViewState]);
  useMarkersFromQuery(setViewState);

  const [drafts, setDrafts] = useState<ParamDrafts>(() => draftsFromParams(initialParams));
  const [rangeDrafts, setRangeDrafts] = useState<RangeDrafts>(() => draftsFromRange(viewState.range));
  // A reset replaces the whole view: re-seed the range inputs from it (state adjusted during render).
  const [viewEpoch, setViewEpoch] = useState(views.epoch);
  if (viewEpoch !== views.epoch) {
    setViewEpoch(views.epoch);
    setRangeDrafts(draftsFromRange(viewState.range));
  }

  const onParam = useCallback((key: ModelParamKey, text: string) => setDrafts((d) => ({ ...d, [key]: text })), []);
  const { params, errors } = useMemo(() => validateParams(drafts), [drafts]);
  const { range, errors: rangeErrors } = useMemo(() => validateRange(rangeDrafts), [rangeDrafts]);

  const onRange = useCallback(
    (next: RangeDrafts) => {
      setRangeDrafts(next);
      const checked = validateRange(next);
      if (checked.range) onView({ range: checked.range });
    },
    [onView],
  );

  // A stable request object per distinct input, so memoized children and the run hook see changes only when something changed.
  const built = useMemo(
    () => (params && range ? buildRequest(params, range, "llg") : { request: null, rangeError: null }),
    [params, range],
  );
  const run = useSpectrumRun({ request: built.request, pool });
  // Warmed after the first numerical run rather than beside it: on two cores the warm-up competed
  // with that run and delayed the first result by about half a second.
  const firstRunOver = run.status !== "idle" && run.status !== "running";
  useEffect(() => {
    if (sidePool && firstRunOver) void sidePool.warmUp();
  }, [sidePool, firstRunOver]);
  const markerValues = useMarkerValues({ shown: run.shown, markersNm: viewState.markersNm, pool });
  const markerPoints = useMemo(() => markerValues.rows.flatMap((r) => (r.point ? [r.point] : [])), [markerValues.rows]);

  // Labels, unit conversions and exports describe the result on screen, which may be older than
  // the inputs (typing, invalid input, failed run); physics-model §4.3 needs the label of that result.
  const shownParams = run.shown?.params ?? params ?? initialParams;
  const geometry = useMemo(() => ({ fieldT: shownParams.fieldT, lengthM: shownParams.lengthM }), [shownParams.fieldT, shownParams.lengthM]);
  const scaleLabel = magneticScaleLabel(shownParams.magneticScale);
  const setName = set?.name ?? "Scratch (terbium garnet defaults)";
  const figureId = useMemo(
    () => ({
      setName,
      version: set?.version ?? null,
      temperatureK: shownParams.temperatureK,
      fieldT: shownParams.fieldT,
      edited: set !== null && paramsDiffer(shownParams, initialParams),
    }),
    [setName, set, shownParams, initialParams],
  );
  const fileBase = figureFileBase(figureId);
  const methodLabel = run.shown?.method === "llg" ? "numerical LLG" : "analytic";
  const invalid = params === null || range === null || built.request === null;
  const limitQuery = useMemo(
    () =>
      run.shown
        ? {
            params: run.shown.params,
            temperaturesK: [run.shown.params.temperatureK],
            fieldsT: [run.shown.params.fieldT],
            wavelengthsNm: run.shown.result.points.map((p) => p.wavelengthNm),
          }
        : null,
    [run.shown],
  );

  const addMarker = useCallback(
    (nm: number) =>
      setViewState((v) =>
        checkMarkerNm(nm, v.markersNm, MAX_MARKERS).error !== null ? v : { ...v, markersNm: normalizeMarkers([...v.markersNm, nm]) },
      ),
    [setViewState],
  );
  const removeMarker = useCallback(
    (nm: number) => setViewState((v) => ({ ...v, markersNm: v.markersNm.filter((m) => m !== nm) })),
    [setViewState],
  );
  const resetMarkers = useCallback(() => setViewState((v) => ({ ...v, markersNm: [...DEFAULT_MARKERS_NM] })), [setViewState]);
  const [overlayIds, setOverlayIds] = useState<string[]>([]);
  const togglePanel = (k: PanelKey, on: boolean) => setViewState((v) => ({ ...v, panels: { ...v.panels, [k]: on } }));

  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-3 border-b border-ink/10 pb-4">
        <div className="min-w-0">
          <p className="text-xs font-medium tracking-wide text-ink-soft uppercase">Workbench</p>
          <h1 className="text-2xl font-semibold tracking-tight">{set ? set.name : "Scratch workbench"}</h1>
          <p className="mt-1 text-sm text-ink-soft">
            {set && shared ? (
              `Shared read-only · version ${set.version}`
            ) : set ? (
              <>
                {set.labName} · version {set.version} · your role: {set.role} ·{" "}
                <Link className="text-lux-dark underline underline-offset-4" href={`/parameter-sets/${encodeURIComponent(set.id)}`}>
                  open the set
                </Link>
              </>
            ) : (
              "Starts from the terbium gallium garnet reference values. Nothing here is stored until you save it as a set."
            )}
          </p>
          {set ? <p className="mt-1 text-xs text-ink-soft">Parameter edits here are what-ifs and do not change the stored set.</p> : null}
          {shared ? null : (
            <ViewControls
              status={views.saveStatus}
              error={views.saveError}
              scratch={!set}
              canShare={set !== null && set.role !== "viewer"}
              resetting={views.resetting}
              sharing={views.sharing}
              onReset={views.resetView}
              onShare={views.shareView}
            />
          )}
        </div>
        {!shared && set?.role !== "viewer" ? (
          <SaveAsNew params={params} defaultName={set ? `${set.name} (what-if)` : "Workbench scratch"} />
        ) : null}
      </header>

      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <InputsDrawer problems={invalid}>
          <RangeControls drafts={rangeDrafts} errors={rangeErrors} requestError={built.rangeError} onChange={onRange} />
          <ParameterPanel drafts={drafts} errors={errors} onChange={onParam} />
        </InputsDrawer>

        <div className="min-w-0 space-y-6">
          <RunStatusBar
            status={run.status}
            progress={run.progress}
            error={run.error}
            shown={run.shown}
            pending={run.pending}
            invalid={invalid}
            scaleLabel={scaleLabel}
            onCancel={run.cancel}
            onRerun={run.rerun}
          />

          {run.shown ? (
            <>
              <SpectrumPanels
                points={run.shown.result.points}
                geometry={geometry}
                view={viewState}
                onView={onView}
                onAddMarker={addMarker}
                banner={scaleLabel}
                fileBase={fileBase}
                caption={figureCaption(figureId)}
                methodLabel={methodLabel}
                overlaySetIds={overlayIds}
                curveTemperatureK={shownParams.temperatureK}
              />
              <OpaqueNote points={run.shown.result.points} lengthM={geometry.lengthM} />
              <ModelLimits query={limitQuery} where="this spectrum" />
              {shared ? null : (
                <MeasurementOverlayPicker
                  selected={overlayIds}
                  onChange={setOverlayIds}
                  yMode={viewState.yMode}
                  geometry={geometry}
                  temperatureK={shownParams.temperatureK}
                />
              )}
              <MarkerTable
                rows={markerValues.rows}
                computing={markerValues.computing}
                geometry={geometry}
                xUnit={viewState.xUnit}
                yMode={viewState.yMode}
                methodLabel={methodLabel}
                banner={scaleLabel}
                onAdd={addMarker}
                onRemove={removeMarker}
                onReset={resetMarkers}
              />
              <ExportBar
                shown={run.shown}
                setName={setName}
                setId={set?.id ?? null}
                version={set?.version ?? null}
                fileBase={fileBase}
                display={viewState}
              />
              <PanelFrame title="Absorption and transmission">
                <AbsorptionPanel
                  points={run.shown.result.points}
                  markerPoints={markerPoints}
                  lengthM={geometry.lengthM}
                  xUnit={viewState.xUnit}
                  xScale={viewState.xScale}
                  banner={scaleLabel}
                  fileBase={fileBase}
                />
              </PanelFrame>
            </>
          ) : (
            <EmptyResult invalid={invalid} />
          )}

          <fieldset className="flex flex-wrap gap-4 rounded-lg border border-ink/10 px-4 py-3 text-sm">
            <legend className="px-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Panels</legend>
            {(Object.keys(PANEL_LABEL) as PanelKey[])
              .filter((k) => !(shared && k === "compare"))
              .map((k) => (
                <label key={k} className="flex items-center gap-1.5">
                  <input type="checkbox" checked={viewState.panels[k]} onChange={(e) => togglePanel(k, e.target.checked)} />
                  {PANEL_LABEL[k]}
                </label>
              ))}
          </fieldset>

          {viewState.panels.spinTrace ? (
            <PanelFrame title="Spin trace">
              <SpinTracePanel
                pool={sidePool}
                params={params}
                view={viewState.spinTrace}
                onView={(spinTrace: ViewState["spinTrace"]) => onView({ spinTrace })}
                fileBase={fileBase}
              />
            </PanelFrame>
          ) : null}
          {viewState.panels.maps ? (
            <PanelFrame title="Maps over wavelength × temperature and field">
              <MapsPanel pool={sidePool} params={params} range={range} fileBase={fileBase} />
            </PanelFrame>
          ) : null}
          {viewState.panels.compare && !shared ? (
            <PanelFrame title="Compare parameter sets">
              <ComparePanel
                pool={sidePool}
                current={params ? { label: set ? `${set.name} (this view)` : "Scratch", params } : null}
                setId={set?.id ?? null}
                range={range}
                view={viewState}
                onView={onView}
                fileBase={fileBase}
              />
            </PanelFrame>
          ) : null}
          {set && !shared ? (
            <PanelFrame title="Fit to measurements">
              <FitPanel setId={set.id} params={params} pool={sidePool} />
            </PanelFrame>
          ) : null}
          {set && !shared ? <LabRunPanel setId={set.id} params={params} range={range} /> : null}
        </div>
      </div>
    </div>
  );
}

function PanelFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-3 rounded-lg border border-ink/10 bg-paper-raised p-4">
      <h2 className="text-lg font-semibold">{title}</h2>
      {children}
    </section>
  );
}

function EmptyResult({ invalid }: { invalid: boolean }) {
  return (
    <div role="status" className="rounded-lg border border-dashed border-ink/20 px-6 py-10 text-center text-sm text-ink-soft">
      {invalid
        ? "Fix the flagged inputs (beside the plots, or under Inputs on a narrow screen) to compute a spectrum."
        : "Computing the first spectrum…"}
    </div>
  );
}
