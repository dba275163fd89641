"use client";

import { useEffect } from "react";

/** While `open`, Escape anywhere calls `onEscape` (closing a menu or drawer; the caller puts the focus back). */
export function useEscape(open: boolean, onEscape: () => void): void {
  useEffect(() => {
    if (!open) return;
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === "Escape") onEscape();
    };
    document.addEventListener("keydown", onKeyDown);
    return () => document.removeEventListener("keydown", onKeyDown);
  }, [open, onEscape]);
}
