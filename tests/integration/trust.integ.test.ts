import { describe, expect, it } from "vitest";
import {
  Client,
  DEMO,
  DEMO_LAB_ID,
  attemptSignIn,
  createApiToken,
  createSet,
  joinByInvitation,
  linkSecret,
  mailTo,
  signIn,
  signUp,
  uniqueEmail,
  waitForMail,
} from "./support";

/*
 * Regression tests of the second trust review: each case is one defect the attack run found
 * (numbers as in the review). All test clients share one socket address (127.0.0.1).
 */

const isFailure = (response: Response) => response.status === 302 && (response.headers.get("location") ?? "").includes("error=");
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe("sign-in and accounts", () => {
  it("1: the sign-in page never sends the browser to another host, and answers 200 for hostile targets", async () => {
    for (const target of ["%2F%09%2Fevil.test", "%2F%0D%2Fevil.test", "%2F%0A%2Fx", "%2F%E3%80%80%2Fevil.test", "%2F%5Cevil.test"]) {
      const page = await new Client().get(`/sign-in?callbackUrl=${target}`);
      expect(page.status, target).toBe(200);
      // The form posts back where to go after signing in: our default page, not the hostile target.
      expect(String(page.body), target).toContain('name="redirectTo" value="/parameter-sets"');
    }
  });

  it("2: a bogus reset token is refused before any password is hashed", async () => {
    const answers = await Promise.all(
      Array.from({ length: 10 }, () =>
        new Client().post("/api/password-reset/confirm", { token: "B".repeat(43), newPassword: "long enough pw" }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(Array(10).fill(400));
    expect(answers[0]!.body.error.fields.token).toMatch(/not valid/);
  });

  it("3: strangers' failures do not lock out a browser that signed in before", async () => {
    const account = await signUp();
    const usual = await signIn(account.email, account.password);
    expect(usual.hasCookie("glx_device")).toBe(true);
    for (let i = 0; i < 7; i++) await (await attemptSignIn(new Client(), account.email, `wrong ${i}`)).body?.cancel();
    // A fresh browser is slowed down…
    const stranger = await attemptSignIn(new Client(), account.email, account.password);
    expect(stranger.status).toBe(429);
    // …but the owner's own browser, with its device cookie, signs in at once.
    const again = new Client();
    again.setCookies(`glx_device=${usual.cookieHeader().match(/glx_device=([^;]+)/)![1]}`);
    const owner = await attemptSignIn(again, account.email, account.password);
    expect(owner.status).toBe(302);
    expect(owner.headers.get("location") ?? "").not.toContain("error=");
  });

  it("4: simultaneous wrong passwords get exactly the free number of password checks", async () => {
    const account = await signUp();
    const answers = await Promise.all(Array.from({ length: 25 }, (_, i) => attemptSignIn(new Client(), account.email, `wrong ${i}`)));
    const checked = answers.filter((a) => isFailure(a) && !(a.headers.get("location") ?? "").includes("rate_limited"));
    for (const answer of answers) await answer.body?.cancel();
    expect(checked).toHaveLength(5);
  });

  it("4: simultaneous reset requests for one address send at most the hourly limit of mails", async () => {
    const account = await signUp();
    const answers = await Promise.all(Array.from({ length: 20 }, () => new Client().post("/api/password-reset", { email: account.email })));
    expect(answers.every((a) => a.status === 202)).toBe(true);
    await waitForMail(account.email, { matching: /\/reset-password\//, count: 5 });
    await sleep(2000);
    expect((await mailTo(account.email)).filter((m) => m.text.includes("/reset-password/"))).toHaveLength(5);
  });

  it("7: a reset link mailed before a password change no longer works", async () => {
    const account = await signUp();
    await new Client().post("/api/password-reset", { email: account.email });
    const token = linkSecret(await waitForMail(account.email, { matching: /\/reset-password\// }), "/reset-password");
    const session = await signIn(account.email, account.password);
    const changed = await session.post(
      "/api/account/password",
      { currentPassword: account.password, newPassword: "changed in settings" },
      { headers: { origin: session.base } },
    );
    expect(changed.status).toBe(200);
    const late = await new Client().post("/api/password-reset/confirm", { token, newPassword: "attacker's choice" });
    expect(late.status).toBe(400);
    await expect(signIn(account.email, "changed in settings")).resolves.toBeInstanceOf(Client);
  });

  it("8: a password reset and sign-out-everywhere revoke API tokens", async () => {
    const account = await signUp();
    const session = await signIn(account.email, account.password);
    const { token } = await createApiToken(session);
    expect((await new Client(token).get("/api/labs")).status).toBe(200);
    await new Client().post("/api/password-reset", { email: account.email });
    const secret = linkSecret(await waitForMail(account.email, { matching: /\/reset-password\// }), "/reset-password");
    const reset = await new Client().post("/api/password-reset/confirm", { token: secret, newPassword: "after the reset" });
    expect(reset.status).toBe(200);
    expect(reset.body.tokensRevoked).toBe(1);
    expect((await new Client(token).get("/api/labs")).status).toBe(401);

    const next = await signIn(account.email, "after the reset");
    const second = await createApiToken(next);
    const ended = await next.post(`/api/users/${account.userId}/end-sessions`, {}, { headers: { origin: next.base } });
    expect(ended.status).toBe(204);
    expect((await new Client(second.token).get("/api/labs")).status).toBe(401);
  });

  it("15: an ended session's cookie is answered as signed out and not refreshed", async () => {
    const account = await signUp();
    const session = await signIn(account.email, account.password);
    const stolen = new Client();
    stolen.setCookies(session.cookieHeader());
    await session.post(`/api/users/${account.userId}/end-sessions`, {}, { headers: { origin: session.base } });
    const raw = await stolen.raw("GET", "/api/auth/session");
    expect(await raw.json()).toBeNull();
    const refreshed = raw.headers.getSetCookie().filter((line) => line.includes("session-token") && !/max-age=0/i.test(line));
    expect(refreshed).toEqual([]);
  });

  it("11: a cookie-authenticated change from our host on another scheme is refused", async () => {
    const account = await signUp();
    const session = await signIn(account.email, account.password);
    const otherScheme = session.base.replace(/^http:/, "https:");
    const refused = await session.post("/api/tokens", { name: "x" }, { headers: { origin: otherScheme } });
    expect(refused.status).toBe(403);
    expect((await session.post("/api/tokens", { name: "y" }, { headers: { origin: session.base } })).status).toBe(201);
  });
});

describe("mail", () => {
  it("5: an unconfirmed account cannot invite; a confirmed one can, within the limits per recipient", async () => {
    const fresh = await signUp({ confirmEmail: false });
    const refused = await fresh.client.post(
      `/api/labs/${fresh.labId}/invitations`,
      { email: uniqueEmail("x"), role: "viewer" },
      { headers: { origin: fresh.client.base } },
    );
    expect(refused.status).toBe(403);
    expect(refused.body.error.reason).toBe("email_unverified");

    const owner = await signUp();
    const target = uniqueEmail("target");
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const invited = await owner.client.post(`/api/labs/${owner.labId}/invitations`, { email: target, role: "viewer" });
      statuses.push(invited.status);
      if (invited.status === 201) expect(invited.body.mail).toBe("sent");
    }
    expect(statuses).toEqual([201, 201, 201, 429]);
  });

  it("5: a hostile name never reaches the Subject and is not a link in the body", async () => {
    const owner = await signUp({ name: "Security team: your account expires today, confirm at http://evil.test/x" });
    const target = uniqueEmail("phish");
    expect((await owner.client.post(`/api/labs/${owner.labId}/invitations`, { email: target, role: "viewer" })).status).toBe(201);
    const mail = await waitForMail(target);
    expect(mail.subject).toBe("You are invited to a lab on Gyrolux");
    expect(mail.text).not.toContain("http://evil.test");
    expect(mail.text).not.toContain("evil.test");
  });
});

describe("data", () => {
  it("20: share links end when their maker leaves the lab", async () => {
    const owner = await signUp();
    const member = await signUp();
    await joinByInvitation({ owner: owner.client, labId: owner.labId, account: member, role: "editor" });
    const memberSession = await signIn(member.email, member.password);
    const set = await createSet(memberSession, { labId: owner.labId });
    const link = await memberSession.post(`/api/parameter-sets/${set.id}/share-links`, {});
    expect(link.status).toBe(201);
    const token = new URL(link.body.url).pathname.split("/").pop()!;
    expect((await new Client().get(`/api/shared/${token}`)).status).toBe(200);
    expect((await owner.client.delete(`/api/labs/${owner.labId}/members/${member.userId}`)).status).toBe(204);
    expect((await new Client().get(`/api/shared/${token}`)).status).toBe(404);
  });

  it("22: the measurement-set list is paged and takes strict integers only", async () => {
    const viewer = await signIn(DEMO.viewer);
    const first = await viewer.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}&limit=1`);
    expect(first.status).toBe(200);
    expect(first.body.items).toHaveLength(1);
    expect(typeof first.body.nextCursor).toBe("string");
    const second = await viewer.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}&limit=1&cursor=${first.body.nextCursor}`);
    expect(second.body.items[0].id).not.toBe(first.body.items[0].id);
    for (const limit of ["0x10", "%205", "5%20", "1e1"]) {
      const refused = await viewer.get(`/api/measurement-sets?limit=${limit}`);
      expect(refused.status, limit).toBe(400);
      expect(refused.body.error.fields.limit).toBeTruthy();
    }
  });

  it("9: an upload's file name is capped at 255 bytes without control characters, and downloads", async () => {
    const editor = await signIn(DEMO.editor);
    const form = new FormData();
    const csv = "wavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T,length_m\n632.8,-134,2,293.15,1,0.01\n";
    form.set("file", new File([csv], `${"é".repeat(8000)}\u0001.csv`, { type: "text/csv" }));
    form.set("labId", DEMO_LAB_ID);
    form.set("name", `Long name ${Date.now()}`);
    form.set(
      "mapping",
      JSON.stringify({
        wavelengthColumn: "wavelength_nm",
        wavelengthUnit: "nm",
        quantity: "verdet",
        valueColumn: "verdet_rad_per_T_m",
        valueUnit: "rad/(T·m)",
        sigmaColumn: "sigma",
        temperatureColumn: "temperature_K",
        fieldColumn: "field_T",
        lengthColumn: "length_m",
      }),
    );
    const response = await editor.raw("POST", "/api/measurement-sets", { body: form });
    expect(response.status).toBe(201);
    const { item } = (await response.json()) as { item: { id: string; fileName: string } };
    expect(new TextEncoder().encode(item.fileName).length).toBeLessThanOrEqual(255);
    expect([...item.fileName].some((c) => c.charCodeAt(0) < 0x20)).toBe(false);
    const download = await editor.raw("GET", `/api/measurement-sets/${item.id}/original`);
    expect(download.status).toBe(200);
    expect(await download.text()).toBe(csv);
  });
});
