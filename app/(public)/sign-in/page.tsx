import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { DEMO_PASSWORD, DEMO_USERS } from "@/db/demo-data";
import { isDemoSeeded } from "@/db/queries/demo";
import { afterSignInTarget } from "@/lib/auth/after-sign-in";
import { SignInForm, type DemoAccount } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const DEMO_ACCOUNTS: DemoAccount[] = [
  { email: DEMO_USERS.lead.email, name: DEMO_USERS.lead.name, role: "Owner — manages members and sets" },
  { email: DEMO_USERS.postdoc.email, name: DEMO_USERS.postdoc.name, role: "Editor — creates and edits sets" },
  { email: DEMO_USERS.student.email, name: DEMO_USERS.student.name, role: "Viewer — reads only" },
];

function first(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const [params, demo] = await Promise.all([searchParams, isDemoSeeded(db)]);
  return (
    <div className="space-y-8">
      <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
        <h1 className="text-xl font-semibold">Sign in to Gyrolux</h1>
        <SignInForm
          redirectTo={afterSignInTarget(first(params.callbackUrl) ?? first(params.redirectTo))}
          demo={demo ? { accounts: DEMO_ACCOUNTS, password: DEMO_PASSWORD } : null}
        />
        <p className="mt-6 text-sm text-ink-soft">
          <Link href="/forgot-password" className="font-medium text-lux-dark underline underline-offset-4">
            Forgot your password?
          </Link>
        </p>
        <p className="mt-2 text-sm text-ink-soft">
          New here?{" "}
          <Link href="/sign-up" className="font-medium text-lux-dark underline underline-offset-4">
            Create an account
          </Link>
        </p>
      </section>
    </div>
  );
}
