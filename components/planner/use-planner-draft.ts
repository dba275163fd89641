"use client";

import { useEffect, useState } from "react";

/*
 * The planner's inputs and its last results, kept in this browser tab (sessionStorage) per
 * parameter set, so going to the workbench and back loses nothing. Non-finite numbers (a σ of ∞
 * for a plan that cannot separate the parameters) survive the JSON round trip as tagged strings.
 */

const key = (setId: string) => `gyrolux:planner:draft:${setId}`;
const TAG = "__number__:";

const replacer = (_: string, v: unknown) => (typeof v === "number" && !Number.isFinite(v) ? `${TAG}${v}` : v);
const reviver = (_: string, v: unknown) => (typeof v === "string" && v.startsWith(TAG) ? Number(v.slice(TAG.length)) : v);

export function readPlannerDraft<T>(setId: string): T | null {
  try {
    const raw = window.sessionStorage.getItem(key(setId));
    return raw ? (JSON.parse(raw, reviver) as T) : null;
  } catch {
    return null;
  }
}

/** A value initialized from the stored draft and written back (debounced) whenever it changes. */
export function usePlannerDraft<T>(setId: string, initial: () => T): [T, (update: (v: T) => T) => void] {
  const [value, setValue] = useState<T>(() => {
    const stored = typeof window === "undefined" ? null : readPlannerDraft<Partial<T>>(setId);
    const fresh = initial();
    return stored && typeof stored === "object" ? { ...fresh, ...stored } : fresh;
  });
  useEffect(() => {
    const timer = setTimeout(() => {
      try {
        window.sessionStorage.setItem(key(setId), JSON.stringify(value, replacer));
      } catch {
        // Private mode or a full quota: the planner still works, it just does not remember.
      }
    }, 300);
    return () => clearTimeout(timer);
  }, [setId, value]);
  return [value, (update) => setValue(update)];
}
