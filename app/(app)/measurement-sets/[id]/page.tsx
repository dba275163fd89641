import type { Metadata } from "next";
import { MeasurementSetDetail } from "./_components/set-detail";

export const metadata: Metadata = { title: "Measurement set" };

export default async function MeasurementSetPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  return <MeasurementSetDetail key={id} id={id} />;
}
