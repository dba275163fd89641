"use client";

import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { useLabs } from "@/lib/query/labs";
import { LabSection } from "./lab-section";
import { NoLabYet } from "./no-lab-yet";

export function LabsOverview({ currentUserId }: { currentUserId: string }) {
  const labs = useLabs();
  if (labs.isPending) return <SkeletonRows label="Loading your labs" rows={4} />;
  if (labs.isError) return <ErrorPanel error={labs.error} retry={() => void labs.refetch()} />;
  if (labs.data.length === 0) return <NoLabYet />;
  return (
    <div className="space-y-10">
      {labs.data.map((lab) => (
        <LabSection key={lab.id} lab={lab} currentUserId={currentUserId} />
      ))}
    </div>
  );
}
