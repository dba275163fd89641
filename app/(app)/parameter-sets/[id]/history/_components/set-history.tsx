"use client";

import { useState } from "react";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { LoadMore } from "@/components/ui/load-more";
import { useParameterSet, useParameterSetVersionPages } from "@/lib/query/parameter-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { SetHeader } from "../../_components/set-header";
import { VersionCompare } from "./version-compare";
import { VersionList } from "./version-list";
import { noun } from "@/lib/text/plural";

export function SetHistory({ id }: { id: string }) {
  const set = useParameterSet(id);
  const versions = useParameterSetVersionPages(id);
  const [restored, setRestored] = useState<{ from: number; to: number } | null>(null);

  if (!set.data || !versions.data) {
    const error = set.error ?? versions.error;
    if (error) return <ErrorPanel error={error} retry={() => void Promise.all([set.refetch(), versions.refetch()])} />;
    return <SkeletonRows label="Loading the version history" rows={6} />;
  }

  const item = set.data;
  return (
    <>
      <SetHeader item={item} current="history" />
      {restored ? (
        <p role="status" className="mb-4 rounded-md border border-lux bg-lux-light px-4 py-3 text-sm">
          Restored: version {restored.to} now holds the content of version {restored.from}.
        </p>
      ) : null}
      {/* minmax(0,…) columns: a wide comparison table scrolls in its own box instead of widening the page. */}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-8 xl:grid-cols-[22rem_minmax(0,1fr)]">
        <div className="min-w-0">
          <VersionList
            setId={id}
            versions={versions.items}
            currentVersion={item.version}
            canRestore={roleAtLeast(item.role, "editor")}
            onRestored={(from, to) => setRestored({ from, to })}
          />
          <LoadMore
            shown={versions.items.length}
            hasMore={versions.hasNextPage}
            loading={versions.isFetchingNextPage}
            onMore={() => void versions.fetchNextPage()}
            noun={noun("version")}
          />
        </div>
        <VersionCompare versions={versions.items} />
      </div>
    </>
  );
}
