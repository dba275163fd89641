import type { Metadata } from "next";
import { RunView } from "../_components/run-view";

export const metadata: Metadata = { title: "Lab run" };

export default async function RunPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  return <RunView id={id} />;
}
