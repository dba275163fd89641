"use client";

import { savedPlanSummary } from "@/lib/planner/summary";
import { type ReactNode, useMemo, useState } from "react";
import { CautionsPanel } from "@/components/planner/cautions-panel";
import { LinePlot } from "@/components/plots/line-plot";
import { Button, LinkButton } from "@/components/ui/button";
import { DateTime } from "@/components/ui/date-time";
import type { ProvenanceRecord } from "@/db/queries/report";
import { formatFlag } from "@/lib/model/diff";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";
import { cautionsFor } from "@/lib/planner/cautions";
import type { SavedPlan } from "@/lib/contracts/plans";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { fmt, fmtPercent, magneticScaleLabel } from "@/lib/workbench/format";
import { parseViewState } from "@/lib/workbench/view-state";
import { ReportFit } from "./report-fit";
import { ReportRotator } from "./report-rotator";

type Paper = "A4" | "letter";

/*
 * Print layout: the app rail and the controls are hidden, the content is at most 180 mm wide,
 * which fits A4 (210 mm) and US Letter (215.9 mm) with 14 mm margins; sections do not break
 * across pages. The paper size is the user's choice (CSS @page size).
 */
const printCss = (paper: Paper) => `
@page { size: ${paper === "A4" ? "A4" : "letter"}; margin: 14mm; }
@media print {
  aside, .no-print { display: none !important; }
  main { padding: 0 !important; }
  body { background: #fff !important; }
  .report { max-width: 180mm; font-size: 10pt; gap: 5mm !important; }
  /* Sections may run over a page break (keeping whole sections together left pages half empty);
     what must not be split: a heading from what follows it, a table row, a figure, the cautions. */
  .report h2, .report caption { break-after: avoid; }
  .report tr, .report figure, .report .caution-block, .report .keep { break-inside: avoid; }
  .report svg { max-width: 100%; height: auto; }
}`;

const PLOT_WIDTH = 680;

/** A lab light source as the report needs it: the power that sizes the laser caution. */
export interface LineSource {
  name: string;
  wavelengthNm: number;
  powerW: number | null;
}

function uniqueLines<T extends { lineName: string; wavelengthNm: number }>(points: readonly T[]): T[] {
  const seen = new Set<string>();
  return points.filter((p) => {
    const key = `${p.lineName}@${p.wavelengthNm}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** The lines of a saved plan's request, as stored (the request is kept as the planner sent it). */
function requestLines(request: unknown): LineSource[] {
  const lines = (request as { lines?: unknown } | null)?.lines;
  if (!Array.isArray(lines)) return [];
  return lines.flatMap((l) =>
    typeof l?.name === "string" && typeof l?.wavelengthNm === "number"
      ? [{ name: l.name, wavelengthNm: l.wavelengthNm, powerW: typeof l.powerW === "number" ? l.powerW : null }]
      : [],
  );
}

/**
 * A line's power: the one the plan was made with (its request), else, for a plan saved before
 * requests carried powers, the lab's light source of the same name and wavelength.
 */
function powerOf(
  planned: readonly LineSource[],
  sources: readonly LineSource[],
  line: { lineName: string; wavelengthNm: number },
): number | null {
  const same = (s: LineSource) => s.name === line.lineName && s.wavelengthNm === line.wavelengthNm;
  return planned.find(same)?.powerW ?? sources.find(same)?.powerW ?? null;
}

function logSpaced(from: number, to: number, n: number): number[] {
  const a = Math.log(from);
  const b = Math.log(to);
  return Array.from({ length: n }, (_, i) => Number(Math.exp(a + ((b - a) * i) / (n - 1)).toPrecision(10)));
}

export interface ReportSet {
  id: string;
  name: string;
  version: number;
  labName: string;
  description: string;
  updatedAt: string;
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}

export function ReportView({
  set,
  fit,
  plan,
  lightSources,
}: {
  set: ReportSet;
  fit: ProvenanceRecord | null;
  plan: SavedPlan | null;
  lightSources: readonly LineSource[];
}) {
  const [paper, setPaper] = useState<Paper>("A4");
  const parsed = modelParamsSchema.safeParse(set.params);
  const params = parsed.success ? parsed.data : null;
  const markers = useMemo(() => parseViewState(set.viewState).markersNm, [set.viewState]);

  const computed = useMemo(() => {
    if (!params) return null;
    const fieldT = params.fieldT || 1;
    const from = Math.max(300, params.sellmeierB > 0 ? params.sellmeierWavelengthNm * 1.05 : 0);
    const grid = logSpaced(from, Math.max(from * 1.5, 3000), 240).filter(
      (w) => params.oscillatorDampingRadPerS > 0 || w !== params.oscillatorWavelengthNm,
    );
    const spectrum = computeSpectrum({ ...params, fieldT, lengthM: 1, wavelengthsNm: grid, method: "analytic" });
    const usable = markers.filter((m) => !(params.sellmeierB > 0 && m <= params.sellmeierWavelengthNm));
    const atMarkers =
      usable.length > 0 ? computeSpectrum({ ...params, fieldT, lengthM: 1, wavelengthsNm: usable, method: "analytic" }).points : [];
    return { fieldT, spectrum, atMarkers };
  }, [params, markers]);

  const scaleLabel = params ? magneticScaleLabel(params.magneticScale) : null;
  const cautions = cautionsFor({
    lines: uniqueLines(plan?.plan.points ?? []).map((p) => ({
      name: p.lineName,
      wavelengthNm: p.wavelengthNm,
      powerW: powerOf(requestLines(plan?.request), lightSources, p),
    })),
    minTemperatureK: plan ? Math.min(...plan.plan.points.map((p) => p.temperatureK)) : (params?.temperatureK ?? null),
    maxFieldT: plan ? Math.max(...plan.plan.points.map((p) => Math.abs(p.fieldT))) : params ? Math.abs(params.fieldT) : null,
  });

  return (
    <article
      className="report mx-auto grid max-w-4xl grid-cols-[minmax(0,1fr)] gap-6 text-ink [&_svg]:h-auto [&_svg]:max-w-full"
      aria-label="Printable report"
    >
      <style>{printCss(paper)}</style>
      <div className="no-print flex flex-wrap items-center gap-3 rounded-md border border-ink/15 bg-paper-raised px-3 py-2 text-sm">
        <label className="flex items-center gap-2">
          Paper
          <select
            className="rounded-md border border-ink/25 bg-paper-raised px-2 py-1"
            value={paper}
            onChange={(e) => setPaper(e.target.value as Paper)}
          >
            <option value="A4">A4</option>
            <option value="letter">US Letter</option>
          </select>
        </label>
        <Button onClick={() => window.print()}>Print or save as PDF</Button>
        <LinkButton variant="quiet" href={`/parameter-sets/${set.id}`}>
          Back to the set
        </LinkButton>
      </div>

      <header>
        <h1 className="text-2xl font-semibold">{set.name}</h1>
        <p className="text-sm text-ink-soft">
          Version {set.version} · {set.labName} · last saved <DateTime iso={set.updatedAt} /> · printed from Gyrolux
        </p>
        {set.description ? <p className="mt-2 text-sm">{set.description}</p> : null}
        {scaleLabel ? <p className="mt-1 text-sm font-medium text-ember">{scaleLabel}</p> : null}
      </header>

      <section aria-labelledby="report-params">
        <h2 id="report-params" className="text-lg font-semibold">
          Parameters
        </h2>
        <ScrollBox>
          <table className="w-full text-sm">
            <thead className="text-left text-ink-soft">
              <tr>
                <th scope="col" className="py-1 font-medium">
                  Parameter
                </th>
                <th scope="col" className="font-medium">
                  Key
                </th>
                <th scope="col" className="text-right font-medium">
                  Value
                </th>
                <th scope="col" className="pl-2 font-medium">
                  Unit
                </th>
              </tr>
            </thead>
            <tbody className="tabular-nums">
              {PARAM_META.map((m) => (
                <tr key={m.key} className="border-t border-ink/10">
                  <td className="py-0.5">{m.label}</td>
                  <td className="font-mono text-xs">{m.key}</td>
                  <td className="text-right">{fmt((set.params as Record<string, unknown>)[m.key] as number | undefined, 6)}</td>
                  <td className="pl-2">{m.unit || "1"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollBox>
      </section>

      <section aria-labelledby="report-switches">
        <h2 id="report-switches" className="text-lg font-semibold">
          Model switches
        </h2>
        <ul className="mt-1 text-sm">
          {FLAG_META.map((f) => (
            <li key={f.key}>
              {f.label}:{" "}
              <span className="font-medium">{formatFlag((set.params as Record<string, unknown>)[f.key] as boolean | undefined)}</span>
            </li>
          ))}
          <li>
            Magnetic-dipole scale: <span className="font-medium">{scaleLabel ?? "1 (first-principles)"}</span>
          </li>
        </ul>
      </section>

      <section aria-labelledby="report-split">
        <h2 id="report-split" className="text-lg font-semibold">
          Verdet constant and its two parts
        </h2>
        {computed ? (
          <>
            <p className="text-sm text-ink-soft">
              Analytic model at {set.params.temperatureK} K and {fmt(computed.fieldT, 4)} T
              {set.params.fieldT === 0 ? " (the set's field is 0 T; 1 T is shown)" : ""}.
            </p>
            <LinePlot
              title={`Verdet constant of ${set.name}`}
              width={PLOT_WIDTH}
              height={300}
              banner={scaleLabel}
              series={{
                xs: computed.spectrum.points.map((p) => p.wavelengthNm),
                curves: [
                  {
                    key: "total",
                    label: "total",
                    color: "#1d2433",
                    dash: undefined,
                    width: 2,
                    values: computed.spectrum.points.map((p) => p.thetaRad / computed.fieldT),
                  },
                  {
                    key: "electric",
                    label: "electric-dipole part",
                    color: "#0f6e6e",
                    dash: "6 3",
                    width: 1.6,
                    values: computed.spectrum.points.map((p) => p.thetaElectricRad / computed.fieldT),
                  },
                  {
                    key: "magnetic",
                    label: "magnetic-dipole part",
                    color: "#b4541a",
                    dash: "2 3",
                    width: 1.6,
                    values: computed.spectrum.points.map((p) => p.thetaMagneticRad / computed.fieldT),
                  },
                ],
              }}
              axes={{ x: { type: "log", label: "wavelength (nm)" }, y: { label: "V (rad/(T·m))" } }}
              marks={{ markers: markers.map((m) => ({ x: m, label: `${m} nm` })) }}
            />
          </>
        ) : (
          <p role="alert">The stored parameters are not valid, so nothing is computed.</p>
        )}
      </section>

      {computed ? (
        <section aria-labelledby="report-markers">
          <h2 id="report-markers" className="text-lg font-semibold">
            Marker wavelengths
          </h2>
          {computed.atMarkers.length === 0 ? (
            <p className="text-sm text-ink-soft">No markers.</p>
          ) : (
            <ScrollBox>
              <table className="w-full text-sm">
                <thead className="text-left text-ink-soft">
                  <tr>
                    <th scope="col" className="py-1 font-medium">
                      λ (nm)
                    </th>
                    <th scope="col" className="text-right font-medium">
                      V (rad/(T·m))
                    </th>
                    <th scope="col" className="text-right font-medium">
                      electric
                    </th>
                    <th scope="col" className="text-right font-medium">
                      magnetic
                    </th>
                    <th scope="col" className="text-right font-medium">
                      magnetic share
                    </th>
                    <th scope="col" className="text-right font-medium">
                      L for 45° (mm)
                    </th>
                  </tr>
                </thead>
                <tbody className="tabular-nums">
                  {computed.atMarkers.map((p) => {
                    const v = p.thetaRad / computed.fieldT;
                    return (
                      <tr key={p.wavelengthNm} className="border-t border-ink/10">
                        <td className="py-0.5">{p.wavelengthNm}</td>
                        <td className="text-right">{fmt(v, 4)}</td>
                        <td className="text-right">{fmt(p.thetaElectricRad / computed.fieldT, 4)}</td>
                        <td className="text-right">{fmt(p.thetaMagneticRad / computed.fieldT, 4)}</td>
                        <td className="text-right">{fmtPercent(p.magneticShare)}</td>
                        <td className="text-right">{v !== 0 ? fmt((Math.PI / 4 / Math.abs(v * computed.fieldT)) * 1000, 4) : "–"}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
            </ScrollBox>
          )}
        </section>
      ) : null}

      {params ? (
        <section aria-labelledby="report-rotator">
          <h2 id="report-rotator" className="text-lg font-semibold">
            Rotator sizing
          </h2>
          <ReportRotator params={params} wavelengthsNm={computed?.atMarkers.map((p) => p.wavelengthNm) ?? []} />
        </section>
      ) : null}

      <section aria-labelledby="report-fit">
        <h2 id="report-fit" className="text-lg font-semibold">
          Latest fit
        </h2>
        <ReportFit record={fit} />
      </section>

      <section aria-labelledby="report-plan">
        <h2 id="report-plan" className="text-lg font-semibold">
          Saved measurement plan
        </h2>
        {plan ? (
          <>
            <p className="text-sm">
              “{plan.name}” (for version {plan.setVersion}, by {plan.createdBy.name}, <DateTime iso={plan.createdAt} />
              ): {plan.plan.criterionLabel} {plan.plan.criterionUnit} ={" "}
              {plan.plan.expectedSigma === null ? "∞" : fmt(plan.plan.expectedSigma, 3)}; {plan.plan.method} search over{" "}
              {plan.plan.candidateCount} candidates; σ per point {fmt(plan.plan.sigmaPerPointRad * 1e6, 3)} µrad
              {plan.plan.partsCorrelation !== null ? `; correlation between the parts ${fmt(plan.plan.partsCorrelation, 3)}` : ""}.
            </p>
            <ul className="mt-1 text-sm">
              {savedPlanSummary(plan.plan, plan.request).map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
            <ScrollBox>
              <table className="w-full text-sm">
                <thead className="text-left text-ink-soft">
                  <tr>
                    <th scope="col" className="py-1 font-medium">
                      Line
                    </th>
                    <th scope="col" className="text-right font-medium">
                      λ (nm)
                    </th>
                    <th scope="col" className="text-right font-medium">
                      T (K)
                    </th>
                    <th scope="col" className="text-right font-medium">
                      B (T)
                    </th>
                    <th scope="col" className="text-right font-medium">
                      ×
                    </th>
                    <th scope="col" className="text-right font-medium">
                      predicted θ (mrad)
                    </th>
                  </tr>
                </thead>
                <tbody className="tabular-nums">
                  {plan.plan.points.map((p, i) => (
                    <tr key={i} className="border-t border-ink/10">
                      <td className="py-0.5">
                        {p.lineName}
                        {p.belowNoise ? " (below noise)" : ""}
                        {p.flags?.includes("phase-wrap") ? " (past π/2: unwrap with a field sweep)" : ""}
                        {p.transmission !== undefined ? ` · transmission ${fmt(100 * p.transmission, 3)} %` : ""}
                      </td>
                      <td className="text-right">{p.wavelengthNm}</td>
                      <td className="text-right">{p.temperatureK}</td>
                      <td className="text-right">{p.fieldT}</td>
                      <td className="text-right">{p.count}</td>
                      <td className="text-right">{fmt(p.rotationRad * 1000, 4)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </ScrollBox>
            {plan.plan.notes.length > 0 ? (
              <ul className="mt-2 list-disc pl-5 text-sm">
                {plan.plan.notes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            ) : null}
          </>
        ) : (
          <p className="text-sm text-ink-soft">No plan saved with this set.</p>
        )}
      </section>

      <CautionsPanel cautions={cautions} />
    </article>
  );
}

/** A table's own horizontal scroll box: a wide table scrolls inside it instead of widening the page. */
function ScrollBox({ children }: { children: ReactNode }) {
  return <div className="relative mt-2 overflow-x-auto">{children}</div>;
}
