import { createRequire } from "node:module";
import type { Page } from "playwright-core";

/*
 * axe-core (from npm, injected into the page through playwright-core): the findings a browser
 * test holds at zero. Serious and critical ones, and two rules of lesser impact that were found on
 * these pages before: landmarks that share a name (landmark-unique) and links told from the text
 * around them by colour alone (link-in-text-block).
 */

const AXE_SOURCE: string = createRequire(import.meta.url)("axe-core").source;
const ALWAYS_ZERO = new Set(["landmark-unique", "link-in-text-block"]);

export interface AxeFinding {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

export async function axeFindings(page: Page): Promise<AxeFinding[]> {
  await page.addScriptTag({ content: AXE_SOURCE });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document) => Promise<{ violations: AxeFinding[] }> } }).axe;
    const result = await axe.run(document);
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  });
  return violations.filter((v) => v.impact === "serious" || v.impact === "critical" || ALWAYS_ZERO.has(v.id));
}

/** The findings as lines a failed expectation prints: rule, impact, help and the elements. */
export const describeFindings = (findings: AxeFinding[]): string[] =>
  findings.map((v) => `${v.id} (${v.impact}) ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
