import type { Metadata } from "next";
import { auth } from "@/lib/auth/config";
import { PageHeader } from "@/components/ui/page-header";
import { LabsOverview } from "./_components/labs-overview";

export const metadata: Metadata = { title: "Lab" };

export default async function LabPage() {
  const session = await auth();
  return (
    <>
      <PageHeader title="Lab" lead="The labs you belong to and their members. Owners invite people by e-mail and set their roles." />
      <LabsOverview currentUserId={session?.user?.id ?? ""} />
    </>
  );
}
