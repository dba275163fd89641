import type { Metadata } from "next";
import { SetHistory } from "./_components/set-history";

export const metadata: Metadata = { title: "Version history" };

export default async function ParameterSetHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  return <SetHistory key={id} id={id} />;
}
