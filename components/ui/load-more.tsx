"use client";

import { Button } from "./button";
import { countOf, type Noun } from "@/lib/text/plural";

/** The foot of a paged list: how many are shown, and a button for the next page while there is one. */
export function LoadMore({
  shown,
  hasMore,
  loading,
  onMore,
  noun,
}: {
  shown: number;
  hasMore: boolean;
  loading: boolean;
  onMore: () => void;
  noun: Noun;
}) {
  return (
    <div className="mt-3 flex flex-wrap items-center gap-3 text-sm text-ink-soft">
      <span role="status">
        {countOf(shown, noun)} shown{hasMore ? "; more exist" : ""}.
      </span>
      {hasMore ? (
        <Button variant="secondary" className="py-1" disabled={loading} onClick={onMore}>
          {loading ? "Loading…" : `Show more ${noun.other}`}
        </Button>
      ) : null}
    </div>
  );
}
