"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "./fetcher";
import { usePagedList } from "./paging";
import type { ItemsResponse } from "@/lib/contracts/common";
import type { LabSummary, MemberSummary } from "@/lib/contracts/labs";
import type { LabRole } from "@/lib/contracts/roles";

export const labKeys = {
  all: () => ["labs"] as const,
  members: (labId: string) => ["labs", labId, "members"] as const,
};

export const labsQuery = () =>
  queryOptions({
    queryKey: labKeys.all(),
    queryFn: ({ signal }) => apiFetch<ItemsResponse<LabSummary>>("/api/labs", { signal }).then((r) => r.items),
  });

export function useLabs() {
  return useQuery(labsQuery());
}

/** A lab's members, a page at a time; `data` is every member loaded so far. No request until a lab is chosen (null). */
export function useLabMembers(labId: string | null) {
  const paged = usePagedList<MemberSummary>({
    queryKey: labKeys.members(labId ?? ""),
    path: `/api/labs/${encodeURIComponent(labId ?? "")}/members`,
    enabled: labId !== null && labId !== "",
  });
  return { ...paged, data: paged.items };
}

function membersPath(labId: string, userId: string): string {
  return `/api/labs/${encodeURIComponent(labId)}/members/${encodeURIComponent(userId)}`;
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

export function useChangeMemberRole(labId: string) {
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: (input: { userId: string; role: LabRole }) =>
      apiFetch<unknown>(membersPath(labId, input.userId), { method: "PATCH", json: { role: input.role } }),
    onSuccess: invalidate,
  });
}

export function useRemoveMember(labId: string) {
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: (userId: string) => apiFetch<void>(membersPath(labId, userId), { method: "DELETE" }),
    onSuccess: invalidate,
  });
}

/** The caller's personal lab (POST /api/labs), for someone left with no lab of their own. */
export function useCreatePersonalLab() {
  const invalidate = useInvalidateLab();
  return useMutation({
    mutationFn: () => apiFetch<{ item: LabSummary }>("/api/labs", { method: "POST", json: {} }).then((r) => r.item),
    onSuccess: invalidate,
  });
}
