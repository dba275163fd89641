"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MeasurementSetSummary, UploadMeasurementMeta } from "@/lib/contracts/measurement-sets";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { RequestError } from "@/lib/query/fetcher";
import { apiFetch } from "./fetcher";
import type { ItemResponse } from "@/lib/contracts/common";
import type { Page } from "@/lib/contracts/paging";

const LIST_ROOT = ["measurement-sets"] as const;

export const measurementKeys = {
  lists: () => LIST_ROOT,
  list: (filter: { labId?: string; q?: string }) => [...LIST_ROOT, { labId: filter.labId ?? "", q: filter.q ?? "" }] as const,
  detail: (id: string) => ["measurement-set", id] as const,
  points: (id: string) => ["measurement-set", id, "points"] as const,
};

function listPath(filter: { labId?: string; q?: string }, cursor: string | null): string {
  const search = new URLSearchParams({ limit: String(PICKER_PAGE) });
  if (filter.labId) search.set("labId", filter.labId);
  if (filter.q) search.set("q", filter.q);
  if (cursor) search.set("cursor", cursor);
  return `/api/measurement-sets?${search}`;
}

// The pickers (overlay, fit) offer every set, so the list follows the pages to the end.
const PICKER_PAGE = 200;

async function allMeasurementSets(filter: { labId?: string; q?: string }, signal: AbortSignal): Promise<MeasurementSetSummary[]> {
  const items: MeasurementSetSummary[] = [];
  let cursor: string | null = null;
  do {
    const page: Page<MeasurementSetSummary> = await apiFetch<Page<MeasurementSetSummary>>(listPath(filter, cursor), { signal });
    items.push(...page.items);
    cursor = page.nextCursor;
  } while (cursor);
  return items;
}

export const measurementSetsQuery = (filter: { labId?: string; q?: string }) =>
  queryOptions({
    queryKey: measurementKeys.list(filter),
    queryFn: ({ signal }) => allMeasurementSets(filter, signal),
  });

export const measurementPointsQuery = (id: string) =>
  queryOptions({
    queryKey: measurementKeys.points(id),
    queryFn: ({ signal }) =>
      apiFetch<{ points: MeasuredPoint[] }>(`/api/measurement-sets/${encodeURIComponent(id)}/points`, { signal }).then((r) => r.points),
    // A set's points never change after import.
    staleTime: Number.POSITIVE_INFINITY,
  });

/** The sets of one lab (all the caller's labs when labId is undefined), newest first. */
export function useMeasurementSets(labId: string | undefined, q?: string) {
  return useQuery({ ...measurementSetsQuery({ labId, q }), placeholderData: (previous) => previous });
}

/** The points of one set in SI; disabled while id is null. */
export function useMeasurementPoints(id: string | null) {
  return useQuery({ ...measurementPointsQuery(id ?? ""), enabled: id !== null });
}

export function originalFileUrl(id: string): string {
  return `/api/measurement-sets/${encodeURIComponent(id)}/original`;
}

/** The row-by-row problems of a refused upload ("line 14: wavelength is empty"), or []. */
export function uploadProblems(error: unknown): string[] {
  if (!(error instanceof RequestError)) return [];
  const problems = (error.body as { error?: { problems?: unknown } } | null)?.error?.problems;
  return Array.isArray(problems) ? problems.filter((p): p is string => typeof p === "string") : [];
}

export function useUploadMeasurementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { file: File; meta: UploadMeasurementMeta }) => {
      const form = new FormData();
      form.set("file", input.file);
      form.set("labId", input.meta.labId);
      form.set("name", input.meta.name);
      form.set("sample", input.meta.sample);
      form.set("mapping", JSON.stringify(input.meta.mapping));
      form.set("defaults", JSON.stringify(input.meta.defaults));
      return apiFetch<ItemResponse<MeasurementSetSummary>>("/api/measurement-sets", { method: "POST", form }).then((r) => r.item);
    },
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: measurementKeys.lists() }),
  });
}

export function useDeleteMeasurementSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiFetch<void>(`/api/measurement-sets/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: measurementKeys.points(id) });
      void queryClient.invalidateQueries({ queryKey: measurementKeys.lists() });
    },
  });
}
