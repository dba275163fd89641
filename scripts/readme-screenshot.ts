/*
 * Takes the README's screenshot (public/screenshots/workbench.png) from a running server with the
 * demo seed: the workbench of the handbook terbium gallium garnet set, as the demo editor, at
 * 1440 × 900, after the numerical run has finished.
 *
 *   npx tsx scripts/readme-screenshot.ts [base URL, default http://localhost:3000]
 */
import path from "node:path";
import { launchChromium } from "./chromium";

const baseURL = process.argv[2] ?? "http://localhost:3000";
const out = path.resolve("public/screenshots/workbench.png");

const browser = await launchChromium();
try {
  const context = await browser.newContext({ baseURL, viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("postdoc@demo.gyrolux.test");
  await page.getByLabel("Password").fill("gyrolux-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 30_000 });
  const setId = await page.evaluate(async () => {
    const r = await fetch("/api/parameter-sets?q=terbium", { headers: { Accept: "application/json" } });
    const body = (await r.json()) as { items: { id: string; name: string }[] };
    const tgg = body.items.filter((s) => s.name.toLowerCase().includes("terbium gallium garnet"));
    return (tgg.find((s) => s.name.toLowerCase().includes("handbook")) ?? tgg[0])?.id ?? null;
  });
  if (!setId) throw new Error("no handbook terbium gallium garnet set: is the demo seeded?");
  await page.goto(`/workbench/${setId}`, { timeout: 120_000 });
  await page.getByText(/^numerical, max deviation from linear response: \d/).waitFor({ timeout: 180_000 });
  await page.getByRole("progressbar", { name: "Numerical run progress" }).waitFor();
  await page.waitForTimeout(500);
  await page.screenshot({ path: out });
  console.log(`wrote ${out}`);
} finally {
  await browser.close();
}
