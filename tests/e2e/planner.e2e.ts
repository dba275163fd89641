import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID } from "@/db/demo-data";
import { outputPath, useBrowser } from "./support";

/*
 * The planner through the browser: an editor opens the planner on a demo set, runs it, sees a
 * ranked plan, what the model implies and the safety cautions, saves the plan, opens its points
 * in the workbench as markers and opens the printable report. Runs against a seeded server.
 */

const RUN_TIMEOUT = 120_000;

class PlannerPage {
  constructor(readonly page: Page) {}
  field(label: string) {
    return this.page.getByLabel(label, { exact: false });
  }
  get run() {
    return this.page.getByRole("button", { name: "Run planner" });
  }
  get plans() {
    return this.page.getByTestId("ranked-plan");
  }
  get cautions() {
    return this.page.getByRole("region", { name: "Safety cautions", exact: true }).first();
  }
}

describe("planner in the browser", () => {
  const browser = useBrowser();

  it("runs, ranks, shows cautions, saves, opens the plan in the workbench and prints a report", async () => {
    const page = await browser.signedInPage("editor");
    const planner = new PlannerPage(page);
    try {
      await page.goto(`/planner?setId=${DEMO_GARNET_SET_ID}`);
      await page.getByText(/Planning for/).waitFor({ timeout: 30_000 });
      // The demo lab's lines are offered.
      await page.getByLabel(/Nd:YAG “Old Faithful” \(1064 nm\)/).waitFor({ timeout: 30_000 });
      // The rotator's length for its default target, 45°, is printed once, not as "45°" and "target" twice.
      const rotator = page.getByRole("region", { name: "Rotator sizing" });
      await rotator.getByText("Verdet constant V").waitFor({ timeout: 30_000 });
      expect(await rotator.getByText("Length for 45°", { exact: true }).count()).toBe(1);
      await rotator.getByLabel(/Target angle/).fill("90");
      await rotator.getByText("Length for 90°", { exact: true }).waitFor();
      expect(await rotator.getByText("Length for 45°", { exact: true }).count()).toBe(1);

      // An impossible request first: zero points gets a specific message, and nothing runs.
      await page.getByLabel("Points you can afford").fill("0");
      await planner.run.click();
      await expect.poll(() => page.getByRole("alert", { name: "Problems with the request" }).innerText()).toMatch(/zero points/);

      await page.getByLabel("Points you can afford").fill("3");
      await planner.run.click();
      await planner.plans.first().waitFor({ timeout: RUN_TIMEOUT });
      expect(await planner.plans.count()).toBeGreaterThan(1);
      const firstPlan = planner.plans.first();
      expect(await firstPlan.innerText()).toMatch(/Plan 1\s+expected σ/);
      const note = page.getByRole("note", { name: "What the model implies" });
      // The demo garnet sets switch the diamagnetic term on, which gives T and B some separating power;
      // either way the note must say that the wavelength span is what separates the parts.
      expect(await note.innerText()).toMatch(
        /do not by themselves separate the parts: the wavelength span does|the wavelength span still does most of it/,
      );
      const cautions = await planner.cautions.innerText();
      expect(cautions).toMatch(/IEC 60825-1/);
      expect(cautions).toMatch(/0\.5 mT/);
      expect(cautions).toMatch(/asphyxiation/);
      expect(cautions).toMatch(/laser safety officer/);
      expect(await page.getByRole("img", { name: /Expected standard error against the number of points/ }).count()).toBe(1);
      await page.screenshot({ path: outputPath("planner-ranked.png"), fullPage: true });

      // The wavelengths of the best plan, from its table.
      const wavelengths = [...new Set((await firstPlan.locator("tbody tr td:nth-child(2)").allInnerTexts()).map((t) => t.trim()))];
      expect(wavelengths.length).toBeGreaterThanOrEqual(2);

      const planName = `Browser plan ${Date.now()}`;
      await page.getByLabel("Plan name").fill(planName);
      await page.getByRole("button", { name: "Save plan" }).click();
      await page.getByText(`Saved “${planName}”.`).waitFor({ timeout: 30_000 });
      await page.getByRole("region", { name: "Saved plans" }).getByText(planName).waitFor({ timeout: 30_000 });

      await page.getByRole("link", { name: "Open in workbench" }).first().click();
      await page.waitForURL(/\/workbench\/[0-9a-f-]{36}\?markers=/, { timeout: 30_000 });
      const markerTable = page.getByRole("table", { name: /Values at markers/ });
      await markerTable.waitFor({ timeout: RUN_TIMEOUT });
      for (const w of wavelengths) {
        await markerTable.getByRole("rowheader", { name: `${w} nm`, exact: true }).waitFor({ timeout: 30_000 });
      }

      // Back on the planner, the inputs and the last results are still there.
      await page.goto(`/planner?setId=${DEMO_GARNET_SET_ID}`);
      await planner.plans.first().waitFor({ timeout: 30_000 });
      expect(await page.getByLabel("Points you can afford").inputValue()).toBe("3");
      // The plan card shows the detection and the cost, each point its transmission.
      expect(await planner.plans.first().innerText()).toMatch(/Cost: about .* h of lab time/);
      expect(await page.getByRole("list", { name: "What the plans assume" }).innerText()).toMatch(/Analysis: free gyrationPerT/);

      await page.goto(`/parameter-sets/${DEMO_GARNET_SET_ID}/report`);
      await page.getByRole("heading", { name: "Saved measurement plan" }).waitFor({ timeout: 30_000 });
      await page.getByText(planName, { exact: false }).first().waitFor();
      await page.getByRole("heading", { name: "Verdet constant and its two parts" }).waitFor();
      await page.getByRole("region", { name: "Safety cautions", exact: true }).waitFor();
      // Print media hides the app rail and the controls.
      await page.emulateMedia({ media: "print" });
      expect(await page.getByRole("button", { name: "Print or save as PDF" }).isVisible()).toBe(false);
      expect(await page.getByRole("navigation").first().isVisible()).toBe(false);
      const pdf = await page.pdf({ preferCSSPageSize: true });
      expect(pdf.subarray(0, 4).toString()).toBe("%PDF");
      await page.screenshot({ path: outputPath("planner-report-print.png"), fullPage: true });
    } finally {
      await page.context().close();
    }
  });

  it("cancels a long search and keeps the page usable", async () => {
    const page = await browser.signedInPage("viewer");
    try {
      await page.goto(`/planner?setId=${DEMO_GARNET_SET_ID}`);
      await page.getByLabel(/Nd:YAG “Old Faithful” \(1064 nm\)/).waitFor({ timeout: 30_000 });
      // A fine grid: thousands of candidates, a greedy search of several seconds.
      await page.getByLabel("Temperatures given as").selectOption("range");
      await page.getByLabel("Temperature step").fill("2");
      await page.getByLabel("Field step").fill("0.1");
      await page.getByLabel("Magnet's largest field").fill("2.5");
      await page.getByLabel("Points you can afford").fill("20");
      await page.getByRole("button", { name: "Run planner" }).click();
      await page.getByRole("button", { name: "Cancel" }).click({ timeout: 10_000 });
      await page.getByText("Cancelled; nothing changed.").waitFor({ timeout: 10_000 });
      expect(await page.getByTestId("ranked-plan").count()).toBe(0);
      // A viewer reads the lab's lines but is offered no way to change them.
      expect(await page.getByRole("form", { name: "Add a light source" }).count()).toBe(0);
      expect(await page.getByText("Editors of the lab can add and remove lines.").count()).toBe(1);
    } finally {
      await page.context().close();
    }
  });

  it("fits a 390 px wide screen with a ranked plan on it", async () => {
    const page = await browser.signedInPage("viewer");
    try {
      await page.setViewportSize({ width: 390, height: 844 });
      await page.goto(`/planner?setId=${DEMO_GARNET_SET_ID}`);
      await page.getByLabel(/Nd:YAG “Old Faithful” \(1064 nm\)/).waitFor({ timeout: 30_000 });
      await page.getByLabel("Points you can afford").fill("3");
      await page.getByRole("button", { name: "Run planner" }).click();
      await page.getByTestId("ranked-plan").first().waitFor({ timeout: RUN_TIMEOUT });
      // Wide tables scroll inside their own box; the page itself never scrolls sideways.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await page.screenshot({ path: outputPath("planner-390.png"), fullPage: true });
    } finally {
      await page.context().close();
    }
  });
});
