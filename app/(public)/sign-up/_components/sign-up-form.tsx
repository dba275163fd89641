"use client";

import { useActionState, useState } from "react";
import { signUpAction } from "@/lib/auth/actions";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, signUpSchema } from "@/lib/contracts/accounts";
import { zodIssueFields } from "@/lib/contracts/validation";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";

const FIELDS = [
  { name: "name", id: "sign-up-name", label: "Name", autoComplete: "name" },
  { name: "email", id: "sign-up-email", type: "email", label: "E-mail", autoComplete: "email" },
  {
    name: "password",
    id: "sign-up-password",
    type: "password",
    label: "Password",
    autoComplete: "new-password",
    minLength: PASSWORD_MIN_LENGTH,
    maxLength: PASSWORD_MAX_LENGTH,
    hint: `At least ${PASSWORD_MIN_LENGTH} characters.`,
  },
  { name: "confirmPassword", id: "sign-up-confirm", type: "password", label: "Confirm password", autoComplete: "new-password" },
] as const;

export function SignUpForm({
  redirectTo,
  initialEmail = "",
  invitationToken,
}: {
  redirectTo?: string;
  initialEmail?: string;
  /** The invitation link's secret: the account joins the invited lab instead of getting a personal one. */
  invitationToken?: string;
}) {
  const [state, formAction, pending] = useActionState(signUpAction, {});
  const [values, setValues] = useState({ name: "", email: initialEmail, password: "", confirmPassword: "" });
  const [localError, setLocalError] = useState<Record<string, string>>({});

  const set = (key: keyof typeof values) => (event: React.ChangeEvent<HTMLInputElement>) =>
    setValues((v) => ({ ...v, [key]: event.target.value }));

  const fieldError = (key: string) => localError[key] ?? state?.fields?.[key];

  return (
    <form
      action={formAction}
      className="mt-6 space-y-4"
      noValidate
      onSubmit={(event) => {
        // The server action's own schema, for a quick answer; the action checks again.
        const parsed = signUpSchema.safeParse(values);
        const errors = parsed.success ? {} : zodIssueFields(parsed.error.issues);
        if (values.confirmPassword !== values.password) errors.confirmPassword = "The two passwords differ.";
        setLocalError(errors);
        if (Object.keys(errors).length > 0) event.preventDefault();
      }}
    >
      {state?.error ? <Alert tone="warning">{state.error}</Alert> : null}
      {FIELDS.map((field) => (
        <TextField
          key={field.name}
          {...field}
          required
          value={values[field.name]}
          onChange={set(field.name)}
          error={fieldError(field.name)}
        />
      ))}
      {redirectTo ? <input type="hidden" name="redirectTo" value={redirectTo} /> : null}
      {invitationToken ? <input type="hidden" name="invitationToken" value={invitationToken} /> : null}
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? "Creating account…" : invitationToken ? "Create account and join" : "Create account"}
      </Button>
    </form>
  );
}
