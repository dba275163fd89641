import type { Metadata } from "next";
import Link from "next/link";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default function SignUpPage() {
  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Create a Gyrolux account</h1>
      <p className="mt-1 text-sm text-ink-soft">A lab owner adds you to their lab by your e-mail address once you have an account.</p>
      <SignUpForm />
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account?{" "}
        <Link href="/sign-in" className="font-medium text-lux-dark underline underline-offset-4">
          Sign in
        </Link>
      </p>
    </section>
  );
}
