"use client";

import { isUnverifiedSource } from "@/lib/fit/assumptions";
import type { FitReport } from "@/lib/fit/report";
import { fitNameLabel } from "@/lib/fit/labels";
import { formatSignificance as fmtSigma } from "@/lib/fit/statistics";
import { fmt, fmtHeldValue, fmtProbability as fmtP } from "@/lib/workbench/format";
import { ProfilePlot } from "./fit-profile-plot";

/*
 * The inference half of the fit report: the held values the result rests on (with where each
 * comes from), the model comparison against no magnetic-dipole part and against first principles
 * (χ², Δχ², p, significance, information criteria, and the result in words), the goodness of fit,
 * and the profile-likelihood intervals of magneticScale beside its Gaussian ones.
 */

const labelOf = fitNameLabel;

const HYPOTHESIS_WORDS = {
  noMagneticPart: "No magnetic-dipole part",
  firstPrinciples: "First-principles part",
} as const;

export function AssumptionsTable({ report }: { report: FitReport }) {
  if (report.assumptions.length === 0) return null;
  return (
    <div className="relative max-h-72 overflow-auto rounded border border-ink/10">
      <table className="w-full min-w-[26rem] text-sm" aria-label="Held values">
        <caption className="px-2 py-1 text-left text-xs text-ink-soft">
          Held values that shape this result, and where each comes from. Every σ and interval below is conditional on them; give one a prior
          to carry its uncertainty.
        </caption>
        <thead className="sticky top-0 bg-paper-raised">
          <tr className="text-left text-xs text-ink-soft">
            <th className="px-2 py-1 font-medium">Parameter</th>
            <th className="px-2 py-1 font-medium">Held at</th>
            <th className="px-2 py-1 font-medium">Source</th>
          </tr>
        </thead>
        <tbody>
          {report.assumptions.map((a) => (
            <tr key={a.key} className="border-t border-ink/10 align-top">
              <th scope="row" className="px-2 py-1 text-left font-normal">
                {labelOf(a.key)}
              </th>
              <td className="px-2 py-1 tabular-nums">{fmtHeldValue(a.value)}</td>
              <td className={`px-2 py-1 ${isUnverifiedSource(a.source) ? "text-ember" : ""}`}>{a.source}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function ComparisonTable({ report }: { report: FitReport }) {
  if (report.comparison.length === 0) {
    return <p className="text-sm text-ink-soft">No model comparison: the magnetic-part scale was held, not fitted.</p>;
  }
  const ic = report.informationCriteria;
  return (
    <div className="space-y-2">
      <div className="relative overflow-x-auto">
        <table className="w-full min-w-[36rem] text-sm" aria-label="Model comparison">
          <caption className="pb-1 text-left text-xs text-ink-soft">
            Each row refits with magneticScale held at the value named, everything else free. At 0 (a bound) the test&apos;s null
            distribution is ½χ²₀ + ½χ²₁, so p = ½·P(χ²₁ &gt; Δχ²) (Chernoff 1954; Self &amp; Liang 1987); at 1, p = P(χ²₁ &gt; Δχ²). Lower
            AIC, AICc and BIC favour a model.
          </caption>
          <thead>
            <tr className="text-left text-xs text-ink-soft">
              <th className="py-1 pr-3 font-medium">Model</th>
              <th className="py-1 pr-3 font-medium">χ²</th>
              <th className="py-1 pr-3 font-medium">Δχ²</th>
              <th className="py-1 pr-3 font-medium">p</th>
              <th className="py-1 pr-3 font-medium">Significance</th>
              <th className="py-1 pr-3 font-medium">AIC</th>
              <th className="py-1 pr-3 font-medium">AICc</th>
              <th className="py-1 font-medium">BIC</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            <tr className="border-t border-ink/10">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                This fit (magneticScale free)
              </th>
              <td className="py-1 pr-3">{fmt(report.chi2)}</td>
              <td className="py-1 pr-3">–</td>
              <td className="py-1 pr-3">–</td>
              <td className="py-1 pr-3">–</td>
              <td className="py-1 pr-3">{fmt(ic.aic)}</td>
              <td className="py-1 pr-3">{fmt(ic.aicc)}</td>
              <td className="py-1">{fmt(ic.bic)}</td>
            </tr>
            {report.comparison.map((row) => (
              <tr key={row.hypothesis} className="border-t border-ink/10" data-testid={`fit-comparison-${row.hypothesis}`}>
                <th scope="row" className="py-1 pr-3 text-left font-normal">
                  {HYPOTHESIS_WORDS[row.hypothesis]} (magneticScale = {row.fixed.magneticScale})
                </th>
                <td className="py-1 pr-3">{fmt(row.chi2)}</td>
                <td className="py-1 pr-3">{fmt(row.deltaChi2)}</td>
                <td className="py-1 pr-3">{fmtP(row.pValue)}</td>
                <td className="py-1 pr-3">{fmtSigma(row.significanceSigma)}</td>
                <td className="py-1 pr-3">{fmt(row.aic)}</td>
                <td className="py-1 pr-3">{fmt(row.aicc)}</td>
                <td className="py-1">{fmt(row.bic)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ul className="space-y-1 text-sm" data-testid="fit-comparison-words">
        {report.comparison.map((row) => (
          <li key={row.hypothesis}>{row.words}</li>
        ))}
      </ul>
    </div>
  );
}

export function GoodnessOfFit({ report }: { report: FitReport }) {
  const g = report.goodnessOfFit;
  const low = g.pValue < 0.01;
  return (
    <p className="text-sm" data-testid="fit-goodness">
      Goodness of fit: P(χ²<sub>{g.dof}</sub> &gt; {fmt(g.chi2)}) = {fmtP(g.pValue)}
      {low
        ? ": a χ² this large is unlikely if the model and the data's σ are right (the σ may be too small, or the model misses something)."
        : ": the scatter about the model is as the data's σ lead one to expect."}
      {report.priorPenalty > 0 ? ` The χ² includes ${fmt(report.priorPenalty, 3)} from the priors.` : ""}
    </p>
  );
}

const intervalText = (iv: [number, number] | null, limited?: [boolean, boolean]) =>
  iv
    ? `[${fmt(iv[0])}${limited?.[0] ? " (limit)" : ""}, ${fmt(iv[1])}${limited?.[1] ? " (limit)" : ""}]`
    : "not built (the σ is not a fair error here)";

export function ScaleProfile({ report }: { report: FitReport }) {
  const p = report.profile.magneticScale;
  if (!p) return null;
  const g = report.gaussianIntervals.magneticScale;
  const atBound = report.atBound.includes("magneticScale");
  const quantile = g?.quantile === "student-t" ? "Student-t" : "normal";
  return (
    <div className="space-y-2">
      <div className="relative overflow-x-auto">
        <table className="w-full min-w-[26rem] text-sm" aria-label="Intervals of the magnetic-part scale">
          <caption className="pb-1 text-left text-xs text-ink-soft">
            magneticScale = {fmt(p.value, 5)}. Profile intervals: Δχ² = 1 and 4 with every other parameter refitted, asymmetric, cut at the
            physical range (marked &quot;limit&quot;). Gaussian intervals: value ± {quantile} quantile × σ.
          </caption>
          <thead>
            <tr className="text-left text-xs text-ink-soft">
              <th className="py-1 pr-3 font-medium">Interval</th>
              <th className="py-1 pr-3 font-medium">68.27 %</th>
              <th className="py-1 font-medium">95.45 %</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            <tr className="border-t border-ink/10">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                Profile likelihood
              </th>
              <td className="py-1 pr-3" data-testid="fit-profile-68">
                {intervalText(p.interval68, p.limited68)}
              </td>
              <td className="py-1">{intervalText(p.interval95, p.limited95)}</td>
            </tr>
            <tr className="border-t border-ink/10">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                Gaussian (from σ{atBound ? ", at a bound" : ` = ${fmt(report.sigmas.magneticScale, 2)}`})
              </th>
              <td className="py-1 pr-3">{intervalText(g?.interval68 ?? null)}</td>
              <td className="py-1">{intervalText(g?.interval95 ?? null)}</td>
            </tr>
          </tbody>
        </table>
      </div>
      {p.curve.length > 1 ? <ProfilePlot profile={p} label="magneticScale" /> : null}
    </div>
  );
}
