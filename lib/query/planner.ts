"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { LightSource, LightSourceInput, UpdateLightSourceInput } from "@/lib/contracts/light-sources";
import type { SavePlanInput, SavedPlan } from "@/lib/contracts/plans";
import { apiFetch } from "./fetcher";
import type { ItemResponse, ItemsResponse } from "@/lib/contracts/common";

export const plannerKeys = {
  lightSources: (labId: string) => ["light-sources", { labId }] as const,
  plans: (setId: string) => ["parameter-set", setId, "plans"] as const,
};

export const lightSourcesQuery = (labId: string) =>
  queryOptions({
    queryKey: plannerKeys.lightSources(labId),
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<LightSource>>(`/api/light-sources?labId=${encodeURIComponent(labId)}`, { signal }).then((r) => r.items),
  });

export const plansQuery = (setId: string) =>
  queryOptions({
    queryKey: plannerKeys.plans(setId),
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<SavedPlan>>(`/api/parameter-sets/${encodeURIComponent(setId)}/plans`, { signal }).then((r) => r.items),
  });

export function useLightSources(labId: string | null) {
  return useQuery({ ...lightSourcesQuery(labId ?? ""), enabled: labId !== null });
}

export function usePlans(setId: string | null) {
  return useQuery({ ...plansQuery(setId ?? ""), enabled: setId !== null });
}

export function useCreateLightSource(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: Partial<LightSourceInput> & Pick<LightSourceInput, "name" | "wavelengthNm">) =>
      apiFetch<ItemResponse<LightSource>>("/api/light-sources", { method: "POST", json: { labId, ...input } }).then((r) => r.item),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plannerKeys.lightSources(labId) }),
  });
}

export function useUpdateLightSource(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: string; patch: UpdateLightSourceInput }) =>
      apiFetch<ItemResponse<LightSource>>(`/api/light-sources/${encodeURIComponent(input.id)}`, {
        method: "PATCH",
        json: input.patch,
      }).then((r) => r.item),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plannerKeys.lightSources(labId) }),
  });
}

export function useDeleteLightSource(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiFetch<void>(`/api/light-sources/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plannerKeys.lightSources(labId) }),
  });
}

export function useSavePlan(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SavePlanInput) =>
      apiFetch<ItemResponse<SavedPlan>>(`/api/parameter-sets/${encodeURIComponent(setId)}/plans`, { method: "POST", json: input }).then(
        (r) => r.item,
      ),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plannerKeys.plans(setId) }),
  });
}

export function useDeletePlan(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (planId: string) =>
      apiFetch<void>(`/api/parameter-sets/${encodeURIComponent(setId)}/plans/${encodeURIComponent(planId)}`, { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plannerKeys.plans(setId) }),
  });
}
