import type { Metadata } from "next";
import { ScratchWorkbench } from "@/components/workbench/scratch-workbench";

export const metadata: Metadata = { title: "Workbench" };

export default function WorkbenchScratchPage() {
  return <ScratchWorkbench />;
}
