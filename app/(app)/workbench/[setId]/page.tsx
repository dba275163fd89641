import type { Metadata } from "next";
import { SetWorkbench } from "@/components/workbench/set-workbench";

export const metadata: Metadata = { title: "Workbench" };

export default async function WorkbenchSetPage({ params }: { params: Promise<{ setId: string }> }) {
  const { setId } = await params;
  return <SetWorkbench setId={setId} />;
}
