"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { InvitationSummary } from "@/lib/contracts/labs";
import type { LabRole } from "@/lib/contracts/roles";
import type { ShareLinkSummary } from "@/lib/contracts/sharing";
import type { AuditEntry } from "@/lib/contracts/audit";
import { apiFetch } from "./fetcher";
import { usePagedList } from "./paging";

/* Invitations, share links, the audit trail and the account's password, as the screens use them. */

export type { InvitationSummary, ShareLinkSummary };

export const sharingKeys = {
  invitations: (labId: string) => ["labs", labId, "invitations"] as const,
  shareLinks: (setId: string) => ["parameter-set", setId, "share-links"] as const,
  audit: (labId: string, filters: Record<string, string>) => ["labs", labId, "audit", filters] as const,
};

export function useInvitations(labId: string, enabled: boolean) {
  return usePagedList<InvitationSummary>({
    queryKey: sharingKeys.invitations(labId),
    path: `/api/labs/${encodeURIComponent(labId)}/invitations`,
    enabled,
  });
}

export function useInvite(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; role: LabRole }) =>
      apiFetch<{ item: InvitationSummary; mail: "sent" | "queued" }>(`/api/labs/${encodeURIComponent(labId)}/invitations`, {
        method: "POST",
        json: input,
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sharingKeys.invitations(labId) }),
  });
}

export function useRevokeInvitation(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      apiFetch<void>(`/api/labs/${encodeURIComponent(labId)}/invitations/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sharingKeys.invitations(labId) }),
  });
}

export function useShareLinks(setId: string) {
  return usePagedList<ShareLinkSummary>({
    queryKey: sharingKeys.shareLinks(setId),
    path: `/api/parameter-sets/${encodeURIComponent(setId)}/share-links`,
  });
}

export function useCreateShareLink(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () =>
      apiFetch<{ item: ShareLinkSummary; url: string }>(`/api/parameter-sets/${encodeURIComponent(setId)}/share-links`, {
        method: "POST",
        json: {},
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sharingKeys.shareLinks(setId) }),
  });
}

export function useRevokeShareLink(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) =>
      apiFetch<void>(`/api/parameter-sets/${encodeURIComponent(setId)}/share-links/${encodeURIComponent(linkId)}`, { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sharingKeys.shareLinks(setId) }),
  });
}

export function useAudit(labId: string, filters: Record<string, string>) {
  const search = new URLSearchParams(Object.entries(filters).filter(([, value]) => value !== ""));
  const qs = search.toString();
  return usePagedList<AuditEntry>({
    queryKey: sharingKeys.audit(labId, filters),
    path: `/api/labs/${encodeURIComponent(labId)}/audit${qs ? `?${qs}` : ""}`,
    enabled: labId !== "",
  });
}

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: { currentPassword: string; newPassword: string }) =>
      apiFetch<{ ok: true }>("/api/account/password", { method: "POST", json: input }),
  });
}

export function useEndAllSessions(userId: string) {
  return useMutation({
    mutationFn: () => apiFetch<void>(`/api/users/${encodeURIComponent(userId)}/end-sessions`, { method: "POST", json: {} }),
  });
}
