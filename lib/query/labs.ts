"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "./fetcher";
import type { ItemsResponse, Lab, LabMember, LabRole } from "./types";

export const labKeys = {
  all: () => ["labs"] as const,
  members: (labId: string) => ["labs", labId, "members"] as const,
};

export const labsQuery = () =>
  queryOptions({
    queryKey: labKeys.all(),
    queryFn: ({ signal }) => apiFetch<ItemsResponse<Lab>>("/api/labs", { signal }).then((r) => r.items),
  });

export const labMembersQuery = (labId: string) =>
  queryOptions({
    queryKey: labKeys.members(labId),
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<LabMember>>(`/api/labs/${encodeURIComponent(labId)}/members`, { signal }).then((r) => r.items),
  });

export function useLabs() {
  return useQuery(labsQuery());
}

export function useLabMembers(labId: string) {
  return useQuery(labMembersQuery(labId));
}

function membersPath(labId: string, userId?: string): string {
  const base = `/api/labs/${encodeURIComponent(labId)}/members`;
  return userId ? `${base}/${encodeURIComponent(userId)}` : base;
}

// Members live under ["labs", id], so invalidating ["labs"] refreshes them and the caller's own
// role (which a change may affect); the set list carries roles too.
function useInvalidateLab() {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: labKeys.all() });
    void queryClient.invalidateQueries({ queryKey: ["parameter-sets"] });
  };
}

export function useAddMember(labId: string) {
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: (input: { email: string; role: LabRole }) => apiFetch<unknown>(membersPath(labId), { method: "POST", json: input }),
    onSuccess: invalidate,
  });
}

export function useChangeMemberRole(labId: string) {
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: (input: { userId: string; role: LabRole }) =>
      apiFetch<unknown>(membersPath(labId, input.userId), { method: "PATCH", json: { role: input.role } }),
    onSuccess: invalidate,
  });
}

export function useRemoveMember(labId: string) {
  const queryClient = useQueryClient();
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: (userId: string) => apiFetch<void>(membersPath(labId, userId), { method: "DELETE" }),
    onSuccess: (_result, userId) => {
      // Drop the row at once; the refetch that follows confirms it.
      queryClient.setQueryData<LabMember[]>(labKeys.members(labId), (old) => old?.filter((m) => m.userId !== userId));
      invalidate();
    },
  });
}
