import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { DEMO_LAB, DEMO_PASSWORD, OTHER_LAB } from "@/db/demo-data";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { ModelParams } from "@/lib/physics/schema";

/*
 * HTTP helpers for the integration tests. They talk to a running server (scripts/test.sh starts
 * `next start` on a fresh, migrated and seeded database) and use only its public endpoints.
 * Use http://localhost:PORT, not 127.0.0.1: Next rewrites 127.x hosts.
 */

export const BASE_URL = process.env.GYROLUX_TEST_BASE_URL?.replace(/\/$/, "");

export { DEMO } from "../demo-accounts";
export { DEMO_GARNET_SET_ID, DEMO_PASSWORD, OTHER_LAB_SET_ID } from "@/db/demo-data";
export const DEMO_LAB_ID: string = DEMO_LAB.id;
export const OTHER_LAB_ID: string = OTHER_LAB.id;
/** The seeded site admin's password; scripts/test.sh sets it (the seed never uses the demo one). */
export const ADMIN_PASSWORD = process.env.GYROLUX_ADMIN_PASSWORD;

export const validParams = (overrides: Partial<ModelParams> = {}): ModelParams => ({ ...TERBIUM_GARNET_DEFAULTS, ...overrides });

let counter = 0;
/** A name no other test (or earlier run against the same database) uses. */
export function uniqueName(prefix: string): string {
  counter += 1;
  return `${prefix} ${Date.now().toString(36)}-${process.pid}-${counter}`;
}

export function uniqueEmail(prefix: string): string {
  return `${uniqueName(prefix)
    .replace(/[^a-z0-9]+/gi, "-")
    .toLowerCase()}@integ.gyrolux.test`;
}

/**
 * A parsed response body as the tests read it. Each test states the shape it relies on with
 * `expect`, which is what it tests; a declared type per endpoint would restate lib/contracts
 * without checking it against the server.
 */
// biome-ignore lint/suspicious/noExplicitAny: the one loosely read type of this HTTP client (see above).
export type JsonBody = any;

export interface ApiResponse<T = JsonBody> {
  status: number;
  headers: Headers;
  body: T;
}

export interface RequestOptions {
  /** Sent as JSON with Content-Type application/json. */
  json?: unknown;
  /** Sent as is (for malformed bodies); set the content type yourself. */
  body?: string;
  headers?: Record<string, string>;
}

/** An HTTP client with a cookie jar (session) and/or a bearer token. */
export class Client {
  private readonly cookies = new Map<string, string>();

  constructor(private readonly bearer?: string) {}

  get base(): string {
    if (!BASE_URL) throw new Error("GYROLUX_TEST_BASE_URL is not set");
    return BASE_URL;
  }

  /** Copies a cookie header (e.g. to replay a session after its owner signed out). */
  setCookies(header: string): void {
    for (const pair of header.split("; ")) {
      const eq = pair.indexOf("=");
      if (eq > 0) this.cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
  }

  cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join("; ");
  }

  hasCookie(prefix: string): boolean {
    return [...this.cookies.keys()].some((name) => name.startsWith(prefix));
  }

  storeCookies(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair = "", ...attributes] = line.split(";");
      const eq = pair.indexOf("=");
      if (eq < 0) continue;
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attributes.some((a) => /^\s*max-age=0\s*$/i.test(a)) || value === "";
      if (expired) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async raw(method: string, path: string, init: { body?: BodyInit; headers?: Record<string, string> } = {}): Promise<Response> {
    const headers: Record<string, string> = { ...init.headers };
    if (this.cookies.size > 0) headers.cookie = this.cookieHeader();
    if (this.bearer) headers.authorization = `Bearer ${this.bearer}`;
    const response = await fetch(`${this.base}${path}`, { method, headers, body: init.body, redirect: "manual" });
    this.storeCookies(response);
    return response;
  }

  async request<T = JsonBody>(method: string, path: string, options: RequestOptions = {}): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { ...options.headers };
    let body: string | undefined = options.body;
    if (options.json !== undefined) {
      body = JSON.stringify(options.json);
      headers["content-type"] ??= "application/json";
    }
    const response = await this.raw(method, path, { body, headers });
    const text = await response.text();
    let parsed: unknown = text;
    if ((response.headers.get("content-type") ?? "").includes("json") && text) parsed = JSON.parse(text);
    return { status: response.status, headers: response.headers, body: parsed as T };
  }

  get<T = JsonBody>(path: string, options?: RequestOptions) {
    return this.request<T>("GET", path, options);
  }
  post<T = JsonBody>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>("POST", path, { ...options, json });
  }
  patch<T = JsonBody>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>("PATCH", path, { ...options, json });
  }
  put<T = JsonBody>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>("PUT", path, { ...options, json });
  }
  delete<T = JsonBody>(path: string, options?: RequestOptions) {
    return this.request<T>("DELETE", path, options);
  }
}

/**
 * Posts the credentials form the way the browser does (Auth.js: csrf token, then
 * /api/auth/callback/credentials) and returns the raw response; the client keeps the cookies.
 */
export async function attemptSignIn(client: Client, email: string, password: string): Promise<Response> {
  const csrf = await client.raw("GET", "/api/auth/csrf");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const form = new URLSearchParams({ csrfToken, email, password, callbackUrl: `${client.base}/parameter-sets` });
  return client.raw("POST", "/api/auth/callback/credentials", {
    body: form.toString(),
    headers: { "content-type": "application/x-www-form-urlencoded" },
  });
}

/** A client signed in with a session cookie; throws when the sign-in fails. */
export async function signIn(email: string, password = DEMO_PASSWORD): Promise<Client> {
  const client = new Client();
  const response = await attemptSignIn(client, email, password);
  const location = response.headers.get("location") ?? "";
  await response.body?.cancel();
  if (response.status !== 302 || location.includes("error=") || !client.hasCookie("authjs.session-token")) {
    throw new Error(`sign-in as ${email} failed: ${response.status} ${location}`);
  }
  return client;
}

/** Creates an API token for the signed-in client; returns the secret. */
export async function createApiToken(client: Client, name = uniqueName("integ token")): Promise<{ id: string; token: string }> {
  const response = await client.post("/api/tokens", { name });
  if (response.status !== 201) throw new Error(`token creation failed: ${response.status} ${JSON.stringify(response.body)}`);
  return { id: response.body.item.id, token: response.body.token };
}

/**
 * A fresh account via the JSON sign-up endpoint (its own personal lab). Sign-up answers the same
 * for every address, so the new user's id and lab come from signing in.
 */
export async function signUp(options: { name?: string; email?: string; password?: string; confirmEmail?: boolean } = {}) {
  const email = options.email ?? uniqueEmail("integ");
  const password = options.password ?? "correct horse battery";
  const response = await new Client().post("/api/sign-up", { name: options.name ?? "Integration Tester", email, password });
  if (response.status !== 202) throw new Error(`sign-up failed: ${response.status} ${JSON.stringify(response.body)}`);
  // New accounts confirm their address through the mailed link before they may invite.
  if (options.confirmEmail !== false) {
    const token = linkSecret(await waitForMail(email, { matching: /\/verify-email\// }), "/verify-email");
    const confirmed = await new Client().post("/api/email-verification/confirm", { token });
    if (confirmed.status !== 200) throw new Error(`address confirmation failed: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
  }
  const client = await signIn(email, password);
  const session = await client.get("/api/auth/session");
  const labs = await client.get("/api/labs");
  const lab = labs.body.items.find((l: { role: string }) => l.role === "owner");
  return { email, password, userId: session.body.user.id as string, labId: lab.id as string, client };
}

/** Where the local SMTP stand-in stores caught mail (scripts/mail.sh; the same defaults). */
export const MAIL_DIR = process.env.GYROLUX_MAIL_DIR ?? `/tmp/gyrolux-mail-${process.env.GYROLUX_SMTP_PORT ?? "2525"}`;

export interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** Caught messages to an address, oldest first. */
export async function mailTo(address: string): Promise<CaughtMail[]> {
  let names: string[] = [];
  try {
    names = (await readdir(MAIL_DIR)).filter((name) => name.endsWith(".json")).sort();
  } catch {
    return [];
  }
  const found: CaughtMail[] = [];
  for (const name of names) {
    const mail = JSON.parse(await readFile(path.join(MAIL_DIR, name), "utf8")) as CaughtMail;
    if (mail.to.some((to) => to.toLowerCase() === address.toLowerCase())) found.push(mail);
  }
  return found;
}

/**
 * Waits until `count` messages to the address (those whose subject or text match `matching`, when
 * given) have arrived; returns the newest.
 */
export async function waitForMail(
  address: string,
  options: { count?: number; timeoutMs?: number; matching?: RegExp } = {},
): Promise<CaughtMail> {
  const deadline = Date.now() + (options.timeoutMs ?? 15_000);
  for (;;) {
    const mails = (await mailTo(address)).filter((m) => !options.matching || options.matching.test(`${m.subject}\n${m.text}`));
    if (mails.length >= (options.count ?? 1)) return mails[mails.length - 1]!;
    if (Date.now() > deadline) throw new Error(`no mail to ${address} in ${MAIL_DIR} (have ${mails.length})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The secret of the first link to `/prefix/<secret>` in a message. */
export function linkSecret(mail: CaughtMail, prefix: string): string {
  const match = new RegExp(`${prefix}/([A-Za-z0-9_-]{43})`).exec(mail.text);
  if (!match?.[1]) throw new Error(`no ${prefix} link in: ${mail.text}`);
  return match[1];
}

/** The owner invites the account; the account accepts with its own session. */
export async function joinByInvitation(options: {
  owner: Client;
  labId: string;
  account: { email: string; password: string };
  role: "owner" | "editor" | "viewer";
  inviteAs?: string;
}) {
  const before = (await mailTo(options.account.email)).length;
  const invited = await options.owner.post(`/api/labs/${options.labId}/invitations`, {
    email: options.inviteAs ?? options.account.email,
    role: options.role,
  });
  if (invited.status !== 201) throw new Error(`invitation failed: ${invited.status} ${JSON.stringify(invited.body)}`);
  const mail = await waitForMail(options.account.email, { count: before + 1 });
  const token = linkSecret(mail, "/invite");
  const invitee = await signIn(options.account.email, options.account.password);
  const accepted = await invitee.post("/api/invitations/accept", { token });
  if (accepted.status !== 200) throw new Error(`accept failed: ${accepted.status} ${JSON.stringify(accepted.body)}`);
  return { invitationId: invited.body.item.id as string, token, invitee };
}

/** Creates a parameter set in the demo lab as the given client. */
export async function createSet(client: Client, overrides: Record<string, unknown> = {}) {
  const response = await client.post("/api/parameter-sets", {
    labId: DEMO_LAB_ID,
    name: uniqueName("Integ set"),
    description: "created by an integration test",
    tags: ["integ"],
    params: validParams(),
    ...overrides,
  });
  if (response.status !== 201) throw new Error(`create failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body.item;
}
