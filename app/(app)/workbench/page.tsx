import type { Metadata } from "next";
import { ScratchWorkbench } from "@/components/workbench/scratch-workbench";

export const metadata: Metadata = { title: "Workbench" };

export default async function WorkbenchScratchPage({ searchParams }: { searchParams: Promise<{ run?: string | string[] }> }) {
  const { run } = await searchParams;
  return <ScratchWorkbench runId={typeof run === "string" ? run : null} />;
}
