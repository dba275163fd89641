import "server-only";
import NextAuth, { CredentialsSignin, type DefaultSession } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import type { SiteRole } from "@/lib/contracts/roles";
import { db } from "@/db/client";
import { bumpSessionVersion, findUserByEmail } from "@/db/queries/users";
import { cookies } from "next/headers";
import { serverSettings } from "@/lib/settings/server";
import { DEVICE_COOKIE, DEVICE_COOKIE_MAX_AGE_S, newDeviceCookie } from "./device";
import { dummyVerify, verifyPassword } from "./password";
import { reserveSignInAttempt, signInClient } from "./rate-limit";
import { signInSchema } from "@/lib/contracts/accounts";

declare module "next-auth" {
  interface Session {
    user: { id: string; siteRole: SiteRole; sessionVersion: number } & DefaultSession["user"];
  }
  interface User {
    siteRole?: SiteRole;
    sessionVersion?: number;
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    id?: string;
    siteRole?: SiteRole;
    /** users.session_version at sign-in; lib/auth/access.ts refuses the cookie once it moved on. */
    sv?: number;
  }
}

/** Thrown from authorize while failures are being slowed; its code reaches the redirect URL. */
export class RateLimitedSignin extends CredentialsSignin {
  code = "rate_limited";
}

/** Gives this browser a device cookie for the account (lib/auth/device.ts); harmless where cookies cannot be set. */
async function rememberDevice(email: string): Promise<void> {
  const secret = serverSettings.auth.secret;
  if (!secret) return;
  try {
    (await cookies()).set(DEVICE_COOKIE, newDeviceCookie(secret, email), {
      httpOnly: true,
      sameSite: "lax",
      secure: serverSettings.site.publicUrl.startsWith("https:"),
      path: "/",
      maxAge: DEVICE_COOKIE_MAX_AGE_S,
    });
  } catch {
    // Outside a request that may set cookies; the sign-in itself stands.
  }
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  session: { strategy: "jwt", maxAge: 30 * 24 * 60 * 60 },
  pages: { signIn: "/sign-in" },
  trustHost: true,
  // A wrong password is an expected outcome, not a server error; keep the log for real failures.
  logger: {
    error(error) {
      if (error instanceof CredentialsSignin) return;
      console.error("[auth]", error);
    },
  },
  providers: [
    Credentials({
      id: "credentials",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, request) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const client = signInClient(request.headers, email);
        const attempt = await reserveSignInAttempt(email, client);
        if (!attempt.allowed) throw new RateLimitedSignin();
        const user = await findUserByEmail(db, { email });
        // Unknown e-mail: same bcrypt cost and the same answer as a wrong password. A failure stays
        // recorded (the reservation was one).
        const valid = user ? await verifyPassword(password, user.passwordHash) : await dummyVerify(password);
        if (!user || !valid) return null;
        await attempt.succeeded();
        if (!client.deviceId) await rememberDevice(email);
        return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.id = user.id;
        token.siteRole = user.siteRole ?? "member";
        token.sv = user.sessionVersion ?? 0;
      }
      return token;
    },
    session({ session, token }) {
      if (token.id) session.user.id = token.id;
      session.user.siteRole = token.siteRole ?? "member";
      session.user.sessionVersion = token.sv ?? -1;
      return session;
    },
  },
  events: {
    // A JWT cannot be recalled, so sign-out moves the user's session version on: every cookie
    // issued before (this one and the user's other browsers) stops signing anything in.
    async signOut(message) {
      const id = "token" in message ? message.token?.id : undefined;
      if (typeof id === "string") await bumpSessionVersion(db, { userId: id });
    },
  },
});
