import type { ReactNode } from "react";
import { DateTime } from "@/components/ui/date-time";
import { asFitProvenance } from "@/lib/fit/provenance";
import { PARAM_META } from "@/lib/model/param-meta";
import { formatNumberDisplay } from "@/lib/model/number-text";
import { countOf, noun } from "@/lib/text/plural";
import { fmt } from "@/lib/workbench/format";
import { ReportFitInference } from "./report-fit-inference";

/*
 * The latest fit of the report as tables a reader can quote: each free parameter's value ± σ with
 * its unit and bounds, the fit's quality (χ², degrees of freedom), and the correlation matrix of
 * the free parameters, then what the fit's report said (ReportFitInference). `more` takes further
 * sections: they render last, inside the same print block rules.
 */

const META = new Map(PARAM_META.map((m) => [m.key, m]));

export function ReportFit({
  record,
  more,
}: {
  record: { version: number; createdAt: string; provenance: Record<string, unknown> } | null;
  more?: ReactNode;
}) {
  const fit = record ? asFitProvenance(record.provenance) : null;
  if (!record || !fit) return <p className="text-sm text-ink-soft">No fit recorded for this set.</p>;
  const labelOf = (key: string) => META.get(key as never)?.label ?? key;
  return (
    <div className="grid gap-3">
      <p className="text-sm">
        Version {record.version}, fitted <DateTime iso={fit.fittedAt} /> to {fit.measurementSets.map((m) => `“${m.name}”`).join(", ")} (
        {countOf(fit.pointCount, noun("point"))}). χ² = {fmt(fit.chi2, 4)} for{" "}
        {countOf(fit.dof, noun("degree of freedom", "degrees of freedom"))} (reduced χ² {fmt(fit.reducedChi2, 3)}).{" "}
        {fit.sigmaScaledByChi2
          ? "The σ are scaled by √(reduced χ²), as the scatter of the points suggests."
          : "The σ come from the points' own uncertainties, not scaled by χ²."}
        {fit.separable ? "" : " In this model the data do not separate the two parts well: read the σ and the correlations together."}
      </p>
      <div className="relative overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Fitted parameters</caption>
          <thead className="text-left text-ink-soft">
            <tr>
              <th scope="col" className="py-1 font-medium">
                Parameter
              </th>
              <th scope="col" className="text-right font-medium">
                Value ± σ
              </th>
              <th scope="col" className="pl-2 font-medium">
                Unit
              </th>
              <th scope="col" className="pl-2 font-medium">
                Bounds in the fit
              </th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {fit.free.map(({ key, min, max }) => {
              const sigma = fit.sigmas[key];
              return (
                <tr key={key} className="border-t border-ink/10">
                  <th scope="row" className="py-0.5 text-left font-normal">
                    {labelOf(key)}
                  </th>
                  <td className="text-right">
                    {formatNumberDisplay(fit.values[key]) || "–"} ± {sigma === undefined ? "–" : fmt(sigma, 2)}
                  </td>
                  <td className="pl-2">{META.get(key)?.unit || "1"}</td>
                  <td className="pl-2 text-ink-soft">
                    {min === undefined && max === undefined ? "none" : `${min ?? "−∞"} … ${max ?? "∞"}`}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {fit.free.length > 1 && fit.correlation.length === fit.free.length ? (
        <div className="relative overflow-x-auto">
          <table className="text-sm tabular-nums">
            <caption className="pb-1 text-left font-medium">Correlation of the fitted parameters</caption>
            <thead>
              <tr>
                <td />
                {fit.free.map(({ key }) => (
                  <th key={key} scope="col" className="px-2 text-right font-medium">
                    {labelOf(key)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {fit.free.map(({ key }, i) => (
                <tr key={key} className="border-t border-ink/10">
                  <th scope="row" className="py-0.5 pr-2 text-left font-normal">
                    {labelOf(key)}
                  </th>
                  {fit.free.map(({ key: other }, j) => (
                    <td key={other} className="px-2 text-right">
                      {i === j ? "1" : fmt(fit.correlation[i]?.[j], 3)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      <ReportFitInference fit={fit} />
      {more}
    </div>
  );
}
