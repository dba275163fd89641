/*
 * Counts with their nouns: "1 entry", "2 entries", "0 entries". One home for the rule, so no
 * screen says "1 invitations shown" or "1 field differ". English only, as every screen is; the
 * plural category comes from Intl.PluralRules (en: "one" for exactly 1, "other" otherwise).
 */

export interface Noun {
  one: string;
  other: string;
}

const RULES = new Intl.PluralRules("en");

/** A noun with its plural; the plural defaults to the singular + "s". */
export function noun(one: string, other = `${one}s`): Noun {
  return { one, other };
}

/** The form of `word` that goes with `count`. */
export function pluralForm(count: number, word: Noun): string {
  return RULES.select(count) === "one" ? word.one : word.other;
}

/** "1 entry", "3 entries"; the count as given (pass a formatted number as the third argument). */
export function countOf(count: number, word: Noun, shownCount: string = String(count)): string {
  return `${shownCount} ${pluralForm(count, word)}`;
}

/** A verb agreeing with its count: agree(1, "differs", "differ") → "differs". */
export function agree(count: number, one: string, other: string): string {
  return pluralForm(count, { one, other });
}
