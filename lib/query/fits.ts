"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { SaveFitInput } from "@/lib/contracts/fits";
import { apiFetch } from "./fetcher";
import { parameterSetKeys } from "./parameter-sets";
import type { ItemResponse } from "@/lib/contracts/common";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";

/** POST /api/parameter-sets/{id}/fits: the fitted values as a new version with the fit's provenance. */
export function useSaveFit(setId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveFitInput) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/parameter-sets/${encodeURIComponent(setId)}/fits`, { method: "POST", json: input }).then(
        (r) => r.item,
      ),
    // The set's own entry is left alone: the workbench is keyed by the version it shows, so
    // updating it would replace the page (and the fit report) at once; the report offers to load it.
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: parameterSetKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: parameterSetKeys.versions(setId) });
    },
  });
}
