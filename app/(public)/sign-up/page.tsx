import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { db } from "@/db/client";
import { findInvitationByToken, type InvitationView } from "@/db/queries/invitations";
import { afterSignInTarget } from "@/lib/auth/after-sign-in";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";
import { INVITATION_REFUSED } from "@/lib/contracts/labs";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

function first(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

async function invitationOf(token: string | undefined): Promise<InvitationView | null | undefined> {
  if (token === undefined) return undefined;
  return isLinkSecret(token) ? findInvitationByToken(db, { tokenHash: hashToken(token) }) : null;
}

/**
 * The sign-up form. Opened from an invitation (`?invitation=<the link's secret>`), the new account
 * joins the invited lab with the invitation's role and gets no personal lab, so the invitee lands
 * in the group's lab; without one it gets a personal lab of its own.
 */
export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const token = first(params.invitation);
  const invitation = await invitationOf(token);
  const pending = token !== undefined && invitation?.state === "pending" ? { token, ...invitation } : null;
  const redirectTo = first(params.redirectTo) ?? (pending ? "/lab" : undefined);
  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Create a Gyrolux account</h1>
      {pending ? (
        <p className="mt-1 text-sm text-ink-soft">
          With this invitation your account joins <strong>{pending.labName}</strong> as <strong>{pending.role}</strong>. Use the invited
          address, {pending.email}.
        </p>
      ) : (
        <p className="mt-1 text-sm text-ink-soft">
          Your account gets a personal lab of its own. A lab owner invites you to their lab by e-mail; you join when you accept.
        </p>
      )}
      {token !== undefined && !pending ? (
        <div className="mt-4">
          <Alert tone="warning" title="The invitation cannot be used">
            {invitation && invitation.state !== "pending" ? INVITATION_REFUSED[invitation.state] : INVITATION_REFUSED.unknown} You can still
            create an account without it.
          </Alert>
        </div>
      ) : null}
      <SignUpForm
        redirectTo={redirectTo ? afterSignInTarget(redirectTo) : undefined}
        initialEmail={(pending?.email ?? first(params.email) ?? "").slice(0, 320)}
        invitationToken={pending?.token}
      />
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account?{" "}
        <Link
          href={pending ? `/sign-in?redirectTo=${encodeURIComponent(`/invite/${pending.token}`)}` : "/sign-in"}
          className="font-medium text-lux-dark underline underline-offset-4"
        >
          Sign in
        </Link>
      </p>
    </section>
  );
}
