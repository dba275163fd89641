import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID } from "@/db/demo-data";
import { axeFindings, describeFindings } from "./axe";
import { dataLoaded, outputPath, useBrowser } from "./support";

/*
 * axe-core over the main pages, each with its data loaded: no serious or critical finding, and
 * none of the two lesser rules held at zero (tests/e2e/axe.ts). Then the dates: shown in the
 * browser's locale and time zone, with the zone named.
 */

const PAGES = [
  "/parameter-sets",
  `/parameter-sets/${DEMO_GARNET_SET_ID}`,
  `/parameter-sets/${DEMO_GARNET_SET_ID}/history`,
  `/parameter-sets/${DEMO_GARNET_SET_ID}/report`,
  `/workbench/${DEMO_GARNET_SET_ID}`,
  "/measurement-sets",
  `/planner?setId=${DEMO_GARNET_SET_ID}`,
  "/lab-runs",
  "/lab",
  "/audit",
  "/settings",
];

describe("accessibility (axe-core)", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("owner");
  });

  it("finds nothing serious or critical on the main pages", async () => {
    const problems: string[] = [];
    for (const href of PAGES) {
      await page.goto(href, { timeout: 120_000 });
      await page.getByRole("heading", { level: 1 }).first().waitFor({ timeout: 60_000 });
      await dataLoaded(page, 60_000);
      for (const line of describeFindings(await axeFindings(page))) problems.push(`${href}: ${line}`);
    }
    if (problems.length > 0) console.log(problems.join("\n"));
    expect(problems).toEqual([]);
  });

  it("finds nothing serious or critical on the sign-in page", async () => {
    const guest = await browser.guestPage();
    await guest.goto("/sign-in");
    await guest.getByRole("heading", { level: 1 }).first().waitFor();
    expect((await axeFindings(guest)).map((v) => v.id)).toEqual([]);
  });

  it("shows dates in the browser's locale and time zone", async () => {
    const berlin = await browser.signedInPage("owner", { context: { locale: "de-DE", timezoneId: "Europe/Berlin" } });
    try {
      await berlin.goto(`/parameter-sets/${DEMO_GARNET_SET_ID}/history`);
      const first = berlin.locator("time").first();
      await first.waitFor({ timeout: 60_000 });
      const iso = await first.getAttribute("datetime");
      expect(iso).toBeTruthy();
      const expected = new Intl.DateTimeFormat("de-DE", {
        year: "numeric",
        month: "short",
        day: "numeric",
        hour: "2-digit",
        minute: "2-digit",
        timeZoneName: "short",
        timeZone: "Europe/Berlin",
      }).format(new Date(iso!));
      await expect.poll(() => first.textContent()).toBe(expected);
      // A German date names a German zone abbreviation (MEZ in winter, MESZ in summer).
      expect(expected).toMatch(/MESZ|MEZ/);
    } catch (error) {
      await berlin.screenshot({ path: outputPath("dates-failure.png"), fullPage: true });
      throw error;
    }
  });
});
