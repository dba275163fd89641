"use client";

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  isActiveLabRun,
  type LabRunDetail,
  type LabRunResultBody,
  type LabRunSummary,
  type SubmitRunInput,
} from "@/lib/contracts/lab-runs";
import { apiFetch } from "./fetcher";
import type { ItemResponse, ItemsResponse } from "@/lib/contracts/common";

/*
 * Lab runs: list, detail and result queries, and the submit/cancel mutations. While any run shown
 * is queued or running, the queries poll every second so progress moves without a reload.
 */

const POLL_MS = 1000;

export const runKeys = {
  lists: () => ["runs"] as const,
  list: (labId: string | null) => ["runs", { labId: labId ?? "" }] as const,
  detail: (id: string) => ["run", id] as const,
  result: (id: string) => ["run", id, "result"] as const,
};

export const runsQuery = (labId: string | null) =>
  queryOptions({
    queryKey: runKeys.list(labId),
    queryFn: ({ signal }) =>
      apiFetch<ItemsResponse<LabRunSummary>>(labId ? `/api/runs?labId=${encodeURIComponent(labId)}` : "/api/runs", { signal }).then(
        (r) => r.items,
      ),
    refetchInterval: (q) => (q.state.data?.some((r) => isActiveLabRun(r.state)) ? POLL_MS : false),
  });

export const runQuery = (id: string) =>
  queryOptions({
    queryKey: runKeys.detail(id),
    queryFn: ({ signal }) => apiFetch<ItemResponse<LabRunDetail>>(`/api/runs/${encodeURIComponent(id)}`, { signal }).then((r) => r.item),
    refetchInterval: (q) => (q.state.data && isActiveLabRun(q.state.data.state) ? POLL_MS : false),
  });

export const runResultQuery = (id: string) =>
  queryOptions({
    queryKey: runKeys.result(id),
    queryFn: ({ signal }) => apiFetch<LabRunResultBody>(`/api/runs/${encodeURIComponent(id)}/result`, { signal }),
    staleTime: Infinity,
  });

export function useRuns(labId: string | null) {
  return useQuery(runsQuery(labId));
}

export function useRun(id: string) {
  return useQuery(runQuery(id));
}

export function useRunResult(id: string, enabled: boolean) {
  return useQuery({ ...runResultQuery(id), enabled });
}

export function useSubmitRun() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: SubmitRunInput) =>
      apiFetch<ItemResponse<LabRunSummary>>("/api/runs", { method: "POST", json: input }).then((r) => r.item),
    onSuccess: () => client.invalidateQueries({ queryKey: runKeys.lists() }),
  });
}

export function useCancelRun() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) =>
      apiFetch<ItemResponse<LabRunDetail>>(`/api/runs/${encodeURIComponent(id)}/cancel`, { method: "POST", json: {} }).then((r) => r.item),
    onSuccess: (item) => {
      client.setQueryData(runKeys.detail(item.id), item);
      return client.invalidateQueries({ queryKey: runKeys.lists() });
    },
  });
}

/**
 * Seconds left, from this attempt's pace (null until there is enough to go on). An attempt that
 * resumed from saved chunks began at progressAtStart; only what it computed since counts.
 */
export function etaSeconds(
  run: Pick<LabRunSummary, "state" | "progress" | "startedAt"> & { progressAtStart?: number },
  nowMs: number,
): number | null {
  const done = run.progress - (run.progressAtStart ?? 0);
  if (run.state !== "running" || !run.startedAt || !(done > 0.02)) return null;
  const elapsed = (nowMs - Date.parse(run.startedAt)) / 1000;
  if (!(elapsed > 0)) return null;
  return Math.max(0, (elapsed * (1 - run.progress)) / done);
}
