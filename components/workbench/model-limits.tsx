"use client";

import { useMemo } from "react";
import { Alert } from "@/components/ui/alert";
import { type LimitQuery, modelLimitWarnings } from "@/lib/materials/limits";

/**
 * Where the model's limits bite (lib/materials/limits.ts): the workbench, the maps, the fit and
 * the planner show the same lines for the temperatures, fields and wavelengths they compute at.
 */
export function ModelLimits({ query, where }: { query: LimitQuery | null; where: string }) {
  const warnings = useMemo(() => (query ? modelLimitWarnings(query) : []), [query]);
  if (warnings.length === 0) return null;
  return (
    <div data-testid="model-limits">
      <Alert tone="info" title={`Outside this model's validity (${where})`}>
        <ul className="list-disc space-y-1 pl-5">
          {warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      </Alert>
    </div>
  );
}
