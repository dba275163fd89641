"use client";

import { useEffect, useRef, useState } from "react";
import { useSaveViewState } from "@/lib/query/parameter-sets";
import { describeError } from "@/lib/query/fetcher";
import { parseViewState, type ViewState } from "@/lib/workbench/view-state";

/*
 * The workbench's view state (axes, units, markers, panels, range). Editors save it with the set
 * (PUT …/view-state, debounced; no new version). Viewers and scratch mode keep it in this
 * browser only, because the server would refuse them and a 403 on every click helps no one.
 */

const SAVE_DEBOUNCE_MS = 1000;
export type ViewSaveStatus = "local" | "saved" | "saving" | "error";

function storageKey(setId: string | null): string {
  return `gyrolux:workbench:view:${setId ?? "scratch"}`;
}

export function readLocalViewState(setId: string | null): unknown {
  try {
    const raw = window.localStorage.getItem(storageKey(setId));
    return raw ? JSON.parse(raw) : null;
  } catch {
    return null;
  }
}

export function useViewState(options: { setId: string | null; canSave: boolean; initial: unknown }) {
  const { setId, canSave } = options;
  const [viewState, setViewState] = useState<ViewState>(() => parseViewState(options.initial));
  const [saveStatus, setSaveStatus] = useState<ViewSaveStatus>(canSave ? "saved" : "local");
  const [saveError, setSaveError] = useState<string | null>(null);
  const save = useSaveViewState(setId ?? "");
  const first = useRef(true);
  const saveRef = useRef(save.mutateAsync);
  saveRef.current = save.mutateAsync;

  useEffect(() => {
    // The state we started from needs no saving.
    if (first.current) {
      first.current = false;
      return;
    }
    if (!canSave || !setId) {
      try {
        window.localStorage.setItem(storageKey(setId), JSON.stringify(viewState));
      } catch {
        // Private mode or a full quota: the view still works, it is just not remembered.
      }
      return;
    }
    setSaveStatus("saving");
    const timer = setTimeout(() => {
      saveRef.current(viewState as unknown as Record<string, unknown>).then(
        () => {
          setSaveStatus("saved");
          setSaveError(null);
        },
        (e: unknown) => {
          setSaveStatus("error");
          setSaveError(describeError(e));
        },
      );
    }, SAVE_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [viewState, canSave, setId]);

  return { viewState, setViewState, saveStatus, saveError };
}
