"use client";

import { useMemo, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { LinePlot, type PlotSeries } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { spinTraceRequestSchema, type ModelParams } from "@/lib/physics/schema";
import { isAbortError, type SpinTraceResult, type WorkbenchPool } from "@/lib/workbench/engine";
import { fmt, magneticScaleLabel } from "@/lib/workbench/format";
import { COMPONENT_COLORS, SERIES_STYLE } from "@/lib/workbench/palette";
import { checkedSpectrumRequest, parseNumber } from "@/lib/workbench/validate";
import type { ViewState } from "@/lib/workbench/view-state";
import { staleText, traceInputsOf, type TraceInputs } from "@/lib/workbench/spin-trace-view";
import { formatNumberInput } from "@/lib/model/number-text";

type TraceView = ViewState["spinTrace"];

/** Intensities for the static ΔMz curve: 1e12 … 1e17 W/m² in half decades. */
const INTENSITIES = Array.from({ length: 11 }, (_, i) => 10 ** (12 + i / 2));

const INPUT =
  "mt-1 w-40 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm tabular-nums " +
  "focus:border-lux aria-[invalid=true]:border-ember";

interface ComplexValue {
  re: number;
  im: number;
}

function relDev(a: ComplexValue, b: ComplexValue): number {
  const d = Math.hypot(a.re - b.re, a.im - b.im);
  const n = Math.hypot(b.re, b.im);
  return n === 0 ? NaN : d / n;
}

function fmtComplex(z: ComplexValue): string {
  return `${fmt(z.re)} ${z.im < 0 ? "−" : "+"} ${fmt(Math.abs(z.im))} i`;
}

export function SpinTracePanel({
  pool,
  params,
  view,
  onView,
  fileBase,
}: {
  pool: WorkbenchPool | null;
  params: ModelParams | null;
  view: TraceView;
  onView: (next: TraceView) => void;
  fileBase: string;
}) {
  const [drafts, setDrafts] = useState({
    wavelengthNm: formatNumberInput(view.wavelengthNm),
    intensityWPerM2: formatNumberInput(view.intensityWPerM2),
    periods: formatNumberInput(view.periods),
  });
  // Each result keeps the magneticScale label of the parameters it was computed from (§4.3).
  // Each result also keeps the inputs it came from, so it can be marked stale when they change.
  const [trace, setTrace] = useState<(SpinTraceResult & { banner: string | null; inputs: TraceInputs }) | null>(null);
  const [traceState, setTraceState] = useState<"idle" | "running" | "failed">("idle");
  const [traceError, setTraceError] = useState<string | null>(null);
  const [curve, setCurve] = useState<{
    intensity: number[];
    plus: (number | null)[];
    minus: (number | null)[];
    banner: string | null;
    inputs: TraceInputs;
  } | null>(null);
  const [curveProgress, setCurveProgress] = useState<number | null>(null);
  const [curveError, setCurveError] = useState<string | null>(null);
  const abort = useRef<AbortController | null>(null);
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const svgA = useRef<SVGSVGElement>(null);
  const svgB = useRef<SVGSVGElement>(null);
  const svgC = useRef<SVGSVGElement>(null);

  const wl = parseNumber(drafts.wavelengthNm);
  const intensity = parseNumber(drafts.intensityWPerM2);
  const periods = parseNumber(drafts.periods);
  const request =
    params && wl !== null && intensity !== null && periods !== null
      ? spinTraceRequestSchema.safeParse({ ...params, wavelengthNm: wl, intensityWPerM2: intensity, periods })
      : null;
  const issue = request && !request.success ? request.error.issues[0] : null;
  const currentInputs = request?.success ? traceInputsOf(request.data) : null;
  const traceStale = trace ? staleText("trace", trace.inputs, currentInputs) : null;
  const curveStale = curve ? staleText("ΔMz curve", curve.inputs, params && wl !== null ? { params, wavelengthNm: wl } : null) : null;
  const fieldError = (k: string) =>
    issue && issue.path[0] === k
      ? issue.message
      : drafts[k as keyof typeof drafts] !== undefined && parseNumber(drafts[k as keyof typeof drafts]) === null
        ? "must be a number"
        : null;

  const runTrace = () => {
    if (!pool || !request?.success) return;
    abort.current?.abort();
    const ac = new AbortController();
    abort.current = ac;
    const r = request.data;
    onView({ wavelengthNm: r.wavelengthNm, intensityWPerM2: r.intensityWPerM2, periods: r.periods });
    setTraceState("running");
    setTraceError(null);
    pool.spinTrace(r, { signal: ac.signal }).then(
      (res) => {
        setTrace({ ...res, banner: magneticScaleLabel(r.magneticScale), inputs: traceInputsOf(r) });
        setTraceState("idle");
      },
      (e: unknown) => {
        if (isAbortError(e)) return setTraceState("idle");
        setTraceState("failed");
        setTraceError(e instanceof Error ? e.message : String(e));
      },
    );
  };

  // The curve's requests, checked before any is sent: an out-of-range wavelength disables the button.
  const curveRequests = (() => {
    if (!params || wl === null) return null;
    try {
      return INTENSITIES.map((intensityWPerM2) =>
        checkedSpectrumRequest({ ...params, wavelengthsNm: [wl], method: "llg", intensityWPerM2 }),
      );
    } catch {
      return null;
    }
  })();

  const runCurve = async () => {
    if (!pool || !params || !curveRequests || wl === null) return;
    const banner = magneticScaleLabel(params.magneticScale);
    const inputs: TraceInputs = { params, wavelengthNm: wl };
    abort.current?.abort();
    const ac = new AbortController();
    abort.current = ac;
    setCurveError(null);
    setCurveProgress(0);
    const plus: (number | null)[] = [];
    const minus: (number | null)[] = [];
    try {
      for (let i = 0; i < curveRequests.length; i++) {
        const res = await pool.spectrum(curveRequests[i]!, { signal: ac.signal });
        const p = res.points[0];
        plus.push(p?.deltaMzPlusAPerM == null ? null : Math.abs(p.deltaMzPlusAPerM));
        minus.push(p?.deltaMzMinusAPerM == null ? null : Math.abs(p.deltaMzMinusAPerM));
        setCurveProgress((i + 1) / INTENSITIES.length);
      }
      setCurve({ intensity: INTENSITIES, plus, minus, banner, inputs });
    } catch (e) {
      if (!isAbortError(e)) setCurveError(e instanceof Error ? e.message : String(e));
    } finally {
      setCurveProgress(null);
    }
  };

  const traceSeries = useMemo<{ xs: number[]; uxy: PlotSeries[]; uz: PlotSeries[] } | null>(() => {
    if (!trace) return null;
    const xs = Array.from(trace.timePeriods);
    const s = trace.uz.length > 0 && trace.uz[0]! < 0 ? -1 : 1;
    return {
      xs,
      uxy: [
        { key: "ux", label: "ux", color: COMPONENT_COLORS.ux, dash: undefined, width: 1.8, values: Array.from(trace.ux) },
        { key: "uy", label: "uy", color: COMPONENT_COLORS.uy, dash: "6 3", width: 1.8, values: Array.from(trace.uy) },
      ],
      uz: [
        {
          key: "uz",
          label: `uz − (${s})`,
          color: COMPONENT_COLORS.uz,
          dash: undefined,
          width: 1.8,
          values: Array.from(trace.uz, (v) => v - s),
        },
      ],
    };
  }, [trace]);

  const curveSeries = useMemo<PlotSeries[] | null>(
    () =>
      curve
        ? [
            {
              key: "plus",
              label: "|ΔMz| under the “+” drive",
              color: SERIES_STYLE.magnetic.color,
              dash: undefined,
              width: 2,
              values: curve.plus,
            },
            {
              key: "minus",
              label: "|ΔMz| under the “−” drive",
              color: SERIES_STYLE.electric.color,
              dash: "8 4",
              width: 2,
              values: curve.minus,
            },
          ]
        : null,
    [curve],
  );

  const input = (key: keyof typeof drafts, label: string) => {
    const id = `trace-${key}`;
    const err = fieldError(key);
    return (
      <div>
        <label htmlFor={id} className="block text-sm font-medium">
          {label}
        </label>
        <input
          id={id}
          className={INPUT}
          inputMode="decimal"
          value={drafts[key]}
          aria-invalid={err ? true : undefined}
          aria-describedby={err ? `${id}-error` : undefined}
          onChange={(e) => setDrafts((d) => ({ ...d, [key]: e.target.value }))}
        />
        {err ? (
          <p id={`${id}-error`} className="mt-1 max-w-56 text-xs text-ember">
            {err}
          </p>
        ) : null}
      </div>
    );
  };

  return (
    <div ref={wrapRef} className="space-y-4">
      <p className="text-sm text-ink-soft">
        The spins under the “+” circular drive after switch-on (smooth ramp, then lock-in), and χ± demodulated from the trace beside the
        Polder values. Intensity 0 uses the small linear-regime drive.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        {input("wavelengthNm", "Trace wavelength (nm)")}
        {input("intensityWPerM2", "Drive intensity (W/m²)")}
        {input("periods", "Lock-in periods")}
        <Button onClick={runTrace} disabled={!pool || !request?.success || traceState === "running"}>
          {traceState === "running" ? "Running…" : "Run spin trace"}
        </Button>
      </div>
      {!params ? <p className="text-sm text-ember">Fix the flagged parameters first.</p> : null}
      {traceError ? (
        <Alert tone="warning" title="Spin trace failed">
          {traceError}
        </Alert>
      ) : null}

      {trace && traceSeries ? (
        <div data-testid="spin-trace-result" data-stale={traceStale ? "true" : "false"} className="space-y-3">
          {traceStale ? (
            <p
              role="status"
              data-testid="spin-trace-stale"
              className="rounded-md border border-ember bg-ember-light px-3 py-2 text-sm text-ink"
            >
              {traceStale}
            </p>
          ) : null}
          <div className={traceStale ? "space-y-3 opacity-60" : "space-y-3"}>
            <LinePlot
              title={`Transverse magnetization after switch-on at ${fmt(trace.inputs.wavelengthNm, 5)} nm${traceStale ? " (stale)" : ""}`}
              width={width}
              height={240}
              banner={trace.banner}
              svgRef={svgA}
              series={{ xs: traceSeries.xs, curves: traceSeries.uxy }}
              axes={{ x: { type: "linear", label: "Time (drive periods)" }, y: { label: "u (1)" } }}
            />
            <PlotExportButtons svgRef={svgA} fileBase={`${fileBase}-spin-trace-uxy`} plotName="transverse magnetization plot" />
            <LinePlot
              title={`Longitudinal magnetization: uz − s at ${fmt(trace.inputs.wavelengthNm, 5)} nm${traceStale ? " (stale)" : ""}`}
              width={width}
              height={200}
              svgRef={svgB}
              series={{ xs: traceSeries.xs, curves: traceSeries.uz, legend: false }}
              axes={{ x: { type: "linear", label: "Time (drive periods)" }, y: { label: "uz − s (1)" } }}
            />
            <PlotExportButtons svgRef={svgB} fileBase={`${fileBase}-spin-trace-uz`} plotName="longitudinal magnetization plot" />
            <table className="w-full max-w-3xl text-sm tabular-nums">
              <caption className="text-left font-semibold">
                Susceptibility at {fmt(trace.inputs.wavelengthNm, 5)} nm{traceStale ? " (stale)" : ""}
                {trace.banner ? <span className="ml-2 text-xs font-semibold text-ember">{trace.banner}</span> : null}
              </caption>
              <thead className="text-left text-xs text-ink-soft">
                <tr>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Mode
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    χ from the trace (LLG)
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    χ analytic (Polder)
                  </th>
                  <th scope="col" className="py-1 pr-3 font-medium">
                    Relative deviation
                  </th>
                  <th scope="col" className="py-1 font-medium">
                    Static ΔMz (A/m)
                  </th>
                </tr>
              </thead>
              <tbody>
                <tr>
                  <th scope="row" className="py-1 pr-3 text-left font-medium">
                    “+”
                  </th>
                  <td className="py-1 pr-3">{fmtComplex(trace.chiPlus)}</td>
                  <td className="py-1 pr-3">{fmtComplex(trace.chiPlusAnalytic)}</td>
                  <td className="py-1 pr-3">{fmt(relDev(trace.chiPlus, trace.chiPlusAnalytic), 2)}</td>
                  <td className="py-1">{fmt(trace.deltaMzPlusAPerM)}</td>
                </tr>
                <tr>
                  <th scope="row" className="py-1 pr-3 text-left font-medium">
                    “−”
                  </th>
                  <td className="py-1 pr-3">{fmtComplex(trace.chiMinus)}</td>
                  <td className="py-1 pr-3">{fmtComplex(trace.chiMinusAnalytic)}</td>
                  <td className="py-1 pr-3">{fmt(relDev(trace.chiMinus, trace.chiMinusAnalytic), 2)}</td>
                  <td className="py-1">{fmt(trace.deltaMzMinusAPerM)}</td>
                </tr>
              </tbody>
            </table>
          </div>
        </div>
      ) : traceState === "running" ? (
        <p role="status" className="text-sm text-ink-soft">
          Integrating the LLG equation in a worker…
        </p>
      ) : (
        <p className="text-sm text-ink-soft">No trace yet. Choose a wavelength and intensity and run it.</p>
      )}

      <div className="space-y-2 border-t border-ink/10 pt-4">
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" onClick={() => void runCurve()} disabled={!pool || !curveRequests || curveProgress !== null}>
            ΔMz against intensity at {wl ?? "–"} nm
          </Button>
          {curveProgress !== null ? <progress aria-label="ΔMz curve progress" value={curveProgress} max={1} className="w-48" /> : null}
        </div>
        {curveError ? (
          <Alert tone="warning" title="ΔMz curve failed">
            {curveError}
          </Alert>
        ) : null}
        {curve && curveSeries ? (
          <div data-stale={curveStale ? "true" : "false"} className="space-y-2">
            {curveStale ? (
              <p role="status" className="rounded-md border border-ember bg-ember-light px-3 py-2 text-sm text-ink">
                {curveStale}
              </p>
            ) : null}
            <LinePlot
              title={
                `Static change of Mz against optical intensity at ${fmt(curve.inputs.wavelengthNm, 5)} nm ` +
                `(numerical LLG, log-log)${curveStale ? " (stale)" : ""}`
              }
              width={width}
              height={280}
              banner={curve.banner}
              svgRef={svgC}
              series={{ xs: curve.intensity, curves: curveSeries }}
              axes={{ x: { type: "log", label: "Intensity in the medium (W/m²)" }, y: { type: "log", label: "|ΔMz| (A/m)" } }}
            />
            <p className="text-xs text-ink-soft">
              ΔMz has the opposite sign to M0 (the precession cone shortens Mz); magnitudes are shown. Slope 1 on this plot means ΔMz ∝ I.
            </p>
            <PlotExportButtons svgRef={svgC} fileBase={`${fileBase}-delta-mz`} plotName="ΔMz against intensity plot" />
          </div>
        ) : null}
      </div>
    </div>
  );
}
