import { DateTime } from "@/components/ui/date-time";
import { isUnverifiedSource } from "@/lib/fit/assumptions";
import { fitNameLabel } from "@/lib/fit/labels";
import { type FitProvenance, asFitProvenance } from "@/lib/fit/provenance";
import { PARAM_META } from "@/lib/model/param-meta";
import { fmt, fmtProbability, magneticScaleLabel } from "@/lib/workbench/format";
import { countOf, noun } from "@/lib/text/plural";

/*
 * "From a fit": what a version's provenance says about the fit that made it (measurement sets,
 * free parameters, values ± σ, χ², date, and, for fits saved with their report, the comparison in
 * words, the profile interval of magneticScale, the goodness of fit, the priors and the held values
 * that rest on unverified sources), shown in the version history. Nothing for other versions.
 */

const META = new Map(PARAM_META.map((m) => [m.key, m]));

export function FitProvenanceSummary({ provenance }: { provenance: unknown }) {
  const fit = asFitProvenance(provenance);
  if (!fit) return null;
  const scale = fit.values.magneticScale;
  const scaleLabel = scale === undefined ? null : magneticScaleLabel(scale);
  return (
    <div className="mt-2 rounded-md border border-lux/30 bg-lux-light/40 px-3 py-2 text-sm" data-testid="fit-provenance">
      <p>
        <span className="rounded bg-lux-dark px-1.5 py-0.5 text-xs font-semibold text-white">from a fit</span> to{" "}
        {fit.measurementSets.map((m) => m.name).join(", ")} ({countOf(fit.pointCount, noun("point"))}), fitted{" "}
        <DateTime iso={fit.fittedAt} />
      </p>
      <ul className="mt-1 space-y-0.5">
        {fit.free.map(({ key, min, max }) => {
          const meta = META.get(key);
          return (
            <li key={key} className="tabular-nums">
              {meta?.label ?? key}: {fmt(fit.values[key], 5)} ± {fmt(fit.sigmas[key], 2)}
              {meta?.unit ? ` ${meta.unit}` : ""}
              {min !== undefined || max !== undefined ? (
                <span className="text-ink-soft">
                  {" "}
                  (bounds {min ?? "−∞"} … {max ?? "∞"})
                </span>
              ) : null}
            </li>
          );
        })}
      </ul>
      <p className="mt-1 text-ink-soft">
        χ² = {fmt(fit.chi2)} for {fit.dof} degrees of freedom (reduced {fmt(fit.reducedChi2, 3)}); σ{" "}
        {fit.sigmaScaledByChi2 ? "scaled by √(χ²/dof)" : "from the data's σ, not scaled"}.
        {fit.separable ? "" : " In this model the data could not separate the electric- and magnetic-dipole parts."}
      </p>
      <FitFindings fit={fit} />
      {scaleLabel ? <p className="mt-1 text-xs font-semibold text-ember">{scaleLabel}</p> : null}
    </div>
  );
}

function FitFindings({ fit }: { fit: FitProvenance }) {
  const ms = fit.profile?.magneticScale;
  const unverified = (fit.assumptions ?? []).filter((a) => isUnverifiedSource(a.source));
  return (
    <>
      {fit.comparison?.length ? (
        <ul className="mt-1 space-y-0.5">
          {fit.comparison.map((c) => (
            <li key={c.hypothesis}>{c.words}</li>
          ))}
        </ul>
      ) : null}
      {ms || fit.goodnessOfFit ? (
        <p className="mt-1 text-ink-soft tabular-nums">
          {ms ? `magneticScale 68 % profile interval [${fmt(ms.interval68[0])}, ${fmt(ms.interval68[1])}]. ` : ""}
          {fit.goodnessOfFit ? `P(χ² > ${fmt(fit.goodnessOfFit.chi2)}) = ${fmtProbability(fit.goodnessOfFit.pValue)}.` : ""}
        </p>
      ) : null}
      {fit.priors?.length ? (
        <p className="mt-1 text-ink-soft">
          Priors: {fit.priors.map((p) => `${fitNameLabel(p.key)} ${fmt(p.mean)} ± ${fmt(p.sigma, 2)}`).join("; ")}.
        </p>
      ) : null}
      {unverified.length > 0 ? (
        <p className="mt-1 text-ink-soft">
          Held at values whose source is unverified: {unverified.map((a) => `${fitNameLabel(a.key)} = ${String(a.value)}`).join("; ")}.
        </p>
      ) : null}
    </>
  );
}
