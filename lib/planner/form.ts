import { DEFAULT_FREE_KEYS, FREEABLE_KEYS, type FreeableKey, NATURAL_LOWER } from "@/lib/analysis/definition";
import type { ModelParams } from "@/lib/physics/schema";
import { parseNumber } from "@/lib/workbench/validate";
import type { PlanLine, PlanRequestInput } from "./schema";
import { TextInputError, parsePriorText, parseRangeText, splitList } from "./text-input";

/*
 * The planner screen's inputs as typed (strings, so a half-typed number is kept as it is) and
 * their translation into a planner request. Pure: the screen keeps the drafts, the schema judges
 * the request; only the short texts (priors, ranges, a temperature list) are read here, and their
 * problems come back as field-named messages.
 */

export interface PlannerDrafts {
  tMode: "range" | "set";
  tMin: string;
  tMax: string;
  tStep: string;
  tSet: string;
  bMin: string;
  bMax: string;
  bStep: string;
  lengthMm: string;
  noiseKind: "density" | "sigma";
  densityUrad: string;
  integrationS: string;
  sigmaUrad: string;
  relativeFloorPct: string;
  minTransmissionPct: string;
  excludeWrapped: boolean;
  referencePowerMw: string;
  points: string;
  criterion: "detect" | "share" | "magneticScale" | "dOptimal";
  shareNm: string;
  alternative: string;
  free: FreeableKey[];
  priors: string;
  scaleSigmaPct: string;
  temperatureSigmaK: string;
  robustMode: "off" | "average" | "worst";
  robustRanges: string;
  robustSamples: string;
  perPointS: string;
  perCooldownH: string;
}

export function defaultPlannerDrafts(params: ModelParams): PlannerDrafts {
  return {
    tMode: "set",
    tMin: String(Math.max(10, Math.ceil(params.curieWeissK + 1))),
    tMax: "300",
    tStep: "10",
    tSet: "293.15, 77",
    bMin: "0.5",
    bMax: "2",
    bStep: "0.5",
    lengthMm: String(Number((params.lengthM * 1000).toPrecision(6))),
    noiseKind: "density",
    densityUrad: "1",
    integrationS: "1",
    sigmaUrad: "1",
    relativeFloorPct: "0.1",
    minTransmissionPct: "1",
    excludeWrapped: false,
    referencePowerMw: "",
    points: "6",
    criterion: "detect",
    shareNm: "1064",
    alternative: "",
    free: [...DEFAULT_FREE_KEYS],
    priors: "",
    scaleSigmaPct: "0",
    temperatureSigmaK: "0",
    robustMode: "off",
    robustRanges: "magneticScale=0.2:3",
    robustSamples: "8",
    perPointS: "60",
    perCooldownH: "1.5",
  };
}

/** A number as typed, NaN when it is not one (the schema then names the field). */
export const readNumber = (s: string): number => parseNumber(s) ?? Number.NaN;

/** The fit's default free keys first, in its order, then the others in the model's order. */
const freeInFitOrder = (free: readonly FreeableKey[]) => [
  ...DEFAULT_FREE_KEYS.filter((k) => free.includes(k)),
  ...FREEABLE_KEYS.filter((k) => free.includes(k) && !DEFAULT_FREE_KEYS.includes(k)),
];

function readList<T>(text: string, field: string, read: (s: string) => T, issues: string[]): T[] {
  const out: T[] = [];
  for (const part of splitList(text)) {
    try {
      out.push(read(part));
    } catch (err) {
      if (err instanceof TextInputError) issues.push(`${field}: ${err.message}`);
      else throw err;
    }
  }
  return out;
}

/** The request the drafts describe, or the problems of the short texts. */
export function planRequestFromDrafts(
  d: PlannerDrafts,
  params: ModelParams,
  lines: PlanLine[],
): { ok: true; input: PlanRequestInput } | { ok: false; issues: string[] } {
  const issues: string[] = [];
  const priors = readList(d.priors, "Priors", parsePriorText, issues);
  const ranges = readList(d.robustRanges, "Prior ranges", parseRangeText, issues);
  const temps = d.tMode === "set" ? splitList(d.tSet.replace(/;/g, ",")).map(readNumber) : [];
  if (d.tMode === "set" && temps.some((t) => !Number.isFinite(t)))
    issues.push("Temperatures: give numbers in K separated by commas (e.g. 293.15, 77, 4.2)");
  if (d.robustMode !== "off" && ranges.length === 0) issues.push("Prior ranges: give at least one KEY=MIN:MAX for the robust design");
  if (issues.length > 0) return { ok: false, issues };
  const referencePowerW = d.referencePowerMw.trim() === "" ? undefined : readNumber(d.referencePowerMw) / 1000;
  const input: PlanRequestInput = {
    params,
    lines,
    temperatures:
      d.tMode === "set" ? { valuesK: temps } : { minK: readNumber(d.tMin), maxK: readNumber(d.tMax), stepK: readNumber(d.tStep) },
    fields: { minT: readNumber(d.bMin), maxT: readNumber(d.bMax), stepT: readNumber(d.bStep) },
    lengthM: readNumber(d.lengthMm) / 1000,
    noise:
      d.noiseKind === "density"
        ? { kind: "density", radPerSqrtHz: readNumber(d.densityUrad) * 1e-6, integrationS: readNumber(d.integrationS) }
        : { kind: "sigma", sigmaRad: readNumber(d.sigmaUrad) * 1e-6 },
    optics: {
      relativeFloor: readNumber(d.relativeFloorPct) / 100,
      minTransmission: readNumber(d.minTransmissionPct) / 100,
      excludeWrapped: d.excludeWrapped,
      ...(referencePowerW === undefined ? {} : { referencePowerW }),
    },
    points: readNumber(d.points),
    criterion:
      d.criterion === "share"
        ? { kind: "share", wavelengthNm: readNumber(d.shareNm) }
        : d.criterion === "detect"
          ? d.alternative.trim() === ""
            ? { kind: "detect" }
            : { kind: "detect", alternative: readNumber(d.alternative) }
          : { kind: d.criterion },
    definition: {
      free: freeInFitOrder(d.free).map((key) => (NATURAL_LOWER[key] === undefined ? { key } : { key, min: NATURAL_LOWER[key] })),
      priors,
      calibration: {
        scaleSigma: readNumber(d.scaleSigmaPct) / 100,
        temperatureSigmaK: readNumber(d.temperatureSigmaK),
        relativeFloor: 0,
      },
    },
    ...(d.robustMode === "off" ? {} : { robust: { mode: d.robustMode, samples: readNumber(d.robustSamples), seed: 1, ranges } }),
    labTime: { perPointS: readNumber(d.perPointS), perCooldownS: readNumber(d.perCooldownH) * 3600, ambientK: 293.15 },
  };
  return { ok: true, input };
}
