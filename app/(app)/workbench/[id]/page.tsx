import type { Metadata } from "next";
import { SetWorkbench } from "@/components/workbench/set-workbench";

export const metadata: Metadata = { title: "Workbench" };

export default async function WorkbenchSetPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ run?: string | string[] }>;
}) {
  const { id } = await params;
  const { run } = await searchParams;
  return <SetWorkbench setId={id} runId={typeof run === "string" ? run : null} />;
}
