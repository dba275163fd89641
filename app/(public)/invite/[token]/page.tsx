import type { Metadata } from "next";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { LinkButton } from "@/components/ui/button";
import { db } from "@/db/client";
import { findInvitationByToken } from "@/db/queries/invitations";
import { getSessionUser } from "@/lib/auth/access";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";
import { INVITATION_REFUSED } from "@/lib/contracts/labs";
import { AcceptInvitation } from "./_components/accept-invitation";

export const metadata: Metadata = { title: "Invitation", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const [invitation, user] = await Promise.all([
    isLinkSecret(token) ? findInvitationByToken(db, { tokenHash: hashToken(token) }) : null,
    getSessionUser(),
  ]);
  const here = `/invite/${token}`;

  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Invitation to a lab</h1>
      {!invitation ? (
        <p className="mt-4">{INVITATION_REFUSED.unknown}</p>
      ) : invitation.state !== "pending" ? (
        <Alert tone="warning" title={`Invitation to ${invitation.labName}`}>
          {INVITATION_REFUSED[invitation.state]}
        </Alert>
      ) : (
        <>
          <p className="mt-4">
            {invitation.invitedByName ?? "An owner"} invites <strong>{invitation.email}</strong> to join{" "}
            <strong>{invitation.labName}</strong> as <strong>{invitation.role}</strong>. You join only when you accept.
          </p>
          {user ? (
            <AcceptInvitation token={token} labName={invitation.labName} signedInAs={user.email} invitedEmail={invitation.email} />
          ) : (
            <div className="mt-6 flex flex-wrap gap-3">
              <LinkButton href={`/sign-in?redirectTo=${encodeURIComponent(here)}`}>Sign in to accept</LinkButton>
              <LinkButton variant="secondary" href={`/sign-up?invitation=${encodeURIComponent(token)}`}>
                Create an account
              </LinkButton>
            </div>
          )}
        </>
      )}
      <p className="mt-6 text-sm text-ink-soft">
        <Link href="/parameter-sets" className="underline underline-offset-4">
          Go to Gyrolux
        </Link>
      </p>
    </section>
  );
}
