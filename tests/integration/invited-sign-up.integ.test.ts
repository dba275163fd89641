import { describe, expect, it } from "vitest";
import { Client, attemptSignIn, linkSecret, mailTo, signIn, signUp, uniqueEmail, waitForMail } from "./support";

/*
 * Signing up through an invitation link: the new account joins the invited lab with the
 * invitation's role and gets no personal lab; an unusable link creates no account at all. The
 * inviting owner is a fresh account with its own lab, so these tests spend none of the demo
 * owner's invitation allowance.
 */

const PASSWORD = "invited sign-up passphrase";

const signInFails = async (email: string, password = PASSWORD) => {
  const response = await attemptSignIn(new Client(), email, password);
  await response.body?.cancel();
  return response.status === 302 && (response.headers.get("location") ?? "").includes("error=");
};

/** The owner invites the address; the link's secret from the mail. */
async function invite(owner: Client, labId: string, email: string, role: "owner" | "editor" | "viewer") {
  const invitationMail = /\/invite\//;
  const before = (await mailTo(email)).filter((mail) => invitationMail.test(`${mail.subject}\n${mail.text}`)).length;
  const invited = await owner.post(`/api/labs/${labId}/invitations`, { email, role });
  expect(invited.status).toBe(201);
  const token = linkSecret(await waitForMail(email, { count: before + 1, matching: invitationMail }), "/invite");
  return { id: invited.body.item.id as string, token };
}

/** The JSON sign-up with an invitation link's secret. */
const signUpWith = (options: { name: string; email: string; token: string; password?: string }) =>
  new Client().post("/api/sign-up", {
    name: options.name,
    email: options.email,
    password: options.password ?? PASSWORD,
    invitationToken: options.token,
  });

const pendingIds = async (owner: Client, labId: string) =>
  (await owner.get(`/api/labs/${labId}/invitations`)).body.items.map((i: { id: string }) => i.id);

describe("signing up through an invitation", () => {
  it("joins the invited lab with the invitation's role and makes no personal lab", async () => {
    const owner = await signUp({ name: "Inviting Owner" });
    const email = uniqueEmail("invited editor");
    const invitation = await invite(owner.client, owner.labId, email, "editor");

    const answer = await signUpWith({ name: "Invited Editor", email, token: invitation.token });
    expect(answer.status).toBe(202);
    const invitee = await signIn(email, PASSWORD);
    expect((await invitee.get("/api/labs")).body.items).toEqual([{ id: owner.labId, name: "Inviting Owner's lab", role: "editor" }]);
    // The address is still confirmed through its own mail, as for any sign-up.
    await waitForMail(email, { matching: /\/verify-email\// });

    // The link is used up: accepting it again, or a second sign-up with it, is refused.
    expect((await invitee.post("/api/invitations/accept", { token: invitation.token })).status).toBe(409);
    const again = uniqueEmail("second taker");
    const second = await signUpWith({ name: "Second", email: again, token: invitation.token });
    expect(second.status).toBe(409);
    expect(second.body.error.message).toBe("This invitation has already been used.");
    expect(await signInFails(again)).toBe(true);
    expect(await pendingIds(owner.client, owner.labId)).not.toContain(invitation.id);

    const members = await owner.client.get(`/api/labs/${owner.labId}/members`);
    expect(members.body.items).toContainEqual(expect.objectContaining({ email, name: "Invited Editor", role: "editor" }));
    // The lab's trail records the acceptance by the new member.
    const trail = await owner.client.get(`/api/labs/${owner.labId}/audit?kind=invitation`);
    const session = await invitee.get("/api/auth/session");
    expect(trail.body.items).toContainEqual(
      expect.objectContaining({ action: "invitation.accept", actor: expect.objectContaining({ id: session.body.user.id }) }),
    );
  });

  it("an unknown, malformed, withdrawn or other-address link creates no account and leaves a pending link pending", async () => {
    const owner = await signUp({ name: "Careful Owner" });
    const unknownEmail = uniqueEmail("unknown link");
    const unknown = await signUpWith({ name: "U", email: unknownEmail, token: "A".repeat(43) });
    expect(unknown.status).toBe(404);
    const malformed = await signUpWith({ name: "M", email: unknownEmail, token: "short" });
    expect(malformed.status).toBe(404);
    expect(await signInFails(unknownEmail)).toBe(true);

    const withdrawnEmail = uniqueEmail("withdrawn");
    const withdrawn = await invite(owner.client, owner.labId, withdrawnEmail, "viewer");
    expect((await owner.client.delete(`/api/labs/${owner.labId}/invitations/${withdrawn.id}`)).status).toBe(204);
    const late = await signUpWith({ name: "W", email: withdrawnEmail, token: withdrawn.token });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/withdrawn/);
    expect(await signInFails(withdrawnEmail)).toBe(true);

    const invitedEmail = uniqueEmail("invited viewer");
    const invitation = await invite(owner.client, owner.labId, invitedEmail, "viewer");
    const otherEmail = uniqueEmail("someone else");
    const other = await signUpWith({ name: "O", email: otherEmail, token: invitation.token });
    expect(other.status).toBe(400);
    expect(other.body.error.fields.email).toContain(invitedEmail);
    expect(await signInFails(otherEmail)).toBe(true);
    expect(await pendingIds(owner.client, owner.labId)).toContain(invitation.id);

    // The same link still works for the invited address.
    const right = await signUpWith({ name: "Invited Viewer", email: invitedEmail, token: invitation.token });
    expect(right.status).toBe(202);
    const invitee = await signIn(invitedEmail, PASSWORD);
    expect((await invitee.get("/api/labs")).body.items).toEqual([{ id: owner.labId, name: "Careful Owner's lab", role: "viewer" }]);
  });

  it("an address that already has an account gets the neutral answer; the link stays pending and the account unchanged", async () => {
    const owner = await signUp({ name: "Neutral Owner" });
    const existing = await signUp({ name: "Existing Person" });
    const invitation = await invite(owner.client, owner.labId, existing.email, "editor");
    const answer = await signUpWith({
      name: "Impostor",
      email: existing.email,
      token: invitation.token,
      password: "some other passphrase",
    });
    expect(answer.status).toBe(202);
    expect(await signInFails(existing.email, "some other passphrase")).toBe(true);
    expect((await existing.client.get("/api/labs")).body.items).toEqual([
      { id: existing.labId, name: "Existing Person's lab", role: "owner" },
    ]);
    expect(await pendingIds(owner.client, owner.labId)).toContain(invitation.id);
  });
});

describe("someone with no lab", () => {
  it("creates a personal lab of their own, once", async () => {
    const owner = await signUp({ name: "Removing Owner" });
    const email = uniqueEmail("removed member");
    const invitation = await invite(owner.client, owner.labId, email, "editor");
    expect((await signUpWith({ name: "Removed Member", email, token: invitation.token })).status).toBe(202);
    const member = await signIn(email, PASSWORD);
    const userId = (await member.get("/api/auth/session")).body.user.id as string;
    expect((await owner.client.delete(`/api/labs/${owner.labId}/members/${userId}`)).status).toBe(204);
    expect((await member.get("/api/labs")).body.items).toEqual([]);

    const unnamed = await member.post("/api/labs", { name: "" });
    expect(unnamed.status).toBe(400);
    expect(unnamed.body.error.fields.name).toBeTruthy();
    const created = await member.post("/api/labs", {});
    expect(created.status).toBe(201);
    expect(created.body.item).toEqual({ id: expect.any(String), name: "Removed Member's lab", role: "owner" });
    expect((await member.get("/api/labs")).body.items).toEqual([created.body.item]);
    const trail = await member.get(`/api/labs/${created.body.item.id}/audit`);
    expect(trail.body.items.map((e: { action: string }) => e.action)).toContain("lab.create");

    // One personal lab per person: a second one, or one for someone who has theirs, is refused.
    expect((await member.post("/api/labs", { name: "Another" })).status).toBe(409);
    expect((await owner.client.post("/api/labs", {})).status).toBe(409);
    expect(await new Client().post("/api/labs", {}).then((r) => r.status)).toBe(401);
  });
});
