import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { AuditBrowser } from "./_components/audit-browser";

export const metadata: Metadata = { title: "Audit" };

export default function AuditPage() {
  return (
    <>
      <PageHeader title="Audit" lead="Who created, changed, restored, deleted, invited and shared what in the labs you own." />
      <AuditBrowser />
    </>
  );
}
