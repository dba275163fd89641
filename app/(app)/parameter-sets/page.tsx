import type { Metadata } from "next";
import { Suspense } from "react";
import { SkeletonRows } from "@/components/ui/skeleton";
import { SetsBrowser } from "./_components/sets-browser";

export const metadata: Metadata = { title: "Parameter sets" };

export default function ParameterSetsPage() {
  return (
    <Suspense fallback={<SkeletonRows label="Loading parameter sets" />}>
      <SetsBrowser />
    </Suspense>
  );
}
