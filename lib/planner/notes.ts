import type { ModelParams } from "@/lib/physics/schema";
import type { LineRatio, PlanCandidate, RankedPlan } from "./plan-result";
import type { PlanCriterion, PlanRequest } from "./schema";

/* The planner's words: the criterion's label and unit, and what the model implies for a request. */

/** The label and unit of the criterion, as the results show them. */
export function criterionText(criterion: PlanCriterion): { label: string; unit: string } {
  switch (criterion.kind) {
    case "share":
      return { label: `σ of the magnetic share at ${criterion.wavelengthNm} nm`, unit: "(fraction)" };
    case "magneticScale":
      return { label: "σ of magneticScale", unit: "(×)" };
    case "dOptimal":
      return { label: "D-optimal: geometric mean of the relative σ of the free parameters", unit: "(relative)" };
  }
}

const hasDiamagneticTerm = (params: ModelParams) => (params as Record<string, unknown>).diamagneticTerm === true;

const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : "∞");

/** What the model implies for this request, in words. */
export function planNotes(o: {
  request: PlanRequest;
  candidates: PlanCandidate[];
  plans: RankedPlan[];
  lineRatios: LineRatio[];
}): string[] {
  const { request } = o;
  const notes: string[] = [];
  const diamagnetic = hasDiamagneticTerm(request.params);
  const keys = new Set(request.freeKeys);
  const separatesParts = keys.has("gyrationPerT") && keys.has("magneticScale");
  if (!diamagnetic) {
    notes.push(
      "In this model both parts scale with the static magnetization M0, so a lower temperature and a higher field raise the signal " +
        "but do not by themselves separate the parts: the wavelength span does.",
    );
  } else {
    notes.push(
      "The diamagnetic term is on: it does not scale with M0, so temperature and field also change the magnetic share " +
        "and carry some separating information; the wavelength span still does most of it.",
    );
  }
  const wavelengths = new Set(request.lines.map((l) => l.wavelengthNm));
  if (wavelengths.size === 1 && separatesParts && !diamagnetic) {
    notes.push(
      `Only one wavelength (${[...wavelengths][0]} nm): at one wavelength every temperature and field gives the two parts ` +
        "in the same ratio, so no set of points can tell them apart. Add a second line.",
    );
  }
  const ratios = o.lineRatios.filter((r) => r.magneticOverElectric !== null);
  if (ratios.length >= 2) {
    const sorted = [...ratios].sort((a, b) => a.magneticOverElectric! - b.magneticOverElectric!);
    const lo = sorted[0]!;
    const hi = sorted[sorted.length - 1]!;
    notes.push(
      "The ratio of the magnetic to the electric part runs " +
        `from ${fmt(lo.magneticOverElectric!)} (${lo.lineName}, ${lo.wavelengthNm} nm) ` +
        `to ${fmt(hi.magneticOverElectric!)} (${hi.lineName}, ${hi.wavelengthNm} nm); ` +
        "the wider that spread between the chosen lines, the better the parts separate.",
    );
  }
  const best = o.plans[0];
  if (best && !best.separable) {
    notes.push(
      `No plan of ${request.points} point(s) separates the free parameters (${request.freeKeys.join(", ")}): ` +
        "their effects on the rotation are proportional at every candidate point.",
    );
  }
  if (best?.separable && o.candidates.length > 0 && !diamagnetic) {
    const minT = Math.min(...o.candidates.map((c) => c.temperatureK));
    const maxAbsB = Math.max(...o.candidates.map((c) => Math.abs(c.fieldT)));
    if (best.points.every((pt) => pt.temperatureK === minT && Math.abs(pt.fieldT) === maxAbsB)) {
      notes.push(
        `Every point of the best plan sits at the lowest temperature (${minT} K) and the highest field (${maxAbsB} T): ` +
          "there M0, and so the signal, is largest.",
      );
    }
  }
  if (best?.points.some((pt) => pt.belowNoise)) {
    notes.push(
      "Some points of the best plan are below the noise of one measurement (flagged): " +
        "they still add information through repetition, but check the noise figure.",
    );
  }
  return notes;
}
