"use client";

import { usePathname } from "next/navigation";
import { useCallback, useRef, useState, type ReactNode } from "react";
import { useEscape } from "@/components/ui/use-escape";

/**
 * On narrow screens the rail folds into a menu: a button under the wordmark opens the links and the
 * account section; Escape or following a link closes it, and the focus returns to the button. On
 * wide screens the panel is always shown and the button is hidden.
 */
export function RailMenu({ brand, children }: { brand: ReactNode; children: ReactNode }) {
  const [open, setOpen] = useState(false);
  const pathname = usePathname();
  const [seenPath, setSeenPath] = useState(pathname);
  const buttonRef = useRef<HTMLButtonElement>(null);
  if (seenPath !== pathname) {
    setSeenPath(pathname);
    setOpen(false);
  }

  const close = useCallback(() => {
    setOpen(false);
    buttonRef.current?.focus();
  }, []);
  useEscape(open, close);

  return (
    <>
      <div className="flex items-center justify-between gap-3 px-4 py-3 md:block md:py-4">
        {brand}
        <button
          ref={buttonRef}
          type="button"
          aria-expanded={open}
          aria-controls="rail-panel"
          onClick={() => setOpen((v) => !v)}
          className={
            "inline-flex items-center gap-2 rounded-md border border-ink/20 bg-paper-raised " +
            "px-3 py-1.5 text-sm font-medium text-ink md:hidden"
          }
        >
          <svg viewBox="0 0 16 16" width="16" height="16" aria-hidden="true">
            {open ? (
              <path d="M3 3l10 10M13 3L3 13" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
            ) : (
              <path d="M2 4h12M2 8h12M2 12h12" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
            )}
          </svg>
          Menu
        </button>
      </div>
      {/* Following a link closes the menu, also a link to the page already shown. */}
      <div
        id="rail-panel"
        className={`${open ? "flex" : "hidden"} flex-col md:flex md:min-h-0 md:flex-1`}
        onClick={(event) => {
          if ((event.target as Element).closest("a")) setOpen(false);
        }}
      >
        {children}
      </div>
    </>
  );
}
