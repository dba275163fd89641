import { describe, expect, it } from "vitest";
import { Client, attemptSignIn, signIn, signUp, uniqueEmail, waitForMail } from "./support";

const isFailure = (response: Response) => response.status === 302 && (response.headers.get("location") ?? "").includes("error=");

describe("sign-up and sign-in", () => {
  it("sign-up creates a personal lab the new user owns", async () => {
    const account = await signUp({ name: "Fresh Tester" });
    const client = await signIn(account.email.toUpperCase(), account.password);
    const labs = await client.get("/api/labs");
    expect(labs.body.items).toEqual([{ id: account.labId, name: "Fresh Tester's lab", role: "owner" }]);
    // Taken and new addresses get the same answer (no account enumeration); the owner gets a mail.
    const duplicate = await new Client().post("/api/sign-up", { name: "Again", email: account.email, password: "another password" });
    const fresh = await new Client().post("/api/sign-up", { name: "New", email: uniqueEmail("new"), password: "another password" });
    expect(duplicate.status).toBe(202);
    expect(duplicate.body).toEqual(fresh.body);
    expect((await waitForMail(account.email, { matching: /already|tried/i })).subject).toMatch(/already|tried/i);
    const weak = await new Client().post("/api/sign-up", { name: "Weak", email: uniqueEmail("weak"), password: "short" });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toBeTruthy();
  });

  it("a wrong password and an unknown e-mail get the same answer", async () => {
    const account = await signUp();
    const wrong = await attemptSignIn(new Client(), account.email, "not the password");
    const unknown = await attemptSignIn(new Client(), uniqueEmail("nobody"), "not the password");
    expect(isFailure(wrong)).toBe(true);
    expect(isFailure(unknown)).toBe(true);
    expect(wrong.headers.get("location")).toBe(unknown.headers.get("location"));
  });

  it("after 5 failures the next attempts get 429 with Retry-After, even with the right password", async () => {
    const account = await signUp();
    for (let i = 0; i < 5; i++) {
      const response = await attemptSignIn(new Client(), account.email, `wrong ${i}`);
      expect(isFailure(response), `attempt ${i + 1}`).toBe(true);
    }
    const limited = await attemptSignIn(new Client(), account.email, account.password);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = (await limited.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toMatch(/wait \d+ s/i);

    // Only this account is slowed down: others still sign in.
    const other = await signUp();
    await expect(signIn(other.email, other.password)).resolves.toBeInstanceOf(Client);
  });

  it("X-Forwarded-For from an unconfigured client is ignored: rotating it does not escape the limit", async () => {
    const account = await signUp();
    const from = (n: number) => ({ "x-forwarded-for": `198.51.100.${n}` });
    const post = async (password: string, n: number) => {
      const client = new Client();
      const csrf = await client.raw("GET", "/api/auth/csrf");
      const { csrfToken } = (await csrf.json()) as { csrfToken: string };
      return client.raw("POST", "/api/auth/callback/credentials", {
        body: new URLSearchParams({ csrfToken, email: account.email, password }).toString(),
        headers: { "content-type": "application/x-www-form-urlencoded", ...from(n) },
      });
    };
    for (let i = 0; i < 5; i++) expect(isFailure(await post(`wrong ${i}`, i)), `attempt ${i + 1}`).toBe(true);
    expect((await post(account.password, 99)).status).toBe(429);
  });

  it("a session cookie signs requests until sign-out", async () => {
    const account = await signUp();
    const client = await signIn(account.email, account.password);
    expect((await client.get("/api/labs")).status).toBe(200);
    const session = await client.get("/api/auth/session");
    expect(session.body.user).toMatchObject({ email: account.email, siteRole: "member" });
    expect(session.body.user.id).toBe(account.userId);

    // Sign-out ends the session server-side: the old cookie no longer signs anything in.
    const stolen = new Client();
    stolen.setCookies(client.cookieHeader());
    const csrf = await client.raw("GET", "/api/auth/csrf");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const out = await client.raw("POST", "/api/auth/signout", {
      body: new URLSearchParams({ csrfToken, callbackUrl: `${client.base}/sign-in` }).toString(),
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    await out.body?.cancel();
    expect(out.status).toBe(302);
    const replay = await stolen.get("/api/labs");
    expect(replay.status).toBe(401);
    expect(replay.body.error.code).toBe("unauthenticated");
  });
});
