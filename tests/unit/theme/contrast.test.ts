import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { AA_NORMAL_TEXT, contrastRatio, over } from "@/lib/theme/contrast";
import { themeColors } from "@/tailwind.config";

/*
 * Every text colour the screens use, against every surface it can sit on, reaches WCAG AA (4.5:1).
 * The text colours are found by scanning app/ and components/ for Tailwind text classes, so a new
 * class (or an opacity variant like text-ink/30) is checked without editing this test.
 * Surfaces are the opaque tokens; the translucent variants in use (bg-lux-light/50 and the like)
 * lie between a token and the white or paper under it, so they are lighter and no harder to read
 * on than the token itself.
 */

const ROOT = path.resolve(__dirname, "../../..");
const LIGHT_SURFACES = {
  paper: themeColors.paper.DEFAULT,
  "paper-raised": themeColors.paper.raised,
  "paper-sunk": themeColors.paper.sunk,
  "lux-light": themeColors.lux.light,
  "ember-light": themeColors.ember.light,
} as const;
const DARK_FILLS = { lux: themeColors.lux.DEFAULT, "lux-dark": themeColors.lux.dark, ember: themeColors.ember.DEFAULT } as const;

function tokenColour(name: string): string | undefined {
  if (name === "white") return "#ffffff";
  const [family, shade] = name.split("-") as [keyof typeof themeColors, string | undefined];
  const group = themeColors[family] as Record<string, string> | undefined;
  return group?.[shade ?? "DEFAULT"];
}

function sourceFiles(dir: string): string[] {
  return readdirSync(path.join(ROOT, dir)).flatMap((name) => {
    const rel = path.join(dir, name);
    return statSync(path.join(ROOT, rel)).isDirectory() ? sourceFiles(rel) : /\.tsx?$/.test(name) ? [rel] : [];
  });
}

/** "text-ink-soft", "text-ink/30", "placeholder:text-ink-faint", … as [token, alpha]. */
function textClassesInUse(): Map<string, { token: string; alpha: number }> {
  const found = new Map<string, { token: string; alpha: number }>();
  for (const file of [...sourceFiles("app"), ...sourceFiles("components")]) {
    const text = readFileSync(path.join(ROOT, file), "utf8");
    for (const m of text.matchAll(
      /\btext-((?:ink|paper|lux|ember)(?:-(?:soft|faint|raised|sunk|dark|light))?|white)(?:\/(\d+))?(?![\w-])/g,
    )) {
      found.set(m[0], { token: m[1]!, alpha: m[2] ? Number(m[2]) / 100 : 1 });
    }
  }
  return found;
}

describe("contrast ratio", () => {
  it("matches the WCAG definition at its end points and a known pair", () => {
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 10);
    expect(contrastRatio("#777777", "#777777")).toBe(1);
    // #767676 on white is the commonly quoted lightest grey that passes AA: 4.54:1 (common practice, no source).
    expect(contrastRatio("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
    expect(over("#000000", 0.5, "#ffffff")).toBe("#808080");
  });
});

describe("theme text contrast (WCAG AA, 4.5:1)", () => {
  const classes = textClassesInUse();

  it("finds the text classes the screens use", () => {
    expect([...classes.keys()]).toEqual(expect.arrayContaining(["text-ink-soft", "text-ember", "text-lux-dark"]));
  });

  for (const [cls, { token, alpha }] of classes) {
    const colour = tokenColour(token);
    // Light text only ever sits on the dark fills (buttons, the active tag); dark text on the light surfaces.
    const surfaces = token === "white" || token.startsWith("paper") ? DARK_FILLS : LIGHT_SURFACES;
    it(`${cls} on ${Object.keys(surfaces).join(", ")}`, () => {
      expect(colour, `${token} is not a theme colour`).toBeDefined();
      for (const [name, bg] of Object.entries(surfaces)) {
        const shown = alpha < 1 ? over(colour!, alpha, bg) : colour!;
        expect(contrastRatio(shown, bg), `${cls} on ${name}`).toBeGreaterThanOrEqual(AA_NORMAL_TEXT);
      }
    });
  }

  it("keeps the plot's axis text and banner readable on the white plot background", () => {
    const axes = readFileSync(path.join(ROOT, "components/plots/axes.tsx"), "utf8");
    const frame = readFileSync(path.join(ROOT, "components/plots/plot-frame.tsx"), "utf8");
    const colours = [
      ...axes.matchAll(/const (?:INK|SOFT) = "(#[0-9a-f]{6})"/gi),
      ...frame.matchAll(/<text[^>]*fill="(#[0-9a-f]{6})"/gi),
    ].map((m) => m[1]!);
    expect(colours.length).toBeGreaterThanOrEqual(3);
    for (const c of colours) expect(contrastRatio(c, "#ffffff"), c).toBeGreaterThanOrEqual(AA_NORMAL_TEXT);
  });
});
