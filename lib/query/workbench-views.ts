"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MyWorkbenchView } from "@/lib/contracts/workbench-views";
import { apiFetch } from "./fetcher";
import { parameterSetKeys } from "./parameter-sets";
import type { ItemResponse } from "@/lib/contracts/common";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";

/*
 * A person's own workbench view of a set (…/my-view) and the lab's shared view (…/view-state).
 * The key sits under the set's key, so invalidating a set also refreshes its views.
 */

export type { MyWorkbenchView };

export const workbenchViewKeys = {
  mine: (setId: string) => ["parameter-set", setId, "my-view"] as const,
};

const path = (setId: string) => `/api/parameter-sets/${encodeURIComponent(setId)}/my-view`;

export const myWorkbenchViewQuery = (setId: string) =>
  queryOptions({
    queryKey: workbenchViewKeys.mine(setId),
    queryFn: ({ signal }) => apiFetch<ItemResponse<MyWorkbenchView>>(path(setId), { signal }).then((r) => r.item),
    // The view is read once to start the workbench; later changes come from this browser.
    staleTime: Infinity,
  });

export function useMyWorkbenchView(setId: string) {
  return useQuery(myWorkbenchViewQuery(setId));
}

export function useSaveMyView(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (viewState: Record<string, unknown>) =>
      apiFetch<ItemResponse<MyWorkbenchView>>(path(setId), { method: "PUT", json: { viewState } }).then((r) => r.item),
    onSuccess: (item) => queryClient.setQueryData(workbenchViewKeys.mine(setId), item),
  });
}

export function useResetMyView(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<ItemResponse<MyWorkbenchView>>(path(setId), { method: "DELETE" }).then((r) => r.item),
    onSuccess: (item) => queryClient.setQueryData(workbenchViewKeys.mine(setId), item),
  });
}

/** Editors: makes a view the lab's shared view (the start for everyone without their own). */
export function useShareView(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (viewState: Record<string, unknown>) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/parameter-sets/${encodeURIComponent(setId)}/view-state`, {
        method: "PUT",
        json: { viewState },
      }).then((r) => r.item),
    onSuccess: (item) => {
      queryClient.setQueryData(parameterSetKeys.detail(setId), item);
      queryClient.setQueryData<MyWorkbenchView>(workbenchViewKeys.mine(setId), (old) =>
        old ? { ...old, sharedViewState: item.viewState } : old,
      );
    },
  });
}
