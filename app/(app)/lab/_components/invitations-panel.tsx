"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DateTime } from "@/components/ui/date-time";
import { ErrorPanel } from "@/components/ui/error-panel";
import { LoadMore } from "@/components/ui/load-more";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useInvitations, useInvite, useRevokeInvitation, type InvitationSummary } from "@/lib/query/sharing";
import { type LabRole, LAB_ROLES } from "@/lib/contracts/roles";
import { ROLE_LABEL, ROLE_MEANING } from "@/lib/contracts/roles";
import { noun } from "@/lib/text/plural";

/** Owners invite people by e-mail; they join when they accept. Pending invitations can be withdrawn. */
export function InvitationsPanel({ labId, labName }: { labId: string; labName: string }) {
  const invite = useInvite(labId);
  const pending = useInvitations(labId, true);
  const revoke = useRevokeInvitation(labId);
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<LabRole>("viewer");
  const [sentTo, setSentTo] = useState<{ email: string; mail: "sent" | "queued" } | null>(null);
  const [revoking, setRevoking] = useState<InvitationSummary | null>(null);
  const emailError = invite.error instanceof RequestError ? invite.error.fields?.email : undefined;

  return (
    <div className="mt-4 space-y-4">
      <form
        className="rounded-lg border border-ink/10 bg-paper-raised p-4"
        aria-label={`Invite someone to ${labName}`}
        onSubmit={(event) => {
          event.preventDefault();
          setSentTo(null);
          invite.mutate(
            { email: email.trim(), role },
            {
              onSuccess: (answer) => {
                setSentTo({ email: email.trim(), mail: answer.mail });
                setEmail("");
              },
            },
          );
        }}
      >
        <h3 className="text-sm font-semibold">Invite by e-mail</h3>
        <div className="mt-2 flex flex-wrap items-end gap-3">
          <div className="w-full sm:w-72">
            <label htmlFor={`invite-email-${labId}`} className="block text-sm font-medium">
              E-mail address
            </label>
            <input
              id={`invite-email-${labId}`}
              type="email"
              required
              value={email}
              onChange={(event) => setEmail(event.target.value)}
              aria-invalid={emailError ? true : undefined}
              className={`mt-1 ${INPUT_CLASS}`}
            />
          </div>
          <div className="w-full sm:w-72">
            <label htmlFor={`invite-role-${labId}`} className="block text-sm font-medium">
              Role
            </label>
            <select
              id={`invite-role-${labId}`}
              value={role}
              onChange={(event) => setRole(event.target.value as LabRole)}
              className={`mt-1 ${INPUT_CLASS}`}
            >
              {LAB_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABEL[r]} — {ROLE_MEANING[r]}
                </option>
              ))}
            </select>
          </div>
          <Button type="submit" disabled={invite.isPending || email.trim() === ""}>
            {invite.isPending ? "Sending…" : "Send invitation"}
          </Button>
        </div>
        <p className="mt-2 text-xs text-ink-soft">They get a link that works once for 7 days; they join only when they accept.</p>
        {invite.isError ? (
          <p role="alert" className="mt-2 text-sm text-ember">
            {emailError ?? describeError(invite.error)}
          </p>
        ) : null}
        {sentTo ? (
          <p role="status" className="mt-2 text-sm text-lux-dark">
            {sentTo.mail === "sent"
              ? `Invitation sent to ${sentTo.email}.`
              : `Invitation saved for ${sentTo.email}. The mail server has not taken the e-mail yet; it is retried automatically.`}
          </p>
        ) : null}
      </form>

      <section aria-label={`Pending invitations of ${labName}`}>
        <h3 className="text-sm font-semibold">Pending invitations</h3>
        {pending.isPending ? (
          <p className="mt-1 text-sm text-ink-soft">Loading…</p>
        ) : pending.isError ? (
          <ErrorPanel error={pending.error} retry={() => void pending.refetch()} />
        ) : pending.items.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">No pending invitations.</p>
        ) : (
          <>
            <ul className="mt-2 divide-y divide-ink/10 rounded-lg border border-ink/10 bg-paper-raised">
              {pending.items.map((item) => (
                <li key={item.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                  <span>
                    <span className="font-medium">{item.email}</span> as {ROLE_LABEL[item.role]} · expires <DateTime iso={item.expiresAt} />
                  </span>
                  <Button
                    variant="danger"
                    className="py-1"
                    onClick={() => {
                      revoke.reset();
                      setRevoking(item);
                    }}
                  >
                    Withdraw<span className="sr-only"> the invitation of {item.email}</span>
                  </Button>
                </li>
              ))}
            </ul>
            <LoadMore
              shown={pending.items.length}
              hasMore={pending.hasNextPage}
              loading={pending.isFetchingNextPage}
              onMore={() => void pending.fetchNextPage()}
              noun={noun("invitation")}
            />
          </>
        )}
      </section>

      <ConfirmDialog
        open={revoking !== null}
        title={`Withdraw the invitation of ${revoking?.email ?? ""}?`}
        confirmLabel="Withdraw invitation"
        destructive
        pending={revoke.isPending}
        error={revoke.isError ? describeError(revoke.error) : null}
        onCancel={() => setRevoking(null)}
        onConfirm={() => {
          if (revoking) revoke.mutate(revoking.id, { onSuccess: () => setRevoking(null) });
        }}
      >
        The link in their e-mail stops working at once. You can invite them again later.
      </ConfirmDialog>
    </div>
  );
}
