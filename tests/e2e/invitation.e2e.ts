import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID, DEMO_LAB } from "@/db/demo-data";
import { outputPath, useBrowser } from "./support";

/*
 * Sharing through the browser: the lab owner invites someone by e-mail, the test opens the link
 * from the message the local mail catcher stored, signs up with the invited address and lands in
 * the invited lab (its only lab); removed from it, the person creates a personal lab. Then an
 * editor makes a read-only share link that works signed out.
 */

const LAB_NAME = DEMO_LAB.name;
const MAIL_DIR = process.env.GYROLUX_MAIL_DIR ?? `/tmp/gyrolux-mail-${process.env.GYROLUX_SMTP_PORT ?? "2525"}`;

async function mailLink(to: string, prefix: string): Promise<string> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const names = (await readdir(MAIL_DIR).catch(() => [] as string[])).filter((name) => name.endsWith(".json"));
    for (const name of names) {
      const mail = JSON.parse(await readFile(path.join(MAIL_DIR, name), "utf8")) as { to: string[]; text: string };
      const match = new RegExp(`https?://[^\\s]+(${prefix}/[A-Za-z0-9_-]{43})`).exec(mail.text);
      if (mail.to.includes(to) && match?.[1]) return match[1];
    }
    if (Date.now() > deadline) throw new Error(`no ${prefix} mail to ${to} in ${MAIL_DIR}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

class LabPage {
  constructor(readonly page: Page) {}
  get inviteForm() {
    return this.page.getByRole("form", { name: `Invite someone to ${LAB_NAME}` });
  }
}

describe("invitations and share links in the browser", () => {
  const browser = useBrowser();

  it("the owner invites, the invitee signs up from the e-mail into the lab; removed, they make a personal lab", async () => {
    const email = `invitee-${Date.now()}@e2e.gyrolux.test`;
    // Unique: the integration tests add members of the same name to the demo lab.
    const name = `Invited Viewer ${Date.now().toString(36)}`;
    const owner = await browser.signedInPage("owner");
    const invitee = await browser.guestPage();
    try {
      await owner.goto("/lab");
      const lab = new LabPage(owner);
      await lab.inviteForm.getByLabel("E-mail address").fill(email);
      await lab.inviteForm.getByLabel("Role").selectOption("viewer");
      await lab.inviteForm.getByRole("button", { name: "Send invitation" }).click();
      await owner.getByText(`Invitation sent to ${email}.`).waitFor({ timeout: 30_000 });
      await owner.getByText(email, { exact: true }).first().waitFor();

      const link = await mailLink(email, "/invite");
      await invitee.goto(link);
      await invitee.getByRole("heading", { name: "Invitation to a lab" }).waitFor();
      await invitee.getByRole("link", { name: "Create an account" }).click();
      await invitee.waitForURL("**/sign-up?**");
      expect(await invitee.getByLabel("E-mail").inputValue()).toBe(email);
      await invitee.getByLabel("Name").fill(name);
      await invitee.getByLabel("Password", { exact: true }).fill("invited viewer passphrase");
      await invitee.getByLabel("Confirm password").fill("invited viewer passphrase");
      await invitee.getByRole("button", { name: "Create account" }).click();

      // Signed up through the invitation: straight into the invited lab, the only one (no personal lab).
      await invitee.waitForURL("**/lab", { timeout: 30_000 });
      await invitee.getByRole("heading", { name: LAB_NAME }).waitFor({ timeout: 30_000 });
      await expect.poll(() => invitee.getByText("Your role: Viewer").count()).toBeGreaterThan(0);
      // One heading per lab section (the hidden dialogs have headings of their own).
      expect(await invitee.locator('main h2[id^="lab-"]').allTextContents()).toEqual([LAB_NAME]);
      await invitee.screenshot({ path: outputPath("invitation-accepted.png"), fullPage: true });

      // The link worked once.
      await invitee.goto(link);
      await invitee.getByText("This invitation has already been used.").waitFor();

      // Removed from the only lab, the person is offered a personal lab of their own.
      await owner.reload();
      await owner.getByRole("button", { name: `Remove ${name}` }).click();
      await owner.getByRole("button", { name: "Remove member" }).click();
      await owner.getByRole("button", { name: `Remove ${name}` }).waitFor({ state: "detached", timeout: 30_000 });
      await invitee.goto("/lab");
      await invitee.getByRole("heading", { name: "You are not a member of any lab" }).waitFor({ timeout: 30_000 });
      await invitee.getByRole("button", { name: "Create a personal lab" }).click();
      await invitee.getByRole("heading", { name: `${name}'s lab` }).waitFor({ timeout: 30_000 });
      await expect.poll(() => invitee.getByText("Your role: Owner").count()).toBeGreaterThan(0);
      await invitee.screenshot({ path: outputPath("personal-lab-after-removal.png"), fullPage: true });
    } finally {
      await owner.context().close();
      await invitee.context().close();
    }
  });

  it("an editor's share link opens the read-only workbench signed out, and stops when revoked", async () => {
    const editor = await browser.signedInPage("editor");
    const guest = await browser.guestPage({ context: { viewport: { width: 390, height: 844 } } });
    const problems: string[] = [];
    guest.on("console", (message) => {
      if (message.type() === "error") problems.push(message.text());
    });
    try {
      await editor.goto(`/parameter-sets/${DEMO_GARNET_SET_ID}`);
      await editor.getByRole("button", { name: "Make a share link" }).click();
      const url = await editor.getByLabel("New share link").inputValue();
      const sharedPath = new URL(url).pathname;

      await guest.goto(sharedPath);
      await guest.getByRole("heading", { level: 1, name: /Terbium gallium garnet/ }).waitFor({ timeout: 30_000 });
      await guest.getByText(/Shared read-only/).waitFor();
      expect(await guest.getByText("Lindqvist Moor").count()).toBe(0);
      expect(await guest.getByRole("button", { name: "Save as new parameter set" }).count()).toBe(0);
      // The analytic spectrum and its plots render under the Content-Security-Policy.
      await guest.locator("svg").first().waitFor({ timeout: 60_000 });
      expect(problems.filter((text) => /Content Security Policy|Refused to/i.test(text))).toEqual([]);
      await guest.screenshot({ path: outputPath("shared-workbench-390.png"), fullPage: true });

      await editor
        .getByRole("button", { name: /^Revoke/ })
        .first()
        .click();
      await editor.getByRole("button", { name: "Revoke link" }).click();
      await editor.getByText("No live share links.").waitFor({ timeout: 30_000 });
      // The one-time copy box goes with the link it showed.
      expect(await editor.getByLabel("New share link").count()).toBe(0);
      const gone = await guest.goto(sharedPath);
      expect(gone?.status()).toBe(404);
    } finally {
      await editor.context().close();
      await guest.context().close();
    }
  });
});
