import { describe, expect, it } from "vitest";
import {
  Client,
  DEMO,
  DEMO_GARNET_SET_ID,
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

describe("invitations by e-mail", () => {
  it("the mail arrives; the invitee joins only on accepting; the link works once", async () => {
    const owner = await signIn(DEMO.owner);
    const account = await signUp({ name: "Invited Viewer" });
    const invited = await owner.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: account.email, role: "editor" });
    expect(invited.status).toBe(201);
    expect(invited.body.item).toMatchObject({ email: account.email, role: "editor" });
    const pending = await owner.get(`/api/labs/${DEMO_LAB_ID}/invitations`);
    expect(pending.body.items.map((i: { id: string }) => i.id)).toContain(invited.body.item.id);

    const mail = await waitForMail(account.email, { matching: /\/invite\// });
    // The lab's and the inviter's names are user text: never in the Subject, quoted in the body.
    expect(mail.subject).toBe("You are invited to a lab on Gyrolux");
    expect(mail.text).toContain("“Lindqvist Moor Faraday Laboratory”");
    const token = linkSecret(mail, "/invite");

    // Not a member before accepting.
    const invitee = await signIn(account.email, account.password);
    expect((await invitee.get(`/api/labs/${DEMO_LAB_ID}/members`)).status).toBe(404);

    const accepted = await invitee.post("/api/invitations/accept", { token });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ labId: DEMO_LAB_ID, role: "editor" });
    const labs = await invitee.get("/api/labs");
    expect(labs.body.items).toContainEqual(expect.objectContaining({ id: DEMO_LAB_ID, role: "editor" }));

    const reused = await invitee.post("/api/invitations/accept", { token });
    expect(reused.status).toBe(409);
    expect((await owner.get(`/api/labs/${DEMO_LAB_ID}/invitations`)).body.items.map((i: { id: string }) => i.id)).not.toContain(
      invited.body.item.id,
    );
  });

  it("a revoked link is refused; a link for another address is refused; a made-up link is 404", async () => {
    const owner = await signIn(DEMO.owner);
    const account = await signUp();
    const other = await signUp();
    const invited = await owner.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: account.email, role: "viewer" });
    const token = linkSecret(await waitForMail(account.email, { matching: /\/invite\// }), "/invite");

    const wrongPerson = await other.client.post("/api/invitations/accept", { token });
    expect(wrongPerson.status).toBe(403);

    expect((await owner.delete(`/api/labs/${DEMO_LAB_ID}/invitations/${invited.body.item.id}`)).status).toBe(204);
    const invitee = await signIn(account.email, account.password);
    const revoked = await invitee.post("/api/invitations/accept", { token });
    expect(revoked.status).toBe(409);
    expect(revoked.body.error.message).toMatch(/withdrawn/);
    expect((await invitee.get(`/api/labs/${DEMO_LAB_ID}/members`)).status).toBe(404);

    expect((await invitee.post("/api/invitations/accept", { token: "A".repeat(43) })).status).toBe(404);
    // Only owners invite.
    const editor = await signIn(DEMO.editor);
    expect((await editor.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: uniqueEmail("x"), role: "viewer" })).status).toBe(403);
  });

  it("inviting answers the same for an address with and without an account", async () => {
    const owner = await signIn(DEMO.owner);
    const account = await signUp();
    const known = await owner.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: account.email, role: "viewer" });
    const unknown = await owner.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: uniqueEmail("nobody"), role: "viewer" });
    expect(known.status).toBe(unknown.status);
    expect(Object.keys(known.body.item).sort()).toEqual(Object.keys(unknown.body.item).sort());
    expect(JSON.stringify(known.body)).not.toContain("Integration Tester");
  });

  it("there is no direct add by e-mail any more", async () => {
    const owner = await signIn(DEMO.owner);
    const account = await signUp();
    const direct = await owner.post(`/api/labs/${DEMO_LAB_ID}/members`, { email: account.email, role: "viewer" });
    expect(direct.status).toBe(405);
  });
});

describe("password reset and change", () => {
  it("a reset mail for a known address; the same answer for an unknown one; the link works once and ends sessions", async () => {
    const account = await signUp();
    const oldSession = await signIn(account.email, account.password);
    const known = await new Client().post("/api/password-reset", { email: account.email });
    const unknown = await new Client().post("/api/password-reset", { email: uniqueEmail("ghost") });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);

    const token = linkSecret(await waitForMail(account.email, { matching: /\/reset-password\// }), "/reset-password");
    const weak = await new Client().post("/api/password-reset/confirm", { token, newPassword: "short" });
    expect(weak.status).toBe(400);
    const done = await new Client().post("/api/password-reset/confirm", { token, newPassword: "a brand new passphrase" });
    expect(done.status).toBe(200);
    const reused = await new Client().post("/api/password-reset/confirm", { token, newPassword: "yet another passphrase" });
    expect(reused.status).toBe(400);

    expect((await oldSession.get("/api/labs")).status).toBe(401);
    await expect(signIn(account.email, "a brand new passphrase")).resolves.toBeInstanceOf(Client);
    expect((await attemptSignIn(new Client(), account.email, account.password)).headers.get("location")).toContain("error=");
  });

  it("a password change keeps this browser signed in and ends the other sessions", async () => {
    const account = await signUp();
    const here = await signIn(account.email, account.password);
    const elsewhere = await signIn(account.email, account.password);
    const wrong = await here.post("/api/account/password", { currentPassword: "not it", newPassword: "changed passphrase 1" });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    const changed = await here.post("/api/account/password", { currentPassword: account.password, newPassword: "changed passphrase 1" });
    expect(changed.status).toBe(200);
    expect((await here.get("/api/labs")).status).toBe(200);
    expect((await elsewhere.get("/api/labs")).status).toBe(401);
  });

  it("a site admin (or the user) ends all sessions of an account", async () => {
    const account = await signUp();
    const session = await signIn(account.email, account.password);
    const other = await signUp();
    expect((await other.client.post(`/api/users/${account.userId}/end-sessions`, {})).status).toBe(403);
    expect((await session.post(`/api/users/${account.userId}/end-sessions`, {})).status).toBe(204);
    expect((await session.get("/api/labs")).status).toBe(401);
  });
});

describe("read-only share links", () => {
  it("work signed out, show only that set, stop when revoked", async () => {
    const editor = await signIn(DEMO.editor);
    const set = await createSet(editor);
    const created = await editor.post(`/api/parameter-sets/${set.id}/share-links`, {});
    expect(created.status).toBe(201);
    const url = new URL(created.body.url);
    const token = url.pathname.split("/").pop()!;
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);

    const anonymous = new Client();
    const shared = await anonymous.get(`/api/shared/${token}`);
    expect(shared.status).toBe(200);
    expect(shared.headers.get("x-robots-tag")).toContain("noindex");
    expect(shared.body.item).toMatchObject({ name: set.name, version: 1 });
    expect(Object.keys(shared.body.item).sort()).toEqual(["description", "name", "params", "tags", "updatedAt", "version", "viewState"]);
    expect(JSON.stringify(shared.body)).not.toContain(DEMO_LAB_ID);

    const page = await anonymous.raw("GET", url.pathname);
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toMatch(/<meta name="robots" content="noindex/);
    expect(html).toContain(set.name);
    expect(html).not.toContain("Lindqvist Moor");

    // The link is stored hashed: listing shows no secret.
    const listed = await editor.get(`/api/parameter-sets/${set.id}/share-links`);
    expect(JSON.stringify(listed.body)).not.toContain(token);
    const viewer = await signIn(DEMO.viewer);
    expect((await viewer.post(`/api/parameter-sets/${set.id}/share-links`, {})).status).toBe(403);

    expect((await editor.delete(`/api/parameter-sets/${set.id}/share-links/${created.body.item.id}`)).status).toBe(204);
    expect((await anonymous.get(`/api/shared/${token}`)).status).toBe(404);
    const gone = await anonymous.raw("GET", url.pathname);
    await gone.body?.cancel();
    expect(gone.status).toBe(404);
  });
});

describe("audit page API", () => {
  it("owners read the lab's trail with filters and paging; others cannot", async () => {
    const owner = await signIn(DEMO.owner);
    const editor = await signIn(DEMO.editor);
    const set = await createSet(editor);
    await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1, description: "changed for the audit" });
    await editor.post(`/api/parameter-sets/${set.id}/share-links`, {});

    const bySet = await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?setId=${set.id}`);
    expect(bySet.status).toBe(200);
    expect(bySet.body.items.map((e: { action: string }) => e.action)).toEqual([
      "share_link.create",
      "parameter_set.update",
      "parameter_set.create",
    ]);
    expect(bySet.body.items[0].actor.name).toBeTruthy();
    // Each entry names its target: the share link's set, by its present name.
    expect(bySet.body.items.map((e: { targetName: string }) => e.targetName)).toEqual([set.name, set.name, set.name]);

    const firstPage = await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?setId=${set.id}&limit=2`);
    expect(firstPage.body.items).toHaveLength(2);
    const second = await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?setId=${set.id}&limit=2&cursor=${firstPage.body.nextCursor}`);
    expect(second.body.items.map((e: { action: string }) => e.action)).toEqual(["parameter_set.create"]);
    expect(second.body.nextCursor).toBeNull();

    const kind = await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?kind=share_link&limit=200`);
    expect(kind.body.items.every((e: { action: string }) => e.action.startsWith("share_link."))).toBe(true);
    const today = new Date().toISOString().slice(0, 10);
    const dated = await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?from=${today}&to=${today}&setId=${set.id}`);
    expect(dated.body.items).toHaveLength(3);
    expect((await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?from=yesterday`)).status).toBe(400);
    expect((await editor.get(`/api/labs/${DEMO_LAB_ID}/audit`)).status).toBe(403);
  });
});

describe("audit entries about a person", () => {
  it("name whose role changed, and the trail filters by that person", async () => {
    const owner = await signUp({ name: "Audit Owner" });
    const member = await signUp({ name: `Audit Member ${Date.now()}` });
    await joinByInvitation({ owner: owner.client, labId: owner.labId, account: member, role: "editor" });
    const changed = await owner.client.patch(`/api/labs/${owner.labId}/members/${member.userId}`, { role: "viewer" });
    expect(changed.status).toBe(200);

    const about = await owner.client.get(`/api/labs/${owner.labId}/audit?subjectId=${member.userId}`);
    expect(about.status).toBe(200);
    expect(about.body.items).toHaveLength(1);
    expect(about.body.items[0]).toMatchObject({
      action: "member.role",
      targetType: "user",
      targetId: member.userId,
      targetName: expect.stringMatching(/^Audit Member /),
      details: { from: "editor", to: "viewer" },
    });
    // The invitation's entries name the invited address.
    const invitations = await owner.client.get(`/api/labs/${owner.labId}/audit?kind=invitation`);
    expect(invitations.body.items.map((e: { targetName: string }) => e.targetName)).toEqual([member.email, member.email]);
    expect((await owner.client.get(`/api/labs/${owner.labId}/audit?subjectId=nobody`)).status).toBe(400);
  });
});

describe("paging of every list", () => {
  it("sets, versions, members and tokens take limit and cursor, with a maximum", async () => {
    const editor = await signIn(DEMO.editor);
    const first = await editor.get(`/api/parameter-sets?labId=${DEMO_LAB_ID}&limit=2`);
    expect(first.body.items).toHaveLength(2);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const next = await editor.get(`/api/parameter-sets?labId=${DEMO_LAB_ID}&limit=2&cursor=${first.body.nextCursor}`);
    const ids = new Set([...first.body.items, ...next.body.items].map((s: { id: string }) => s.id));
    expect(ids.size).toBe(first.body.items.length + next.body.items.length);
    expect((await editor.get("/api/parameter-sets?limit=201")).status).toBe(400);
    expect((await editor.get("/api/parameter-sets?limit=0")).status).toBe(400);
    expect((await editor.get("/api/parameter-sets?cursor=not-a-cursor")).status).toBe(400);

    const versions = await editor.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions?limit=1`);
    expect(versions.body.items).toHaveLength(1);
    const older = await editor.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions?limit=1&cursor=${versions.body.nextCursor}`);
    expect(older.body.items[0].version).toBeLessThan(versions.body.items[0].version);

    const members = await editor.get(`/api/labs/${DEMO_LAB_ID}/members?limit=1`);
    expect(members.body.items).toHaveLength(1);
    const more = await editor.get(`/api/labs/${DEMO_LAB_ID}/members?limit=1&cursor=${members.body.nextCursor}`);
    expect(more.body.items[0].userId).not.toBe(members.body.items[0].userId);

    const account = await signUp();
    for (let i = 0; i < 3; i++) await createApiToken(account.client);
    const tokens = await account.client.get("/api/tokens?limit=2");
    expect(tokens.body.items).toHaveLength(2);
    const rest = await account.client.get(`/api/tokens?limit=2&cursor=${tokens.body.nextCursor}`);
    expect(rest.body.items).toHaveLength(1);
    expect(rest.body.nextCursor).toBeNull();
  });
});

describe("the defects found by the attack run stay closed", () => {
  it("1: the seeded site admin does not take the demo password", async () => {
    const response = await attemptSignIn(new Client(), DEMO.admin, "gyrolux-demo");
    expect(response.headers.get("location")).toContain("error=");
  });

  it("2: sign-in bodies over 64 KiB are refused before parsing", async () => {
    const client = new Client();
    const huge = `email=a%40b.test&password=${"x".repeat(200 * 1024)}`;
    const response = await client.raw("POST", "/api/auth/callback/credentials", {
      body: huge,
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    expect(response.status).toBe(413);
  });

  it("3: NUL and unpaired surrogates in text fields → 400, nothing stored", async () => {
    const editor = await signIn(DEMO.editor);
    const name = `bad\u0000name ${Date.now()}`;
    const nul = await editor.request("POST", "/api/parameter-sets", {
      body: JSON.stringify({ labId: DEMO_LAB_ID, name, params: {} }).replace("\\u0000", "\\u0000"),
      headers: { "content-type": "application/json" },
    });
    expect(nul.status).toBe(400);
    const surrogate = await editor.request("POST", "/api/tokens", {
      body: '{"name":"tok \\ud800"}',
      headers: { "content-type": "application/json" },
    });
    expect(surrogate.status).toBe(400);
    const signUpNul = await new Client().request("POST", "/api/sign-up", {
      body: '{"name":"x","email":"a\\u0000@b.test","password":"long enough pw"}',
      headers: { "content-type": "application/json" },
    });
    expect(signUpNul.status).toBe(400);
    const search = await editor.get(`/api/parameter-sets?q=${encodeURIComponent("a\u0000b")}`);
    expect(search.status).toBe(400);
  });

  it("4: a malformed percent-encoding in an API path → JSON 400", async () => {
    const response = await new Client().raw("GET", "/api/parameter-sets/%C0%AF");
    expect(response.status).toBe(400);
    expect(response.headers.get("content-type")).toContain("application/json");
  });

  it("7: an API token cannot create or list tokens", async () => {
    const editor = await signIn(DEMO.editor);
    const { token } = await createApiToken(editor);
    const script = new Client(token);
    expect((await script.post("/api/tokens", { name: "child" })).status).toBe(403);
    expect((await script.get("/api/tokens")).status).toBe(403);
  });

  it("8: a cookie-authenticated change from another origin is refused", async () => {
    const editor = await signIn(DEMO.editor);
    const set = await createSet(editor);
    const cross = await editor.post(
      `/api/parameter-sets/${set.id}/versions/1/restore`,
      { version: 1 },
      { headers: { origin: "http://localhost:9999" } },
    );
    expect(cross.status).toBe(403);
    const sameSite = await editor.post(
      `/api/parameter-sets/${set.id}/versions/1/restore`,
      { version: 1 },
      { headers: { "sec-fetch-site": "same-site" } },
    );
    expect(sameSite.status).toBe(403);
    expect((await editor.get(`/api/parameter-sets/${set.id}`)).body.item.version).toBe(1);
    const own = await editor.patch(
      `/api/parameter-sets/${set.id}`,
      { version: 1, description: "own origin" },
      { headers: { origin: editor.base } },
    );
    expect(own.status).toBe(200);
  });

  it("9: security headers on pages and API answers", async () => {
    for (const path of ["/sign-in", "/api/health"]) {
      const response = await new Client().raw("GET", path);
      await response.body?.cancel();
      expect(response.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
      expect(response.headers.get("content-security-policy")).toContain("worker-src 'self'");
      expect(response.headers.get("x-content-type-options")).toBe("nosniff");
      expect(response.headers.get("referrer-policy")).toBeTruthy();
      expect(response.headers.get("permissions-policy")).toBeTruthy();
      expect(response.headers.get("x-frame-options")).toBe("DENY");
    }
  });

  it("10: a deeply nested view state → 400", async () => {
    const editor = await signIn(DEMO.editor);
    const set = await createSet(editor);
    const deep = `{"viewState":{"a":${"[".repeat(5000)}${"]".repeat(5000)}}}`;
    const response = await editor.request("PUT", `/api/parameter-sets/${set.id}/view-state`, {
      body: deep,
      headers: { "content-type": "application/json" },
    });
    expect(response.status).toBe(400);
  });

  it("11: sign-up is limited per address", async () => {
    const email = uniqueEmail("flood");
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++)
      statuses.push((await new Client().post("/api/sign-up", { name: "Flood", email, password: "long enough pw" })).status);
    expect(statuses.slice(0, 5)).toEqual([202, 202, 202, 202, 202]);
    expect(statuses.slice(5)).toEqual([429, 429]);
  });

  it("12: a demoted owner cannot change roles any more", async () => {
    const lead = await signUp();
    const second = await signUp();
    const third = await signUp();
    await joinByInvitation({ owner: lead.client, labId: lead.labId, account: second, role: "owner" });
    await joinByInvitation({ owner: lead.client, labId: lead.labId, account: third, role: "viewer" });
    const secondSession = await signIn(second.email, second.password);
    expect((await lead.client.patch(`/api/labs/${lead.labId}/members/${second.userId}`, { role: "viewer" })).status).toBe(200);
    const promote = await secondSession.patch(`/api/labs/${lead.labId}/members/${third.userId}`, { role: "owner" });
    expect(promote.status).toBe(403);
  });

  it("14: passwords are limited by bytes, not characters", async () => {
    // 40 × "é" is 40 characters but 80 UTF-8 bytes: bcrypt would ignore the last 8 bytes.
    const response = await new Client().post("/api/sign-up", { name: "Bytes", email: uniqueEmail("bytes"), password: "é".repeat(40) });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.password).toMatch(/bytes/);
  });

  it("16: a restore without version is refused and writes nothing", async () => {
    const editor = await signIn(DEMO.editor);
    const set = await createSet(editor);
    const blind = await Promise.all(Array.from({ length: 5 }, () => editor.post(`/api/parameter-sets/${set.id}/versions/1/restore`, {})));
    expect(blind.map((r) => r.status)).toEqual([400, 400, 400, 400, 400]);
    expect((await editor.get(`/api/parameter-sets/${set.id}/versions`)).body.items).toHaveLength(1);
  });

  it("mail arrives only where it should", async () => {
    const stranger = uniqueEmail("stranger");
    await new Client().post("/api/password-reset", { email: stranger });
    await new Promise((resolve) => setTimeout(resolve, 500));
    expect(await mailTo(stranger)).toHaveLength(0);
  });
});
