import { describe, expect, it } from "vitest";
import { DEMO_LAB } from "@/db/demo-data";
import { outputPath, useBrowser } from "./support";

/*
 * The material library in the browser: /materials lists the cited materials with their sources,
 * and "New parameter set from this material" opens the new set, whose history says where it came from.
 */

describe("material library", () => {
  const browser = useBrowser();

  it("lists the materials with sources and copies one into a lab", async () => {
    const page = await browser.signedInPage("editor");
    await page.goto("/materials");
    const garnet = page.getByRole("article", { name: /Terbium gallium garnet/ });
    await garnet.waitFor({ timeout: 30_000 });
    await garnet.getByText("Values and their sources").click();
    expect(await garnet.innerText()).toContain("fitted here to wikiVerdet");
    await garnet.getByText("References").click();
    expect(await garnet.innerText()).toContain("Schlarb");
    expect(await page.getByRole("article").count()).toBeGreaterThanOrEqual(4);
    await page.screenshot({ path: outputPath("materials.png"), fullPage: true });

    const lab = garnet.getByLabel("Lab");
    if ((await lab.count()) > 0) await lab.selectOption({ label: DEMO_LAB.name });
    await garnet.getByRole("button", { name: "New parameter set from Terbium gallium garnet" }).click();
    await page.waitForURL(/\/parameter-sets\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    const setId = new URL(page.url()).pathname.split("/").pop()!;
    await page.goto(`/parameter-sets/${setId}/history`);
    const provenance = page.getByTestId("material-provenance");
    await provenance.waitFor({ timeout: 30_000 });
    expect(await provenance.innerText()).toMatch(/from material Terbium gallium garnet, library version \d/);
  });
});
