import { formatSignificance } from "@/lib/fit/statistics";
import type { FitProvenance } from "@/lib/fit/provenance";
import { fitNameLabel } from "@/lib/fit/labels";
import { fmt, fmtHeldValue, fmtProbability } from "@/lib/workbench/format";

/*
 * The printed report's part of a saved fit that says under which conditions its result holds: the
 * verdict, the model comparison (numbers and words), the profile interval of magneticScale, the
 * goodness of fit, the priors and nuisance values, and the held values with their sources.
 * Fits saved before the report carried these show nothing here.
 */

const labelOf = fitNameLabel;

export function ReportFitInference({ fit }: { fit: FitProvenance }) {
  const ms = fit.profile?.magneticScale;
  return (
    <>
      {fit.verdict ? (
        <div className="text-sm">
          <p className="font-medium">
            {fit.verdict.separable
              ? "In this model the data separate the two parts."
              : "In this model the data do not separate the two parts:"}
          </p>
          {fit.verdict.reasons.length > 0 ? (
            <ul className="list-disc pl-5">
              {fit.verdict.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {fit.comparison && fit.comparison.length > 0 ? (
        <div className="relative overflow-x-auto">
          <table className="w-full text-sm tabular-nums">
            <caption className="pb-1 text-left font-medium">Model comparison of the fit</caption>
            <thead className="text-left text-ink-soft">
              <tr>
                <th scope="col" className="py-1 font-medium">
                  magneticScale held at
                </th>
                <th scope="col" className="text-right font-medium">
                  χ²
                </th>
                <th scope="col" className="text-right font-medium">
                  Δχ²
                </th>
                <th scope="col" className="text-right font-medium">
                  p
                </th>
                <th scope="col" className="text-right font-medium">
                  Significance
                </th>
                <th scope="col" className="text-right font-medium">
                  AIC / AICc / BIC
                </th>
              </tr>
            </thead>
            <tbody>
              {fit.comparison.map((row) => (
                <tr key={row.hypothesis} className="border-t border-ink/10">
                  <th scope="row" className="py-0.5 text-left font-normal">
                    {row.fixed.magneticScale} ({row.hypothesis === "noMagneticPart" ? "no magnetic-dipole part" : "first principles"})
                  </th>
                  <td className="text-right">{fmt(row.chi2)}</td>
                  <td className="text-right">{fmt(row.deltaChi2)}</td>
                  <td className="text-right">{fmtProbability(row.pValue)}</td>
                  <td className="text-right">{formatSignificance(row.significanceSigma)}</td>
                  <td className="text-right">
                    {fmt(row.aic)} / {fmt(row.aicc)} / {fmt(row.bic)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <ul className="mt-1 text-sm">
            {fit.comparison.map((row) => (
              <li key={row.hypothesis}>{row.words}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {ms || fit.goodnessOfFit ? (
        <p className="text-sm">
          {ms
            ? `Profile-likelihood intervals of magneticScale (Δχ² = 1 and 4, the other parameters refitted): ` +
              `68 % [${fmt(ms.interval68[0])}, ${fmt(ms.interval68[1])}], 95 % [${fmt(ms.interval95[0])}, ${fmt(ms.interval95[1])}]. `
            : ""}
          {fit.goodnessOfFit
            ? `Goodness of fit: P(χ² with ${fit.goodnessOfFit.dof} degrees of freedom > ${fmt(fit.goodnessOfFit.chi2)}) = ` +
              `${fmtProbability(fit.goodnessOfFit.pValue)}.`
            : ""}
          {fit.starts ? ` Best of ${fit.starts} seeded starts.` : ""}
          {fit.tookModelSign ? " The measured values were fitted as magnitudes with the model's sign." : ""}
        </p>
      ) : null}
      {(fit.priors?.length ?? 0) > 0 || (fit.nuisances?.length ?? 0) > 0 ? (
        <p className="text-sm">
          {fit.priors?.length
            ? `Priors: ${fit.priors.map((p) => `${labelOf(p.key)} ${fmt(p.mean)} ± ${fmt(p.sigma, 2)}`).join("; ")}. `
            : ""}
          {fit.nuisances?.length
            ? `Fitted within their priors (not stored in the set): ${fit.nuisances
                .map((n) => `${labelOf(n.name)} = ${fmt(n.value, 5)} ± ${fmt(n.sigma, 2)}`)
                .join("; ")}.`
            : ""}
        </p>
      ) : null}
      {fit.assumptions && fit.assumptions.length > 0 ? (
        <div className="relative overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="pb-1 text-left font-medium">Held values of the fit and their sources</caption>
            <thead className="text-left text-ink-soft">
              <tr>
                <th scope="col" className="py-1 font-medium">
                  Parameter
                </th>
                <th scope="col" className="text-right font-medium">
                  Held at
                </th>
                <th scope="col" className="pl-2 font-medium">
                  Source
                </th>
              </tr>
            </thead>
            <tbody>
              {fit.assumptions.map((a) => (
                <tr key={a.key} className="border-t border-ink/10 align-top">
                  <th scope="row" className="py-0.5 text-left font-normal">
                    {labelOf(a.key)}
                  </th>
                  <td className="text-right tabular-nums">{fmtHeldValue(a.value)}</td>
                  <td className="pl-2">{a.source}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </>
  );
}
