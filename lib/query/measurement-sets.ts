"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type {
  EditPointsInput,
  MeasurementSetSummary,
  PointChangeEntry,
  PointsResponse,
  UploadMeasurementMeta,
} from "@/lib/contracts/measurement-sets";
import { type MeasuredPoint, toMeasuredPoint, usablePoints } from "@/lib/measurements/point";
import { RequestError } from "@/lib/query/fetcher";
import { apiFetch } from "./fetcher";
import type { ItemResponse, ItemsResponse } from "@/lib/contracts/common";
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

/** Every point of a set with its mask, note and edits, and the set's revision (the measurement-set page). */
export const storedPointsQuery = (id: string) =>
  queryOptions({
    queryKey: measurementKeys.points(id),
    queryFn: ({ signal }) => apiFetch<PointsResponse>(`/api/measurement-sets/${encodeURIComponent(id)}/points`, { signal }),
    // Points change only through the edit below, which invalidates this key.
    staleTime: 60_000,
  });

/** The points a fit or an overlay uses: the unmasked ones, as measured points. */
export const measurementPointsQuery = (id: string) =>
  queryOptions({
    ...storedPointsQuery(id),
    select: (data: PointsResponse): MeasuredPoint[] => usablePoints(data.points).map(toMeasuredPoint),
  });

export const pointHistoryQueryOptions = (id: string) =>
  queryOptions({
    queryKey: [...measurementKeys.points(id), "history"] as const,
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<PointChangeEntry>>(`/api/measurement-sets/${encodeURIComponent(id)}/history`, { signal }).then((r) => r.items),
  });

export function useMeasurementSet(id: string) {
  return useQuery({
    queryKey: measurementKeys.detail(id),
    queryFn: ({ signal }) =>
      apiFetch<ItemResponse<MeasurementSetSummary>>(`/api/measurement-sets/${encodeURIComponent(id)}`, { signal }).then((r) => r.item),
  });
}

export function useStoredPoints(id: string) {
  return useQuery(storedPointsQuery(id));
}

export function usePointHistory(id: string) {
  return useQuery(pointHistoryQueryOptions(id));
}

/** One new revision of the set with these changes; the points, history, set and lists reload. */
export function useEditPoints(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EditPointsInput) =>
      apiFetch<{ revision: number; changedPoints: number }>(`/api/measurement-sets/${encodeURIComponent(id)}/points`, {
        method: "PATCH",
        json: input,
      }),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: measurementKeys.points(id) });
      void queryClient.invalidateQueries({ queryKey: measurementKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: measurementKeys.lists() });
    },
  });
}

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
      form.set("format", JSON.stringify(input.meta.format));
      if (input.meta.signsFrom) form.set("signsFrom", JSON.stringify(input.meta.signsFrom));
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
