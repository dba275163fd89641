import "server-only";
import NextAuth, { CredentialsSignin, type DefaultSession } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import type { SiteRole } from "@/db/schema";
import { findUserByEmail } from "@/db/queries/users";
import { clientIp } from "./client-ip";
import { dummyVerify, verifyPassword } from "./password";
import { clearSignInFailures, recordSignInFailure, signInWaitSeconds } from "./rate-limit";
import { signInSchema } from "./schemas";

declare module "next-auth" {
  interface Session {
    user: { id: string; siteRole: SiteRole } & DefaultSession["user"];
  }
  interface User {
    siteRole?: SiteRole;
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    id?: string;
    siteRole?: SiteRole;
  }
}

/** Thrown from authorize while failures are being slowed; its code reaches the redirect URL. */
export class RateLimitedSignin extends CredentialsSignin {
  code = "rate_limited";
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
        const ip = clientIp(request.headers);
        if ((await signInWaitSeconds({ email, ip })) > 0) throw new RateLimitedSignin();
        const user = await findUserByEmail({ email });
        // Unknown e-mail: same bcrypt cost and the same answer as a wrong password.
        const valid = user ? await verifyPassword(password, user.passwordHash) : await dummyVerify(password);
        if (!user || !valid) {
          await recordSignInFailure({ email, ip });
          return null;
        }
        await clearSignInFailures({ email, ip });
        return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.id = user.id;
        token.siteRole = user.siteRole ?? "member";
      }
      return token;
    },
    session({ session, token }) {
      if (token.id) session.user.id = token.id;
      session.user.siteRole = token.siteRole ?? "member";
      return session;
    },
  },
});
