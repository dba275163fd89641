"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { apiFetch, describeError } from "@/lib/query/fetcher";

export function AcceptInvitation({
  token,
  labName,
  signedInAs,
  invitedEmail,
}: {
  token: string;
  labName: string;
  signedInAs: string;
  invitedEmail: string;
}) {
  const router = useRouter();
  const accept = useMutation({
    mutationFn: () => apiFetch<{ labId: string; labName: string }>("/api/invitations/accept", { method: "POST", json: { token } }),
    onSuccess: () => router.push("/lab"),
  });
  const otherAddress = signedInAs.toLowerCase() !== invitedEmail.toLowerCase();
  return (
    <div className="mt-6 space-y-3">
      <p className="text-sm text-ink-soft">Signed in as {signedInAs}.</p>
      {otherAddress ? (
        <Alert tone="warning">
          This invitation is for {invitedEmail}. Sign out and sign in (or create an account) with that address to accept it.
        </Alert>
      ) : (
        <Button onClick={() => accept.mutate()} disabled={accept.isPending || accept.isSuccess}>
          {accept.isPending ? "Joining…" : `Accept and join ${labName}`}
        </Button>
      )}
      {accept.isError ? (
        <p role="alert" className="text-sm text-ember">
          {describeError(accept.error)}
        </p>
      ) : null}
      {accept.isSuccess ? <p role="status">You joined {labName}. Opening your labs…</p> : null}
    </div>
  );
}
