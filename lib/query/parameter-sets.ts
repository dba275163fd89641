"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ModelParams } from "@/lib/physics/schema";
import { apiFetch } from "./fetcher";
import { usePagedList } from "./paging";
import type { ItemResponse, ItemsResponse } from "@/lib/contracts/common";
import type { ParameterSet, ParameterSetSummary, ParameterSetVersion } from "@/lib/contracts/parameter-sets";

export interface ParameterSetFilter {
  labId?: string;
  q?: string;
  tag?: string;
}

export interface ParameterSetDraft {
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
}

const LIST_ROOT = ["parameter-sets"] as const;

export const parameterSetKeys = {
  lists: () => LIST_ROOT,
  list: (filter: ParameterSetFilter) => [...LIST_ROOT, { labId: filter.labId ?? "", q: filter.q ?? "", tag: filter.tag ?? "" }] as const,
  detail: (id: string) => ["parameter-set", id] as const,
  versions: (id: string) => ["parameter-set", id, "versions"] as const,
};

function listPath(filter: ParameterSetFilter): string {
  const search = new URLSearchParams();
  if (filter.labId) search.set("labId", filter.labId);
  if (filter.q) search.set("q", filter.q);
  if (filter.tag) search.set("tag", filter.tag);
  const qs = search.toString();
  return qs ? `/api/parameter-sets?${qs}` : "/api/parameter-sets";
}

// Pickers (compare, audit filter) read one page of the largest size; list screens page on demand.
const PICKER_LIMIT = 200;
const withLimit = (path: string) => `${path}${path.includes("?") ? "&" : "?"}limit=${PICKER_LIMIT}`;

export const parameterSetsQuery = (filter: ParameterSetFilter) =>
  queryOptions({
    queryKey: parameterSetKeys.list(filter),
    queryFn: ({ signal }) => apiFetch<ItemsResponse<ParameterSetSummary>>(withLimit(listPath(filter)), { signal }).then((r) => r.items),
  });

export const parameterSetQuery = (id: string) =>
  queryOptions({
    queryKey: parameterSetKeys.detail(id),
    queryFn: ({ signal }) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/parameter-sets/${encodeURIComponent(id)}`, { signal }).then((r) => r.item),
  });

export const parameterSetVersionsQuery = (id: string) =>
  queryOptions({
    queryKey: parameterSetKeys.versions(id),
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<ParameterSetVersion>>(withLimit(`/api/parameter-sets/${encodeURIComponent(id)}/versions`), { signal }).then(
        (r) => r.items,
      ),
  });

export function useParameterSets(filter: ParameterSetFilter) {
  return useQuery({ ...parameterSetsQuery(filter), placeholderData: (previous) => previous });
}

/** The set list screen: pages of sets, loaded on demand. */
export function useParameterSetPages(filter: ParameterSetFilter) {
  return usePagedList<ParameterSetSummary>({ queryKey: parameterSetKeys.list(filter), path: listPath(filter) });
}

/** The history screen: pages of versions, newest first. */
export function useParameterSetVersionPages(id: string) {
  return usePagedList<ParameterSetVersion>({
    queryKey: parameterSetKeys.versions(id),
    path: `/api/parameter-sets/${encodeURIComponent(id)}/versions`,
  });
}

export function useParameterSet(id: string) {
  return useQuery(parameterSetQuery(id));
}

export function useParameterSetVersions(id: string) {
  return useQuery(parameterSetVersionsQuery(id));
}

/** After any write the list, the set and its versions may all have changed. */
function useInvalidateSet() {
  const queryClient = useQueryClient();
  return (item: ParameterSet | null, id: string) => {
    if (item) queryClient.setQueryData(parameterSetKeys.detail(id), item);
    void queryClient.invalidateQueries({ queryKey: parameterSetKeys.lists() });
    void queryClient.invalidateQueries({ queryKey: parameterSetKeys.versions(id) });
  };
}

export function useCreateParameterSet() {
  const invalidate = useInvalidateSet();
  return useMutation({
    mutationFn: (input: ParameterSetDraft & { labId: string }) =>
      apiFetch<ItemResponse<ParameterSet>>("/api/parameter-sets", { method: "POST", json: input }).then((r) => r.item),
    onSuccess: (item) => invalidate(item, item.id),
  });
}

export function useUpdateParameterSet(id: string) {
  const invalidate = useInvalidateSet();
  return useMutation({
    mutationFn: (input: Partial<ParameterSetDraft> & { version: number; note?: string }) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/parameter-sets/${encodeURIComponent(id)}`, { method: "PATCH", json: input }).then(
        (r) => r.item,
      ),
    onSuccess: (item) => invalidate(item, id),
  });
}

export function useDeleteParameterSet(id: string) {
  const invalidate = useInvalidateSet();
  return useMutation({
    mutationFn: () => apiFetch<void>(`/api/parameter-sets/${encodeURIComponent(id)}`, { method: "DELETE" }),
    // The detail entry is left to expire: removing it now would make the open page refetch a 404
    // in the moment before it navigates away.
    onSuccess: () => invalidate(null, id),
  });
}

export function useRestoreVersion(id: string) {
  const invalidate = useInvalidateSet();
  return useMutation({
    mutationFn: (input: { restore: number; currentVersion: number }) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/parameter-sets/${encodeURIComponent(id)}/versions/${input.restore}/restore`, {
        method: "POST",
        json: { version: input.currentVersion },
      }).then((r) => r.item),
    onSuccess: (item) => invalidate(item, id),
  });
}
