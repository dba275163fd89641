"use client";

import { useActionState, useState } from "react";
import { signUpAction } from "@/lib/auth/actions";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";

// Same bounds as lib/auth/password.ts, which cannot be imported here: it pulls bcrypt into the bundle.
const PASSWORD_MIN_LENGTH = 8;
const PASSWORD_MAX_LENGTH = 72;

export function SignUpForm() {
  const [state, formAction, pending] = useActionState(signUpAction, {});
  const [values, setValues] = useState({ name: "", email: "", password: "", confirmPassword: "" });
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
        // Checked here for a quick answer; the server action checks again.
        const errors: Record<string, string> = {};
        if (!values.name.trim()) errors.name = "Enter your name.";
        if (!values.email.includes("@")) errors.email = "Enter a valid e-mail address.";
        if (values.password.length < PASSWORD_MIN_LENGTH) errors.password = `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
        if (values.confirmPassword !== values.password) errors.confirmPassword = "The two passwords differ.";
        setLocalError(errors);
        if (Object.keys(errors).length > 0) event.preventDefault();
      }}
    >
      {state?.error ? <Alert tone="warning">{state.error}</Alert> : null}
      <TextField id="sign-up-name" name="name" label="Name" autoComplete="name" required value={values.name} onChange={set("name")} error={fieldError("name")} />
      <TextField
        id="sign-up-email"
        name="email"
        type="email"
        label="E-mail"
        autoComplete="email"
        required
        value={values.email}
        onChange={set("email")}
        error={fieldError("email")}
      />
      <TextField
        id="sign-up-password"
        name="password"
        type="password"
        label="Password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN_LENGTH}
        maxLength={PASSWORD_MAX_LENGTH}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={values.password}
        onChange={set("password")}
        error={fieldError("password")}
      />
      <TextField
        id="sign-up-confirm"
        name="confirmPassword"
        type="password"
        label="Confirm password"
        autoComplete="new-password"
        required
        value={values.confirmPassword}
        onChange={set("confirmPassword")}
        error={fieldError("confirmPassword")}
      />
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? "Creating account…" : "Create account"}
      </Button>
    </form>
  );
}
