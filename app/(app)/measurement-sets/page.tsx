import type { Metadata } from "next";
import { Suspense } from "react";
import { SkeletonRows } from "@/components/ui/skeleton";
import { MeasurementsBrowser } from "./_components/measurements-browser";

export const metadata: Metadata = { title: "Measurements" };

export default function MeasurementsPage() {
  return (
    <Suspense fallback={<SkeletonRows label="Loading measurement sets" />}>
      <MeasurementsBrowser />
    </Suspense>
  );
}
