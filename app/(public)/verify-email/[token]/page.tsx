import type { Metadata } from "next";
import { ConfirmEmail } from "./_components/confirm-email";

export const metadata: Metadata = { title: "Confirm your e-mail address", robots: { index: false, follow: false } };

export default async function VerifyEmailPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <section className="rounded-lg border border-ink/10 bg-paper-raised p-6 shadow-sm sm:p-8">
      <h1 className="text-xl font-semibold">Confirm your e-mail address</h1>
      <p className="mt-1 text-sm text-ink-soft">Once confirmed, your account may invite people to its labs.</p>
      <ConfirmEmail token={token} />
    </section>
  );
}
