import type { Metadata } from "next";
import { SetWorkbench } from "@/components/workbench/set-workbench";

export const metadata: Metadata = { title: "Workbench" };

export default async function WorkbenchSetPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  return <SetWorkbench setId={id} />;
}
