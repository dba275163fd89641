import type { Metadata } from "next";
import { NewSet } from "./_components/new-set";

export const metadata: Metadata = { title: "New parameter set" };

export default async function NewParameterSetPage({ searchParams }: { searchParams: Promise<{ lab?: string | string[] }> }) {
  const { lab } = await searchParams;
  return <NewSet initialLabId={typeof lab === "string" ? lab : undefined} />;
}
