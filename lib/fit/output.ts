import type { FitReport } from "./report";

/*
 * The fit report as JSON for programs: the command line (`npm run fit`) prints it and
 * POST /api/compute/fit answers with it, so both speak one documented shape (README, "Fit command line").
 */

const pair = (v: [number, number] | undefined | null) => (v ? [v[0], v[1]] : null);

/** The fit's JSON, as the command line prints it and POST /api/compute/fit answers: exactly the documented keys. */
export function fitOutput(report: FitReport) {
  const ms = report.profile.magneticScale;
  return {
    free: report.free,
    values: report.values,
    sigmas: report.sigmas,
    correlation: report.correlation,
    chi2: report.chi2,
    dof: report.dof,
    converged: report.converged,
    sigmaScaledByChi2: report.sigmaScaledByChi2,
    sets: report.sets,
    notes: report.notes,
    assumptions: report.assumptions.map((a) => ({ key: a.key, value: a.value, source: a.source })),
    ...(report.comparison.length > 0
      ? {
          comparison: report.comparison.map((c) => ({
            hypothesis: c.hypothesis,
            fixed: c.fixed,
            chi2: c.chi2,
            deltaChi2: c.deltaChi2,
            pValue: c.pValue,
            significanceSigma: c.significanceSigma,
            aic: c.aic,
            aicc: c.aicc,
            bic: c.bic,
            words: c.words,
          })),
        }
      : {}),
    informationCriteria: {
      aic: report.informationCriteria.aic,
      aicc: report.informationCriteria.aicc,
      bic: report.informationCriteria.bic,
    },
    goodnessOfFit: report.goodnessOfFit,
    profile: ms ? { magneticScale: { value: ms.value, interval68: pair(ms.interval68), interval95: pair(ms.interval95) } } : {},
    verdict: report.verdict,
    points: report.points.map((p, i) => {
      const share = report.shareProfiles[report.pointShareProfile[i] ?? -1];
      return {
        set: p.set,
        wavelengthNm: p.wavelengthNm,
        measured: p.measured,
        sigma: p.sigma,
        model: p.model,
        magneticShare: p.magneticShare,
        magneticShareSigma: p.magneticShareSigma,
        magneticShareInterval68: share ? pair(share.interval68) : null,
      };
    }),
    shareCovariance: report.shareCovariance,
  };
}
