import type { Metadata } from "next";
import { PlannerScreen } from "./_components/planner-screen";

export const metadata: Metadata = { title: "Planner" };

export default async function PlannerPage({ searchParams }: { searchParams: Promise<{ setId?: string | string[] }> }) {
  const { setId } = await searchParams;
  const id = typeof setId === "string" && setId.length > 0 ? setId : null;
  return <PlannerScreen setId={id} />;
}
