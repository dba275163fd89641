"use client";

import { memo, useDeferredValue, useEffect, useMemo, useRef, useState, type RefObject } from "react";
import { LinePlot, type PlotSeries } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { OPAQUE_TRANSMISSION } from "@/lib/physics/absorption";
import type { SpectrumPoint } from "@/lib/physics/types";
import { absorptionRow, ellipticityNote, formatTransmission, hasAbsorption, opaqueWarning } from "@/lib/workbench/absorption-view";
import { fmt, fmtLength } from "@/lib/workbench/format";
import { COMPARE_COLORS, COMPARE_DASHES } from "@/lib/workbench/palette";
import { fromNm, X_AXIS_TITLE, type XUnit } from "@/lib/workbench/units";

/*
 * Absorption beside the rotation: the transmission of each circular mode through the sample, the
 * absorption coefficients α± and their mean, and the figure of merit |V|/α, all from Im n± of the
 * same run (lib/physics/absorption.ts). Opaque wavelengths and a large η are said in words above
 * the plots, so a rotation the light cannot carry is never shown without a hint.
 */

const MODE_STYLE = {
  plus: { color: COMPARE_COLORS[2], dash: COMPARE_DASHES[1], width: 2 },
  minus: { color: COMPARE_COLORS[1], dash: COMPARE_DASHES[2], width: 2.2 },
  mean: { color: COMPARE_COLORS[0], dash: undefined, width: 2.4 },
} as const;

/**
 * Whether an element is on screen or within a screen's reach of it. The plots below the fold are
 * drawn only once the reader gets near them, so a new result never pays for SVG nobody sees.
 */
function useNearViewport<T extends Element>(mounted: boolean): [RefObject<T | null>, boolean] {
  const ref = useRef<T>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof IntersectionObserver === "undefined") {
      setNear(true);
      return;
    }
    const io = new IntersectionObserver((entries) => setNear(entries.some((e) => e.isIntersecting)), { rootMargin: "600px 0px" });
    io.observe(el);
    return () => io.disconnect();
  }, [mounted]);
  return [ref, near];
}

const positiveOrNull = (v: number | null) => (v !== null && v > 0 && Number.isFinite(v) ? v : null);

function AbsorptionPanelImpl({
  points: pointsNow,
  markerPoints: markerPointsNow,
  lengthM,
  xUnit,
  xScale,
  banner,
  fileBase,
}: {
  points: readonly SpectrumPoint[];
  /** The spectrum at the marker wavelengths, for the table (null while not computed). */
  markerPoints: readonly SpectrumPoint[] | null;
  lengthM: number;
  xUnit: XUnit;
  xScale: "log" | "linear";
  banner: string | null;
  fileBase: string;
}) {
  // Drawn after the rotation plots, at low priority: a new result never holds up the page for these.
  const points = useDeferredValue(pointsNow);
  const markerPoints = useDeferredValue(markerPointsNow);
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const available = hasAbsorption(points);
  const [plotsRef, near] = useNearViewport<HTMLDivElement>(available);
  const tSvg = useRef<SVGSVGElement>(null);
  const aSvg = useRef<SVGSVGElement>(null);
  const fSvg = useRef<SVGSVGElement>(null);
  const rows = useMemo(() => points.map(absorptionRow), [points]);
  const xs = useMemo(() => points.map((p) => fromNm(p.wavelengthNm, xUnit)), [points, xUnit]);
  const warning = useMemo(() => opaqueWarning(points, lengthM), [points, lengthM]);

  const transmission = useMemo<PlotSeries[]>(
    () => [
      {
        key: "tplus",
        label: "“+” mode",
        ...MODE_STYLE.plus,
        values: rows.map((r) => (r.transmissionPlus === null ? null : Math.min(100, r.transmissionPlus * 100))),
      },
      {
        key: "tminus",
        label: "“−” mode",
        ...MODE_STYLE.minus,
        values: rows.map((r) => (r.transmissionMinus === null ? null : Math.min(100, r.transmissionMinus * 100))),
      },
    ],
    [rows],
  );
  const alpha = useMemo<PlotSeries[]>(
    () => [
      { key: "amean", label: "mean α", ...MODE_STYLE.mean, values: rows.map((r) => positiveOrNull(r.alphaMeanPerCm)) },
      { key: "aplus", label: "α+", ...MODE_STYLE.plus, values: rows.map((r) => positiveOrNull(r.alphaPlusPerCm)) },
      { key: "aminus", label: "α−", ...MODE_STYLE.minus, values: rows.map((r) => positiveOrNull(r.alphaMinusPerCm)) },
    ],
    [rows],
  );
  const fom = useMemo<PlotSeries[]>(
    () => [{ key: "fom", label: "|V| / α", ...MODE_STYLE.mean, values: rows.map((r) => positiveOrNull(r.figureOfMeritRadPerT)) }],
    [rows],
  );
  const anyLoss = alpha[0]!.values.some((v) => v !== null);
  const hLines = useMemo(() => [{ y: OPAQUE_TRANSMISSION * 100, label: `${OPAQUE_TRANSMISSION * 100} %: opaque below` }], []);
  const tDomain = useMemo<[number, number]>(() => [0, 100], []);
  const markerRows = useMemo(() => (markerPoints ?? []).map(absorptionRow), [markerPoints]);

  if (!available) {
    return <p className="text-sm text-ink-soft">This result carries no absorption columns; run the spectrum again to see them.</p>;
  }
  const shared = { width, banner };
  const xAxis = { type: xScale, label: X_AXIS_TITLE[xUnit] };

  return (
    <div ref={wrapRef} className="space-y-3" data-testid="absorption-panel">
      <p className="text-sm text-ink-soft">
        From Im n± of the same run: the intensity absorption coefficient α± = −2ω Im n±/c of each circular mode and their mean, the one-pass
        internal transmission exp(−α± L) through {fmtLength(lengthM)} (surface reflections not included) and the figure of merit |V|/α. Loss
        here comes only from the oscillator&apos;s damping ΓE (its Lorentzian tail) and the Gilbert damping; set ΓE from absorption data
        where it matters.
      </p>
      {warning ? null : (
        <p className="text-sm">At least one circular mode transmits {OPAQUE_TRANSMISSION * 100} % or more at every computed wavelength.</p>
      )}

      <div ref={plotsRef} className={near ? "space-y-3" : "min-h-[48rem]"}>
        {near ? (
          <>
            <LinePlot
              {...shared}
              title={`Transmission of each circular mode through ${fmtLength(lengthM)}`}
              height={240}
              svgRef={tSvg}
              series={{ xs, curves: transmission }}
              axes={{ x: xAxis, y: { label: "Transmission (%)", domain: tDomain } }}
              marks={{ hLines }}
            />
            <PlotExportButtons svgRef={tSvg} fileBase={`${fileBase}-transmission`} plotName="transmission plot" />

            {anyLoss ? (
              <>
                <LinePlot
                  {...shared}
                  title="Absorption coefficient (log scale)"
                  height={240}
                  svgRef={aSvg}
                  series={{ xs, curves: alpha }}
                  axes={{ x: xAxis, y: { type: "log", label: "α (cm⁻¹)" } }}
                />
                <PlotExportButtons svgRef={aSvg} fileBase={`${fileBase}-absorption`} plotName="absorption plot" />
                <LinePlot
                  {...shared}
                  title="Figure of merit |V| / α (log scale)"
                  height={220}
                  svgRef={fSvg}
                  series={{ xs, curves: fom, legend: false }}
                  axes={{ x: xAxis, y: { type: "log", label: "|V| / α (rad/T)" } }}
                />
                <PlotExportButtons svgRef={fSvg} fileBase={`${fileBase}-figure-of-merit`} plotName="figure of merit plot" />
              </>
            ) : (
              <p className="text-sm">
                No loss in this model at these wavelengths (α = 0: ΓE = 0 and no spin damping), so the figure of merit |V|/α is not defined.
              </p>
            )}

            {markerRows.length > 0 ? (
              <div className="relative overflow-x-auto">
                <table className="w-full min-w-[36rem] text-sm tabular-nums">
                  <caption className="text-left font-semibold">Absorption at the markers</caption>
                  <thead className="text-left text-xs text-ink-soft">
                    <tr>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        λ (nm)
                      </th>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        mean α (cm⁻¹)
                      </th>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        T “+”
                      </th>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        T “−”
                      </th>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        Ellipticity angle (°)
                      </th>
                      <th scope="col" className="py-1 font-medium">
                        |V| / α (rad/T)
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {markerRows.map((r) => (
                      <tr key={r.wavelengthNm} className="border-t border-ink/10">
                        <th scope="row" className="py-1 pr-3 text-left font-medium">
                          {fmt(r.wavelengthNm, 5)}
                          {r.opaque ? (
                            <span className="ml-2 rounded bg-ember-light px-1.5 text-xs font-semibold text-ink">opaque</span>
                          ) : null}
                        </th>
                        <td className="py-1 pr-3">{fmt(r.alphaMeanPerCm, 3)}</td>
                        <td className="py-1 pr-3">{formatTransmission(r.transmissionPlus)}</td>
                        <td className="py-1 pr-3">{formatTransmission(r.transmissionMinus)}</td>
                        <td className="py-1 pr-3">
                          {r.ellipticityAngleRad === null ? "–" : fmt((r.ellipticityAngleRad * 180) / Math.PI, 3)}
                          {r.etaSmall ? null : <span className="ml-1 text-xs text-ink-soft">(|η| large)</span>}
                        </td>
                        <td className="py-1">{fmt(r.figureOfMeritRadPerT, 3)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ) : null}
          </>
        ) : (
          <p className="text-sm text-ink-soft">The plots are drawn when you scroll to them.</p>
        )}
      </div>
    </div>
  );
}

export const AbsorptionPanel = memo(AbsorptionPanelImpl);

/**
 * The opaque warning, for directly under the rotation plot: a persistent note (not an alert, which
 * would be announced again on every recomputation).
 */
export const OpaqueNote = memo(function OpaqueNote({ points, lengthM }: { points: readonly SpectrumPoint[]; lengthM: number }) {
  const warning = useMemo(() => opaqueWarning(points, lengthM), [points, lengthM]);
  const etaNote = useMemo(() => ellipticityNote(points), [points]);
  if (!warning && !etaNote) return null;
  return (
    <div
      role="note"
      data-testid="opaque-warning"
      className="space-y-1 rounded-md border border-ember bg-ember-light px-4 py-2 text-sm text-ink"
    >
      {warning ? (
        <p>
          <span className="font-semibold">No light gets through here. </span>
          {warning}
        </p>
      ) : null}
      {etaNote ? <p>{etaNote}</p> : null}
    </div>
  );
});
