"use client";

import Link from "next/link";
import { useCallback, useEffect, useMemo, useState, type ReactNode } from "react";
import type { ModelParamKey, ModelParams } from "@/lib/physics/schema";
import { createPool, type WorkbenchPool } from "@/lib/workbench/engine";
import { magneticScaleLabel } from "@/lib/workbench/format";
import { exportFileName } from "@/lib/workbench/export";
import {
  buildRequest,
  computableMarkers,
  draftsFromParams,
  draftsFromRange,
  validateParams,
  validateRange,
  type ParamDrafts,
  type RangeDrafts,
} from "@/lib/workbench/validate";
import { normalizeMarkers } from "@/lib/workbench/derived";
import { DEFAULT_MARKERS_NM, MAX_MARKERS, type PanelKey, type ViewState } from "@/lib/workbench/view-state";
import { ExportBar } from "./export-bar";
import { MarkerTable } from "./marker-table";
import { ParameterPanel } from "./parameter-panel";
import { RangeControls } from "./range-controls";
import { RunStatusBar } from "./run-status";
import { SaveAsNew } from "./save-as-new";
import { SpectrumPanels } from "./spectrum-panels";
import { SpinTracePanel } from "./spin-trace-panel";
import { MapsPanel } from "./maps-panel";
import { ComparePanel } from "./compare-panel";
import { LabRunPanel } from "@/components/runs/lab-run-panel";
import { useSpectrumRun } from "./use-spectrum-run";
import { useViewState, type ViewSaveStatus } from "./use-view-state";

export interface WorkbenchSetInfo {
  id: string;
  name: string;
  version: number;
  labName: string;
  role: "owner" | "editor" | "viewer";
}

export interface WorkbenchProps {
  set: WorkbenchSetInfo | null;
  initialParams: ModelParams;
  initialViewState: unknown;
  canSaveView: boolean;
}

const PANEL_LABEL: Record<PanelKey, string> = {
  share: "Magnetic share",
  spinTrace: "Spin trace",
  maps: "Maps",
  compare: "Compare",
};

const SAVE_TEXT: Record<ViewSaveStatus, string> = {
  local: "View kept in this browser",
  saved: "View saved with the set",
  saving: "Saving view…",
  error: "View not saved",
};

export function Workbench({ set, initialParams, initialViewState, canSaveView }: WorkbenchProps) {
  // Workers start lazily on first use; the side pool serves maps, compare and the spin trace so
  // that cancelling the main run never cancels them (see createPool).
  const [pools, setPools] = useState<{ main: WorkbenchPool; side: WorkbenchPool } | null>(null);
  useEffect(() => {
    const next = { main: createPool(), side: createPool({ size: 1 }) };
    setPools(next);
    return () => {
      next.main.dispose();
      next.side.dispose();
    };
  }, []);
  const pool = pools?.main ?? null;
  const sidePool = pools?.side ?? null;

  const { viewState, setViewState, saveStatus, saveError } = useViewState({ setId: set?.id ?? null, canSave: canSaveView, initial: initialViewState });
  const onView = useCallback((patch: Partial<ViewState>) => setViewState((v) => ({ ...v, ...patch })), [setViewState]);

  const [drafts, setDrafts] = useState<ParamDrafts>(() => draftsFromParams(initialParams));
  const [rangeDrafts, setRangeDrafts] = useState<RangeDrafts>(() => draftsFromRange(viewState.range));

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
  const built = useMemo(() => (params && range ? buildRequest(params, range, "llg") : { request: null, rangeError: null }), [params, range]);
  const markersForRun = useMemo(() => (params ? normalizeMarkers(computableMarkers(params, viewState.markersNm)) : []), [params, viewState.markersNm]);
  const run = useSpectrumRun({ request: built.request, markersNm: markersForRun, pool });

  // Labels, unit conversions and exports describe the result on screen, which may be older than
  // the inputs (typing, invalid input, failed run); physics-model §4.3 needs the label of that result.
  const shownParams = run.shown?.params ?? params ?? initialParams;
  const geometry = useMemo(() => ({ fieldT: shownParams.fieldT, lengthM: shownParams.lengthM }), [shownParams.fieldT, shownParams.lengthM]);
  const scaleLabel = magneticScaleLabel(shownParams.magneticScale);
  const setName = set?.name ?? "Scratch (terbium garnet defaults)";
  const fileBase = exportFileName(setName, set ? `v${set.version}` : "scratch", "x").replace(/\.x$/, "");
  const methodLabel = run.shown?.method === "llg" ? "numerical LLG" : "analytic";
  const invalid = params === null || range === null || built.request === null;

  const addMarker = useCallback(
    (nm: number) =>
      setViewState((v) => (v.markersNm.includes(nm) || v.markersNm.length >= MAX_MARKERS ? v : { ...v, markersNm: normalizeMarkers([...v.markersNm, nm]) })),
    [setViewState],
  );
  const removeMarker = useCallback((nm: number) => setViewState((v) => ({ ...v, markersNm: v.markersNm.filter((m) => m !== nm) })), [setViewState]);
  const resetMarkers = useCallback(() => setViewState((v) => ({ ...v, markersNm: [...DEFAULT_MARKERS_NM] })), [setViewState]);
  const togglePanel = (k: PanelKey, on: boolean) => setViewState((v) => ({ ...v, panels: { ...v.panels, [k]: on } }));

  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-3 border-b border-ink/10 pb-4">
        <div className="min-w-0">
          <p className="text-xs font-medium tracking-wide text-ink-soft uppercase">Workbench</p>
          <h1 className="text-2xl font-semibold tracking-tight">{set ? set.name : "Scratch workbench"}</h1>
          <p className="mt-1 text-sm text-ink-soft">
            {set ? (
              <>
                {set.labName} · version {set.version} · your role: {set.role} ·{" "}
                <Link className="text-lux-dark underline-offset-4 hover:underline" href={`/parameter-sets/${encodeURIComponent(set.id)}`}>
                  open the set
                </Link>
              </>
            ) : (
              "Starts from the terbium gallium garnet values (physics-model §9). Nothing here is stored until you save it as a set."
            )}
          </p>
          {set ? (
            <p className="mt-1 text-xs text-ink-soft">
              Parameter edits here are what-ifs and do not change the stored set. {SAVE_TEXT[saveStatus]}
              {saveError ? `: ${saveError}` : saveStatus === "saving" ? "" : "."}
            </p>
          ) : null}
        </div>
        {!set || set.role !== "viewer" ? <SaveAsNew params={params} defaultName={set ? `${set.name} (what-if)` : "Workbench scratch"} /> : null}
      </header>

      <div className="grid gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <aside aria-label="Parameters" className="space-y-6 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pr-2">
          <RangeControls drafts={rangeDrafts} errors={rangeErrors} requestError={built.rangeError} onChange={onRange} />
          <ParameterPanel drafts={drafts} errors={errors} onChange={onParam} />
        </aside>

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
                methodLabel={methodLabel}
              />
              <MarkerTable
                markersNm={viewState.markersNm}
                result={run.shown.markers}
                fieldT={geometry.fieldT}
                methodLabel={methodLabel}
                banner={scaleLabel}
                onAdd={addMarker}
                onRemove={removeMarker}
                onReset={resetMarkers}
              />
              <ExportBar shown={run.shown} setName={setName} setId={set?.id ?? null} version={set?.version ?? null} />
            </>
          ) : (
            <EmptyResult invalid={invalid} />
          )}

          <fieldset className="flex flex-wrap gap-4 rounded-lg border border-ink/10 px-4 py-3 text-sm">
            <legend className="px-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Panels</legend>
            {(Object.keys(PANEL_LABEL) as PanelKey[]).map((k) => (
              <label key={k} className="flex items-center gap-1.5">
                <input type="checkbox" checked={viewState.panels[k]} onChange={(e) => togglePanel(k, e.target.checked)} />
                {PANEL_LABEL[k]}
              </label>
            ))}
          </fieldset>

          {viewState.panels.spinTrace ? (
            <PanelFrame title="Spin trace">
              <SpinTracePanel pool={sidePool} params={params} view={viewState.spinTrace} onView={(spinTrace: ViewState["spinTrace"]) => onView({ spinTrace })} fileBase={fileBase} />
            </PanelFrame>
          ) : null}
          {viewState.panels.maps ? (
            <PanelFrame title="Maps of the magnetic share">
              <MapsPanel pool={sidePool} params={params} range={range} fileBase={fileBase} />
            </PanelFrame>
          ) : null}
          {viewState.panels.compare ? (
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
          {set ? <LabRunPanel setId={set.id} params={params} range={range} /> : null}
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
      {invalid ? "Fix the flagged inputs on the left to compute a spectrum." : "Computing the first spectrum…"}
    </div>
  );
}
