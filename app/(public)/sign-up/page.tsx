import type { Metadata } from "next";
import Link from "next/link";
import { afterSignInTarget } from "@/lib/auth/after-sign-in";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

function first(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const redirectTo = first(params.redirectTo);
  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Create a Gyrolux account</h1>
      <p className="mt-1 text-sm text-ink-soft">A lab owner invites you to their lab by e-mail; you join when you accept.</p>
      <SignUpForm
        redirectTo={redirectTo ? afterSignInTarget(redirectTo) : undefined}
        initialEmail={(first(params.email) ?? "").slice(0, 320)}
      />
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account?{" "}
        <Link href="/sign-in" className="font-medium text-lux-dark underline underline-offset-4">
          Sign in
        </Link>
      </p>
    </section>
  );
}
