"use client";

import { useActionState, useState } from "react";
import { signInAction } from "@/lib/auth/actions";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";

export interface DemoAccount {
  email: string;
  name: string;
  role: string;
}

interface SignInFormProps {
  redirectTo: string;
  demo: { accounts: DemoAccount[]; password: string } | null;
}

const FIELDS = [
  { name: "email", id: "sign-in-email", type: "email", label: "E-mail", autoComplete: "username" },
  { name: "password", id: "sign-in-password", type: "password", label: "Password", autoComplete: "current-password" },
] as const;

export function SignInForm({ redirectTo, demo }: SignInFormProps) {
  const [state, formAction, pending] = useActionState(signInAction, {});
  // Controlled, so a failed attempt keeps what was typed and the demo buttons can fill them.
  const [values, setValues] = useState({ email: "", password: "" });

  return (
    <>
      <form action={formAction} className="mt-6 space-y-4" noValidate>
        <input type="hidden" name="redirectTo" value={redirectTo} />
        {state?.error ? <Alert tone="warning">{state.error}</Alert> : null}
        {FIELDS.map((field) => (
          <TextField
            key={field.name}
            {...field}
            required
            value={values[field.name]}
            onChange={(event) => setValues((v) => ({ ...v, [field.name]: event.target.value }))}
            error={state?.fields?.[field.name]}
          />
        ))}
        <Button type="submit" className="w-full" disabled={pending}>
          {pending ? "Signing in…" : "Sign in"}
        </Button>
      </form>
      {demo ? (
        <DemoAccounts
          accounts={demo.accounts}
          password={demo.password}
          onPick={(account) => setValues({ email: account.email, password: demo.password })}
        />
      ) : null}
    </>
  );
}

function DemoAccounts({ accounts, password, onPick }: { accounts: DemoAccount[]; password: string; onPick: (a: DemoAccount) => void }) {
  return (
    <section aria-labelledby="demo-accounts-title" className="mt-8 rounded-md border border-dashed border-lux/50 bg-lux-light/40 p-4">
      <h2 id="demo-accounts-title" className="text-sm font-semibold">
        Demo accounts
      </h2>
      <p className="mt-1 text-xs text-ink-soft">
        This server holds the invented demo lab. Every account uses the password{" "}
        <code className="rounded bg-paper-raised px-1 font-mono">{password}</code>. Pick one to fill the form.
      </p>
      <ul className="mt-3 space-y-2">
        {accounts.map((account) => (
          <li key={account.email}>
            <button
              type="button"
              onClick={() => onPick(account)}
              className="w-full rounded-md border border-ink/15 bg-paper-raised px-3 py-2 text-left text-sm hover:border-lux"
            >
              <span className="block font-medium">{account.email}</span>
              <span className="block text-xs text-ink-soft">
                {account.name} · {account.role}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
