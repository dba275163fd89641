"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { apiFetch, describeError } from "@/lib/query/fetcher";

/** Shown until the account's address is confirmed: an unconfirmed account may not invite anyone. */
export function EmailPanel() {
  const status = useQuery({
    queryKey: ["email-verification"],
    queryFn: ({ signal }) => apiFetch<{ verified: boolean }>("/api/email-verification", { signal }),
  });
  const resend = useMutation({ mutationFn: () => apiFetch<{ message: string }>("/api/email-verification", { method: "POST", json: {} }) });
  if (status.data?.verified !== false) return null;
  return (
    <section aria-labelledby="email-heading" className="mb-8 rounded-lg border border-ink/10 bg-paper-raised p-5">
      <h2 id="email-heading" className="font-semibold">
        Confirm your e-mail address
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        We mailed you a link when you signed up. Until you open it, you can work in your labs but not invite anyone.
      </p>
      {resend.isSuccess ? <Alert tone="info">{resend.data.message}</Alert> : null}
      {resend.isError ? <Alert tone="warning">{describeError(resend.error)}</Alert> : null}
      <div className="mt-3">
        <Button variant="secondary" onClick={() => resend.mutate()} disabled={resend.isPending}>
          {resend.isPending ? "Sending…" : "Send the link again"}
        </Button>
      </div>
    </section>
  );
}
