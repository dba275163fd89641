import type { Metadata } from "next";
import { SetDetail } from "./_components/set-detail";

export const metadata: Metadata = { title: "Parameter set" };

export default async function ParameterSetPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  return <SetDetail key={id} id={id} />;
}
