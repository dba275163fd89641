"use client";

import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { TextField } from "@/components/ui/text-field";
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH } from "@/lib/contracts/accounts";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useChangePassword, useEndAllSessions } from "@/lib/query/sharing";

/** Change the password (ends the other sessions) and sign out everywhere. */
export function PasswordPanel({ userId }: { userId: string }) {
  const change = useChangePassword();
  const endAll = useEndAllSessions(userId);
  const [values, setValues] = useState({ currentPassword: "", newPassword: "", confirm: "" });
  const [mismatch, setMismatch] = useState(false);
  const [confirmEnd, setConfirmEnd] = useState(false);
  const fields = change.error instanceof RequestError ? change.error.fields : undefined;
  const set = (key: keyof typeof values) => (event: React.ChangeEvent<HTMLInputElement>) =>
    setValues((v) => ({ ...v, [key]: event.target.value }));

  return (
    <section aria-labelledby="password-title" className="mb-10 max-w-3xl">
      <h2 id="password-title" className="text-lg font-semibold">
        Password and sessions
      </h2>
      <form
        className="mt-4 max-w-md space-y-4 rounded-lg border border-ink/10 bg-paper-raised p-4"
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          const differ = values.newPassword !== values.confirm;
          setMismatch(differ);
          if (!differ) {
            change.mutate(
              { currentPassword: values.currentPassword, newPassword: values.newPassword },
              { onSuccess: () => setValues({ currentPassword: "", newPassword: "", confirm: "" }) },
            );
          }
        }}
      >
        {change.isSuccess ? <Alert tone="info">Password changed. Your other browsers and devices are signed out.</Alert> : null}
        {change.isError && !fields ? <Alert tone="warning">{describeError(change.error)}</Alert> : null}
        <TextField
          id="current-password"
          name="currentPassword"
          type="password"
          label="Current password"
          autoComplete="current-password"
          required
          value={values.currentPassword}
          onChange={set("currentPassword")}
          error={fields?.currentPassword}
        />
        <TextField
          id="new-password"
          name="newPassword"
          type="password"
          label="New password"
          autoComplete="new-password"
          hint={`At least ${PASSWORD_MIN_LENGTH} characters, at most ${PASSWORD_MAX_BYTES} bytes.`}
          required
          value={values.newPassword}
          onChange={set("newPassword")}
          error={fields?.newPassword}
        />
        <TextField
          id="confirm-password"
          name="confirm"
          type="password"
          label="Confirm the new password"
          autoComplete="new-password"
          required
          value={values.confirm}
          onChange={set("confirm")}
          error={mismatch ? "The two passwords differ." : undefined}
        />
        <Button type="submit" disabled={change.isPending || values.currentPassword === "" || values.newPassword === ""}>
          {change.isPending ? "Changing…" : "Change password"}
        </Button>
      </form>
      <div className="mt-4">
        <Button variant="secondary" onClick={() => setConfirmEnd(true)}>
          Sign out everywhere
        </Button>
      </div>
      <ConfirmDialog
        open={confirmEnd}
        title="Sign out on every browser and device?"
        confirmLabel="Sign out everywhere"
        destructive
        pending={endAll.isPending}
        error={endAll.isError ? describeError(endAll.error) : null}
        onCancel={() => setConfirmEnd(false)}
        onConfirm={() => endAll.mutate(undefined, { onSuccess: () => window.location.assign("/sign-in") })}
      >
        Every session of your account ends, this one included, and every API token is revoked (scripts need a new one).
      </ConfirmDialog>
    </section>
  );
}
