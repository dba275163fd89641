"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ItemResponse } from "@/lib/contracts/common";
import type { CopyMaterialInput } from "@/lib/contracts/materials";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";
import { apiFetch } from "./fetcher";

/** "New parameter set from this material": POST /api/materials/{id}/parameter-sets. */
export function useCopyMaterial(materialId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CopyMaterialInput) =>
      apiFetch<ItemResponse<ParameterSet>>(`/api/materials/${encodeURIComponent(materialId)}/parameter-sets`, {
        method: "POST",
        json: input,
      }).then((r) => r.item),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: ["parameter-sets"] }),
  });
}
