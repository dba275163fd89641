import type { ModelParams } from "@/lib/physics/schema";
import type { PlanCandidate, PlanResult } from "./plan-result";
import type { PlanCriterion, PlanRequest } from "./schema";

/*
 * The planner's words: the criterion's label and unit, and what the model implies for a request.
 * Every note that holds only within the model says "in this model" (a test checks it): real
 * materials break some of it, e.g. Van Vleck mixing of J multiplets in rare-earth garnets breaks
 * the proportionality of both parts to M0.
 */

/** The label and unit of the criterion, as the results show them. */
export function criterionText(criterion: PlanCriterion): { label: string; unit: string } {
  switch (criterion.kind) {
    case "share":
      return { label: `σ of the magnetic share at ${criterion.wavelengthNm} nm`, unit: "(fraction)" };
    case "magneticScale":
      return { label: "σ of magneticScale", unit: "(×)" };
    case "dOptimal":
      return { label: "D-optimal: geometric mean of the relative σ of the varied parameters", unit: "(relative)" };
    case "detect":
      return { label: "detect the magnetic-dipole part: 1/(expected significance against magneticScale = 0)", unit: "(1/σ)" };
  }
}

const hasDiamagneticTerm = (params: ModelParams) => (params as Record<string, unknown>).diamagneticTerm === true;

const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : "∞");
const lineText = (l: { lineName: string; wavelengthNm: number }) =>
  l.lineName.includes(String(l.wavelengthNm)) ? l.lineName : `${l.lineName}, ${l.wavelengthNm} nm`;
const percent = (x: number) => `${fmt(100 * x, 2)} %`;

/** What the model implies for this request, in words. */
export function planNotes(o: { request: PlanRequest; candidates: readonly PlanCandidate[]; result: PlanResult }): string[] {
  const { request, result } = o;
  const notes: string[] = [];
  const diamagnetic = hasDiamagneticTerm(request.params);
  const keys = new Set(result.freeKeys);
  const separatesParts = keys.has("gyrationPerT") && keys.has("magneticScale");
  if (!diamagnetic) {
    notes.push(
      "In this model both parts scale with the static magnetization M0, so a lower temperature and a higher field raise the signal " +
        "but do not by themselves separate the parts: the wavelength span does (in real rare-earth garnets Van Vleck mixing " +
        "breaks that proportionality).",
    );
  } else {
    notes.push(
      "In this model the diamagnetic term is on: it does not scale with M0, so temperature and field also change the magnetic share " +
        "and carry some separating information; the wavelength span still does most of it.",
    );
  }
  const { lowTransmission, wrapped } = result.excluded;
  if (lowTransmission > 0) {
    notes.push(
      `${lowTransmission} of ${result.candidateCount} candidate points are never proposed: in this model less than ` +
        `${percent(request.optics.minTransmission)} of the light gets through the ${fmt(request.lengthM * 1000)} mm sample there.`,
    );
  }
  if (wrapped > 0) notes.push(`${wrapped} candidate points are excluded because in this model they rotate past π/2.`);
  if (o.candidates.length === 0) {
    notes.push(
      "No candidate point is left to plan with in this model: lower the minimum transmission, use a shorter sample or other lines.",
    );
    return notes;
  }
  const wavelengths = new Set(o.candidates.map((c) => c.wavelengthNm));
  if (wavelengths.size === 1 && separatesParts && !diamagnetic) {
    notes.push(
      `Only one usable wavelength (${[...wavelengths][0]} nm): in this model every temperature and field there gives the two parts ` +
        "in the same ratio, so no set of points can tell them apart. Add a second line.",
    );
  }
  const ratios = result.lineRatios.filter((r) => r.magneticOverElectric !== null);
  if (ratios.length >= 2) {
    const sorted = [...ratios].sort((a, b) => a.magneticOverElectric! - b.magneticOverElectric!);
    const lo = sorted[0]!;
    const hi = sorted[sorted.length - 1]!;
    notes.push(
      "In this model the ratio of the magnetic to the electric part runs " +
        `from ${fmt(lo.magneticOverElectric!)} (${lineText(lo)}) to ${fmt(hi.magneticOverElectric!)} (${lineText(hi)}) ` +
        "between the usable lines; " +
        "the wider that spread between the chosen lines, the better the parts separate.",
    );
  }
  const best = result.plans[0];
  if (best && !best.separable) {
    notes.push(
      `In this model no plan of ${request.points} point(s) separates the varied parameters (${result.freeKeys.join(", ")}): ` +
        "their effects on the rotation are proportional at every usable candidate point.",
    );
  }
  if (best?.separable && !diamagnetic) {
    const minT = Math.min(...o.candidates.map((c) => c.temperatureK));
    const maxAbsB = Math.max(...o.candidates.map((c) => Math.abs(c.fieldT)));
    if (best.points.every((pt) => pt.temperatureK === minT && Math.abs(pt.fieldT) === maxAbsB)) {
      notes.push(
        `Every point of the best plan sits at the lowest temperature (${minT} K) and the highest field (${maxAbsB} T): ` +
          "in this model M0, and so the signal, is largest there.",
      );
    }
  }
  if (best?.detection) {
    const d = best.detection;
    const repeats = (r: number | null) => (r === null ? "not reachable with these priors" : `${r}×`);
    notes.push(
      `In this model the best plan would detect the magnetic-dipole part at ${fmt(d.significance)}σ against magneticScale = 0 ` +
        `(expected Δχ² ${fmt(d.deltaChi2Null)} for magneticScale = ${fmt(d.alternative)}); repeating the plan ` +
        `${repeats(d.repeatsFor3Sigma)} gives 3σ, ${repeats(d.repeatsFor5Sigma)} gives 5σ.`,
    );
    if (request.definition.priors.some((p) => p.key === "magneticScale"))
      notes.push(
        "The prior on magneticScale sets the alternative of the detection but adds no information to it: in this model the data " +
          "alone must detect it.",
      );
  }
  if (best?.points.some((pt) => pt.flags.includes("phase-wrap"))) {
    notes.push(
      "Some points of the best plan rotate past π/2 in this model (flagged): a single reading is ambiguous by multiples of π, " +
        "so measure them with a field sweep to unwrap, or exclude such points.",
    );
  }
  if (best?.points.some((pt) => pt.belowNoise)) {
    notes.push(
      "In this model some points of the best plan rotate less than the noise of one measurement (flagged): " +
        "they still add information through repetition, but check the noise figure.",
    );
  }
  const ends = result.robust?.ends ?? [];
  if (result.robust && ends.length > 0) {
    const list = ends.map((e) => `${e.key} = ${fmt(e.value)}: σ ${fmt(e.expectedSigma)}`).join("; ");
    notes.push(
      `In this model the plans are ranked by the ${result.robust.mode === "worst" ? "worst case" : "average"} of the criterion ` +
        `over ${result.robust.samples} seeded samples of the prior ranges; the best plan at the ranges' ends: ${list}.`,
    );
  }
  return notes;
}
