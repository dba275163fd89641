import { z } from "zod";

/*
 * Composition of fragments into one variant (server or scripts). Every fragment reads the same flat
 * environment; the result has one entry per fragment. All problems are collected and reported in
 * one error that names each variable (values are never printed: some are secrets).
 */

export type Environment = Record<string, string | undefined>;

type Fragments = Record<string, z.ZodType>;

export type SettingsOf<F extends Fragments> = { [K in keyof F]: z.output<F[K]> };

export class SettingsError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid settings in the environment:\n${problems.map((problem) => `  ${problem}`).join("\n")}`);
    this.name = "SettingsError";
  }
}

/** The reader of one variant: parses a flat environment into one entry per fragment. */
export function settingsReader<F extends Fragments>(fragments: F): (source: Environment) => SettingsOf<F> {
  const schema = z.object(fragments);
  return (source) => {
    const result = schema.safeParse(Object.fromEntries(Object.keys(fragments).map((name) => [name, source])));
    if (result.success) return result.data as SettingsOf<F>;
    // A variable two fragments share (DATABASE_URL) is reported once.
    const problems = new Set(
      result.error.issues.map((issue) => {
        const variable = String(issue.path[1] ?? issue.path[0]);
        return issue.message.includes(variable) ? issue.message : `${variable}: ${issue.message}`;
      }),
    );
    throw new SettingsError([...problems]);
  };
}
