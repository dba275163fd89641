/* The names of Auth.js's session cookie (plain and on https), and of its chunks: large JWTs are split into "<cookie>.0", "<cookie>.1", … */
const SESSION_COOKIES = ["authjs.session-token", "__Secure-authjs.session-token"];

export function isSessionCookieName(name: string): boolean {
  return SESSION_COOKIES.some((base) => name === base || name.startsWith(`${base}.`));
}
