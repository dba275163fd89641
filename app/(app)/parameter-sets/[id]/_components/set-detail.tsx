"use client";

import { SetEditor } from "@/components/parameter-sets/set-editor";
import { SetReadOnly } from "@/components/parameter-sets/set-read-only";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { SetHeader } from "./set-header";
import { ShareLinksPanel } from "./share-links-panel";

export function SetDetail({ id }: { id: string }) {
  const set = useParameterSet(id);
  const item = set.data;
  // Once loaded, a failed background refetch must not unmount the editor and lose the user's edits.
  if (!item) {
    if (set.isError) return <ErrorPanel error={set.error} retry={() => void set.refetch()} />;
    return <SkeletonRows label="Loading the parameter set" rows={8} />;
  }

  return (
    <>
      <SetHeader item={item} current="detail" />
      {roleAtLeast(item.role, "editor") ? <SetEditor initial={item} /> : <SetReadOnly item={item} />}
      {roleAtLeast(item.role, "editor") ? <ShareLinksPanel setId={item.id} /> : null}
    </>
  );
}
