"use client";

import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { RequestError, apiFetch, describeError } from "@/lib/query/fetcher";

/* A button, not a confirmation on page load: mail scanners that open links must not confirm by themselves. */
export function ConfirmEmail({ token }: { token: string }) {
  const confirm = useMutation({
    mutationFn: () => apiFetch<{ email: string }>("/api/email-verification/confirm", { method: "POST", json: { token } }),
  });
  if (confirm.isSuccess) {
    return (
      <Alert tone="info" title="Address confirmed">
        {confirm.data.email} is confirmed.{" "}
        <Link href="/lab" className="underline underline-offset-4">
          Open your lab
        </Link>
        .
      </Alert>
    );
  }
  const fields = confirm.error instanceof RequestError ? confirm.error.fields : undefined;
  return (
    <div className="mt-6 space-y-4">
      {confirm.isError ? <Alert tone="warning">{fields?.token ?? describeError(confirm.error)}</Alert> : null}
      <Button onClick={() => confirm.mutate()} disabled={confirm.isPending}>
        {confirm.isPending ? "Confirming…" : "Confirm my address"}
      </Button>
    </div>
  );
}
