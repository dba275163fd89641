"use client";

import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { useLabs } from "@/lib/query/labs";
import { LabSection } from "./lab-section";

export function LabsOverview({ currentUserId }: { currentUserId: string }) {
  const labs = useLabs();
  if (labs.isPending) return <SkeletonRows label="Loading your labs" rows={4} />;
  if (labs.isError) return <ErrorPanel error={labs.error} retry={() => void labs.refetch()} />;
  if (labs.data.length === 0) {
    return (
      <p className="max-w-2xl rounded-lg border border-dashed border-ink/20 bg-paper-raised px-5 py-6">
        You are not a member of any lab yet. Ask a lab owner to invite you; the invitation arrives by e-mail.
      </p>
    );
  }
  return (
    <div className="space-y-10">
      {labs.data.map((lab) => (
        <LabSection key={lab.id} lab={lab} currentUserId={currentUserId} />
      ))}
    </div>
  );
}
