"use client";

import { useRouter } from "next/navigation";
import { createElement, useCallback, useEffect, useRef, useState, type ReactNode } from "react";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

type Leave = () => void;
type AskToLeave = (go: Leave) => void;

/** The guard of the page on screen, while it has unsaved edits (one editor at a time). */
let askToLeave: AskToLeave | null = null;

/**
 * useRouter for code that navigates on its own (after a save, from a menu): push and replace ask
 * the unsaved-edits guard first. Next's router has no navigation events to hook, so programmatic
 * navigation has to come through here to be guarded.
 */
export function useGuardedRouter(): { push: (href: string) => void; replace: (href: string) => void } {
  const router = useRouter();
  return {
    push: (href) => (askToLeave ? askToLeave(() => router.push(href)) : router.push(href)),
    replace: (href) => (askToLeave ? askToLeave(() => router.replace(href)) : router.replace(href)),
  };
}

/** True for a plain left click on an in-app link that would load another page of ours. */
function inAppTarget(event: MouseEvent): string | null {
  if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return null;
  const anchor = (event.target as Element | null)?.closest?.("a[href]");
  if (!(anchor instanceof HTMLAnchorElement)) return null;
  if ((anchor.target && anchor.target !== "_self") || anchor.hasAttribute("download")) return null;
  const url = new URL(anchor.href, window.location.href);
  // Another site: the browser's own beforeunload prompt covers it.
  if (url.origin !== window.location.origin) return null;
  // A jump within the page loses nothing.
  if (url.pathname === window.location.pathname && url.search === window.location.search) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}

/**
 * Keeps unsaved edits from being lost by leaving the page: reload, close and typed addresses get
 * the browser's prompt (beforeunload); in-app navigation (every link, router pushes and replaces,
 * Back and Forward) gets our own confirmation, which the user can cancel to stay.
 *
 * The app router has no navigation events, so the guard works at the edges it does have: link
 * clicks are caught in the capture phase before Next's <Link> sees them; code that navigates
 * itself uses useGuardedRouter; Back is caught by a duplicate history entry and a capture-phase
 * popstate listener that runs before the router's own.
 *
 * Returns the dialog to render and `release`, to call before a navigation that must not ask
 * (e.g. after deleting the set).
 */
export function useUnsavedGuard(dirty: boolean): { dialog: ReactNode; release: () => void } {
  const router = useRouter();
  const [pending, setPending] = useState<Leave | null>(null);
  const released = useRef(false);
  const guardEntry = useRef(false);
  const leaving = useRef(false);
  const active = dirty && !released.current;
  const activeRef = useRef(active);
  activeRef.current = active;

  const release = useCallback(() => {
    released.current = true;
    activeRef.current = false;
  }, []);

  // Reload, close, typed address.
  useEffect(() => {
    if (!active) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older Chromium versions still need returnValue set to show the prompt.
      event.returnValue = "";
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => window.removeEventListener("beforeunload", onBeforeUnload);
  }, [active]);

  // Links (rail, headers, any <Link> or <a>).
  useEffect(() => {
    if (!active) return;
    const onClick = (event: MouseEvent) => {
      const href = inAppTarget(event);
      if (!href || !activeRef.current) return;
      event.preventDefault();
      event.stopPropagation();
      setPending(() => () => router.push(href));
    };
    document.addEventListener("click", onClick, true);
    return () => document.removeEventListener("click", onClick, true);
  }, [active, router]);

  // Programmatic navigation through useGuardedRouter asks first while this page is dirty.
  useEffect(() => {
    if (!active) return;
    const ask: AskToLeave = (go) => {
      if (!activeRef.current) return go();
      setPending(() => go);
    };
    askToLeave = ask;
    return () => {
      if (askToLeave === ask) askToLeave = null;
    };
  }, [active]);

  // Back and Forward: a duplicate of the current entry on top, so Back lands on this page again.
  useEffect(() => {
    if (active && !guardEntry.current) {
      window.history.pushState(window.history.state, "");
      guardEntry.current = true;
    }
  }, [active]);

  useEffect(() => {
    const onPopState = (event: PopStateEvent) => {
      if (!guardEntry.current || leaving.current) return;
      // We moved from the duplicate to the page's own entry: same address, nothing to render.
      event.stopImmediatePropagation();
      guardEntry.current = false;
      if (!activeRef.current) {
        // Saved since: Back means Back.
        window.history.back();
        return;
      }
      setPending(() => () => {
        leaving.current = true;
        window.history.back();
      });
    };
    // Capture listeners at the target run before the router's (bubble) listener.
    window.addEventListener("popstate", onPopState, true);
    return () => window.removeEventListener("popstate", onPopState, true);
  }, []);

  const stay = () => {
    setPending(null);
    if (!guardEntry.current && activeRef.current) {
      window.history.pushState(window.history.state, "");
      guardEntry.current = true;
    }
  };
  const leave = () => {
    const go = pending;
    release();
    setPending(null);
    go?.();
  };

  const dialog = createElement(
    ConfirmDialog,
    {
      open: pending !== null,
      title: "Leave without saving?",
      confirmLabel: "Leave and discard changes",
      destructive: true,
      onCancel: stay,
      onConfirm: leave,
    },
    "Your changes to this parameter set are not saved. Stay to save them, or leave and lose them.",
  );
  return { dialog, release };
}
