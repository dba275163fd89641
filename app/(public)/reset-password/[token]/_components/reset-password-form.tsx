"use client";

import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH } from "@/lib/contracts/accounts";
import { RequestError, apiFetch, describeError } from "@/lib/query/fetcher";

export function ResetPasswordForm({ token }: { token: string }) {
  const [password, setPassword] = useState("");
  const [confirm, setConfirm] = useState("");
  const [mismatch, setMismatch] = useState(false);
  const reset = useMutation({
    mutationFn: () =>
      apiFetch<{ email: string }>("/api/password-reset/confirm", { method: "POST", json: { token, newPassword: password } }),
  });
  const fields = reset.error instanceof RequestError ? reset.error.fields : undefined;
  if (reset.isSuccess) {
    return (
      <Alert tone="info" title="Password changed">
        <Link href="/sign-in" className="underline underline-offset-4">
          Sign in
        </Link>{" "}
        with {reset.data.email} and the new password.
      </Alert>
    );
  }
  return (
    <form
      className="mt-6 space-y-4"
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        setMismatch(password !== confirm);
        if (password === confirm) reset.mutate();
      }}
    >
      {reset.isError ? <Alert tone="warning">{fields?.token ?? describeError(reset.error)}</Alert> : null}
      <TextField
        id="reset-password"
        name="password"
        type="password"
        label="New password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters, at most ${PASSWORD_MAX_BYTES} bytes.`}
        required
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={fields?.newPassword}
      />
      <TextField
        id="reset-confirm"
        name="confirmPassword"
        type="password"
        label="Confirm the new password"
        autoComplete="new-password"
        required
        value={confirm}
        onChange={(e) => setConfirm(e.target.value)}
        error={mismatch ? "The two passwords differ." : undefined}
      />
      <Button type="submit" disabled={reset.isPending || password === ""}>
        {reset.isPending ? "Saving…" : "Save the new password"}
      </Button>
    </form>
  );
}
