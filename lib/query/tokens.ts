"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "./fetcher";
import { usePagedList } from "./paging";
import type { TokenSummary } from "@/lib/contracts/tokens";

export const tokenKeys = { all: () => ["tokens"] as const };

/** The settings list, a page at a time. */
export function useTokenPages() {
  return usePagedList<TokenSummary>({ queryKey: tokenKeys.all(), path: "/api/tokens" });
}

export interface CreatedToken {
  item: TokenSummary;
  /** The secret; the server keeps only its hash, so this is the one chance to copy it. */
  token: string;
}

export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => apiFetch<CreatedToken>("/api/tokens", { method: "POST", json: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tokenKeys.all() }),
  });
}

export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiFetch<void>(`/api/tokens/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tokenKeys.all() }),
  });
}
