"use client";

import { useQuery } from "@tanstack/react-query";
import { useDeferredValue, useMemo } from "react";
import type { SignsFrom } from "@/lib/contracts/measurement-sets";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { checkSigns, type SignCheckResult, withModelSign } from "@/lib/measurements/sign-check";
import { parameterSetQuery, useParameterSets } from "@/lib/query/parameter-sets";

/*
 * The upload's sign check: the parameter sets of the upload's lab to check against, the chosen
 * one's current parameters, and what the shared rule (lib/measurements/sign-check.ts) says of the
 * draft's points. The model runs in the page (the analytic path: milliseconds for a file at a few
 * conditions); the points are deferred so typing in the form never waits for it.
 */

export interface SignChange {
  line: number;
  from: number;
  to: number;
}

export interface SignCheckView {
  result: SignCheckResult;
  /** Values the model's sign would change, and the first of them as an example. */
  changes: number;
  example: SignChange | null;
}

export function useSignCheck(options: { labId: string; setId: string; points: MeasuredPoint[] | null; modelSign: SignsFrom | null }) {
  const { labId, setId, modelSign } = options;
  const sets = useParameterSets({ labId });
  const set = useQuery({ ...parameterSetQuery(setId), enabled: setId !== "" });
  const points = useDeferredValue(options.points);
  const params = set.data?.params;

  const view = useMemo((): SignCheckView | null => {
    if (!params || !points || points.length === 0) return null;
    const result = checkSigns(params, points);
    let changes = 0;
    let example: SignChange | null = null;
    for (const [i, p] of points.entries()) {
      const to = withModelSign(p.value, result.predicted[i]!);
      if (to === p.value) continue;
      changes++;
      example ??= { line: p.line, from: p.value, to };
    }
    return { result, changes, example };
  }, [params, points]);

  // A take that no longer matches the set as loaded (another set chosen, or the set saved again) is not in force.
  const inForce =
    modelSign && set.data && modelSign.parameterSetId === set.data.id && modelSign.version === set.data.version ? modelSign : null;

  return { sets, set, view, signsFrom: inForce, stale: modelSign !== null && set.data !== undefined && inForce === null };
}
