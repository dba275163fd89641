"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { describeError } from "@/lib/query/fetcher";
import { useResetMyView, useSaveMyView, useShareView } from "@/lib/query/workbench-views";
import { parseViewState, type ViewState } from "@/lib/workbench/view-state";

/*
 * The workbench's view state (axes, units, markers, panels, range, spin-trace inputs). On a
 * stored set each person keeps their own view on the server (PUT …/my-view, debounced; every
 * role, since it changes nothing anyone else sees). Until they change something they see the
 * lab's shared view; "Reset view" forgets their own, and editors may explicitly share theirs
 * with the lab. Scratch mode keeps the view in this browser only.
 */

const SAVE_DEBOUNCE_MS = 1000;

/** Where the view on screen comes from, or what is happening to it. */
export type ViewSaveStatus = "local" | "default" | "lab" | "mine" | "saving" | "error";

export interface ViewSource {
  /** The view to start from: the person's own, else the lab's shared view, else null (defaults). */
  initial: unknown;
  /** The lab's shared view (parameter_sets.view_state), the target of "Reset view". */
  shared: unknown;
  /** True when `initial` is the person's own saved view. */
  own: boolean;
}

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

function initialStatus(setId: string | null, source: ViewSource): ViewSaveStatus {
  if (!setId) return "local";
  if (source.own) return "mine";
  return source.shared ? "lab" : "default";
}

/**
 * persist false (a read-only share link): the view changes on screen but is kept nowhere, neither
 * on the server nor in this browser's scratch view.
 */
export function useViewState(options: { setId: string | null; source: ViewSource; persist?: boolean }) {
  const { setId } = options;
  const persist = options.persist ?? true;
  const [viewState, setViewStateRaw] = useState<ViewState>(() => parseViewState(options.source.initial));
  const [saveStatus, setSaveStatus] = useState<ViewSaveStatus>(() => initialStatus(setId, options.source));
  const [saveError, setSaveError] = useState<string | null>(null);
  const [shared, setShared] = useState<unknown>(options.source.shared);
  /** Bumped whenever the whole view is replaced (reset), so the page can re-seed its inputs. */
  const [epoch, setEpoch] = useState(0);
  const save = useSaveMyView(setId ?? "");
  const reset = useResetMyView(setId ?? "");
  const share = useShareView(setId ?? "");
  // Only a change the person made is saved: not the starting view, not a reset.
  const dirty = useRef(false);
  const saveRef = useRef(save.mutateAsync);
  saveRef.current = save.mutateAsync;

  const setViewState = useCallback((update: (v: ViewState) => ViewState) => {
    dirty.current = true;
    setViewStateRaw(update);
  }, []);

  useEffect(() => {
    if (!dirty.current || !persist) return;
    if (!setId) {
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
          setSaveStatus("mine");
          setSaveError(null);
        },
        (e: unknown) => {
          setSaveStatus("error");
          setSaveError(describeError(e));
        },
      );
    }, SAVE_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [viewState, setId, persist]);

  /** Back to the lab's shared view (scratch: the defaults); the person's own view is deleted. */
  const resetView = useCallback(async () => {
    if (setId) await reset.mutateAsync();
    else {
      try {
        window.localStorage.removeItem(storageKey(setId));
      } catch {
        // Nothing stored, nothing to forget.
      }
    }
    dirty.current = false;
    setViewStateRaw(parseViewState(setId ? shared : null));
    setEpoch((n) => n + 1);
    setSaveError(null);
    setSaveStatus(setId ? (shared ? "lab" : "default") : "local");
  }, [reset, setId, shared]);

  /** Editors: the view on screen becomes the lab's shared view. */
  const shareView = useCallback(async () => {
    if (!setId) return;
    await share.mutateAsync(viewState as unknown as Record<string, unknown>);
    setShared(viewState);
  }, [share, setId, viewState]);

  return {
    viewState,
    setViewState,
    saveStatus,
    saveError,
    epoch,
    resetView,
    shareView,
    resetting: reset.isPending,
    sharing: share.isPending,
  };
}
