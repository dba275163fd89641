import { FREEABLE_KEYS, type FreeableKey, type Prior } from "@/lib/analysis/definition";

/*
 * The short texts a scientist types for priors ("KEY=MEAN:SIGMA") and prior ranges
 * ("KEY=MIN:MAX"), shared by the planner screen and the plan command line. Each problem is thrown
 * as a TextInputError whose message names it.
 */

export class TextInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "TextInputError";
  }
}

const isFreeable = (key: string): key is FreeableKey => (FREEABLE_KEYS as readonly string[]).includes(key);

function keyPair(text: string, shape: string, example: string): [FreeableKey, number, number] {
  const match = /^\s*([A-Za-z]+)\s*=\s*([^:]+):(.+)$/.exec(text);
  if (!match) throw new TextInputError(`"${text.trim()}" is not ${shape} (e.g. ${example})`);
  const [, key, first, second] = match;
  if (!isFreeable(key!)) throw new TextInputError(`"${key}" is not a model parameter (choose from ${FREEABLE_KEYS.join(", ")})`);
  const a = Number(first!.trim());
  const b = Number(second!.trim());
  if (!Number.isFinite(a) || !Number.isFinite(b) || first!.trim() === "" || second!.trim() === "")
    throw new TextInputError(`"${text.trim()}": both numbers of ${shape} must be numbers`);
  return [key as FreeableKey, a, b];
}

/** One prior, "KEY=MEAN:SIGMA". */
export function parsePriorText(text: string): Prior {
  const [key, mean, sigma] = keyPair(text, "KEY=MEAN:SIGMA", "oscillatorWavelengthNm=258:10");
  if (!(sigma > 0)) throw new TextInputError(`the σ of ${key} must be > 0`);
  return { key, mean, sigma };
}

/** One prior range, "KEY=MIN:MAX". */
export function parseRangeText(text: string): { key: FreeableKey; min: number; max: number } {
  const [key, min, max] = keyPair(text, "KEY=MIN:MAX", "magneticScale=0:3");
  if (!(min < max)) throw new TextInputError(`the range of ${key} must start below its end`);
  return { key, min, max };
}

/** A comma-separated list of such texts (empty text: none). */
export const splitList = (text: string) =>
  text
    .split(",")
    .map((s) => s.trim())
    .filter((s) => s.length > 0);
