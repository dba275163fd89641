"use client";

import { keepPreviousData, useInfiniteQuery } from "@tanstack/react-query";
import type { Page } from "@/lib/contracts/paging";
import { apiFetch } from "./fetcher";

/* One hook for every paged list of the API ({ items, nextCursor }): pages load on demand. */

export const UI_PAGE_SIZE = 50;

function withPage(path: string, cursor: string | null, limit: number): string {
  const url = new URL(path, "http://x");
  url.searchParams.set("limit", String(limit));
  if (cursor) url.searchParams.set("cursor", cursor);
  return `${url.pathname}${url.search}`;
}

export function usePagedList<T>(options: { queryKey: readonly unknown[]; path: string; enabled?: boolean; limit?: number }) {
  const limit = options.limit ?? UI_PAGE_SIZE;
  const query = useInfiniteQuery({
    queryKey: [...options.queryKey, "paged", limit],
    queryFn: ({ pageParam, signal }) => apiFetch<Page<T>>(withPage(options.path, pageParam, limit), { signal }),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
    enabled: options.enabled,
    // A new filter keeps the old rows on screen until its first page arrives (no flicker while typing).
    placeholderData: keepPreviousData,
  });
  const items = query.data?.pages.flatMap((page) => page.items) ?? [];
  return { ...query, items };
}
