import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "./_components/forgot-password-form";

export const metadata: Metadata = { title: "Reset your password" };

export default function ForgotPasswordPage() {
  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Reset your password</h1>
      <p className="mt-1 text-sm text-ink-soft">Enter the address you sign in with. We e-mail it a link to choose a new password.</p>
      <ForgotPasswordForm />
      <p className="mt-6 text-sm text-ink-soft">
        <Link href="/sign-in" className="font-medium text-lux-dark underline underline-offset-4">
          Back to sign-in
        </Link>
      </p>
    </section>
  );
}
