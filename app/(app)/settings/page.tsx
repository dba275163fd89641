import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { TokensPanel } from "./_components/tokens-panel";

export const metadata: Metadata = { title: "Settings" };

export default function SettingsPage() {
  return (
    <>
      <PageHeader title="Settings" />
      <TokensPanel />
    </>
  );
}
