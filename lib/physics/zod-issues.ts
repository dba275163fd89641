import type { z } from "zod";

/*
 * The one formatter of zod issues. Every place that shows or returns a failed parse goes through
 * these two, so a path reads the same ("params.temperatureK") on a form, in an API answer, in a
 * lab run's error and on the command line. It lives in lib/physics because the physics' own
 * request checks use it and the physics imports nothing from outside itself;
 * lib/contracts/validation.ts re-exports it for everyone else.
 */

type Issue = Pick<z.core.$ZodIssue, "path" | "message"> & { code?: string; keys?: readonly string[] };

const issuePath = (issue: Issue) => issue.path.map(String).join(".");

/** Issues → `fields` keyed by dotted path; the first message per field wins; "body" for the root. */
export function zodIssueFields(issues: readonly Issue[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) fields[issuePath(issue) || "body"] ??= issue.message;
  return fields;
}

export interface IssueLineOptions {
  /** How the root is named when the issue has no path; "(input)" unless given. */
  rootLabel?: string;
  /** A screen's own name for a path, where it has one. */
  label?: (path: string) => string | undefined;
  /** Said of each unknown key of a strict object, which is named as the field itself. */
  unknownKey?: string;
}

/** Issues → "path: message" lines; an unknown key of a strict object becomes a line of its own. */
export function zodIssueLines(issues: readonly Issue[], options: IssueLineOptions = {}): string[] {
  return issues.flatMap((issue) => {
    const path = issuePath(issue);
    if (issue.code === "unrecognized_keys" && issue.keys) {
      const prefix = path ? `${path}.` : "";
      return issue.keys.map((key) => `${prefix}${key}: ${options.unknownKey ?? "unknown key"}`);
    }
    const shown = (path && options.label?.(path)) || path || options.rootLabel || "(input)";
    return [`${shown}: ${issue.message}`];
  });
}
