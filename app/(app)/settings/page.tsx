import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { auth } from "@/lib/auth/config";
import { EmailPanel } from "./_components/email-panel";
import { PasswordPanel } from "./_components/password-panel";
import { TokensPanel } from "./_components/tokens-panel";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  const session = await auth();
  return (
    <>
      <PageHeader title="Settings" />
      <EmailPanel />
      <PasswordPanel userId={session?.user?.id ?? ""} />
      <TokensPanel />
    </>
  );
}
