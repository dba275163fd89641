"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { RequestError, apiFetch, describeError } from "@/lib/query/fetcher";

export function ForgotPasswordForm() {
  const [email, setEmail] = useState("");
  const request = useMutation({
    mutationFn: () => apiFetch<{ message: string }>("/api/password-reset", { method: "POST", json: { email } }),
  });
  const fieldError = request.error instanceof RequestError ? request.error.fields?.email : undefined;
  return (
    <form
      className="mt-6 space-y-4"
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        request.mutate();
      }}
    >
      {request.isSuccess ? <Alert tone="info">{request.data.message}</Alert> : null}
      {request.isError && !fieldError ? <Alert tone="warning">{describeError(request.error)}</Alert> : null}
      <TextField
        id="forgot-email"
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        required
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={fieldError}
      />
      <Button type="submit" disabled={request.isPending || email.trim() === ""}>
        {request.isPending ? "Sending…" : "Send the reset link"}
      </Button>
    </form>
  );
}
