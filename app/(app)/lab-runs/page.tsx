import type { Metadata } from "next";
import { RunsList } from "./_components/runs-list";

export const metadata: Metadata = { title: "Lab runs" };

export default function RunsPage() {
  return <RunsList />;
}
