"use client";

import { useCallback, useEffect, useRef, useState, type ReactNode } from "react";
import { useEscape } from "@/components/ui/use-escape";

/**
 * The workbench's inputs (range and parameters). On wide screens a sticky column beside the plots;
 * on narrow ones a drawer, so the plots come first: a button opens the inputs over the page, and
 * "Close", Escape or the button again shut it with the focus back on the button. The inputs stay
 * mounted while closed, so a half-typed value and its error survive closing the drawer.
 */
export function InputsDrawer({ children, problems }: { children: ReactNode; problems: boolean }) {
  const [open, setOpen] = useState(false);
  const toggleRef = useRef<HTMLButtonElement>(null);
  const closeRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (open) closeRef.current?.focus();
  }, [open]);
  const close = useCallback(() => {
    setOpen(false);
    toggleRef.current?.focus();
  }, []);
  useEscape(open, close);

  return (
    <>
      <button
        ref={toggleRef}
        type="button"
        aria-expanded={open}
        aria-controls="workbench-inputs"
        onClick={() => setOpen((v) => !v)}
        className="inline-flex items-center gap-2 rounded-md border border-ink/20 bg-paper-raised px-3 py-1.5 text-sm font-medium lg:hidden"
      >
        Inputs: range and parameters
        {problems ? <span className="rounded bg-ember-light px-1.5 text-xs text-ember">needs a fix</span> : null}
      </button>
      <aside
        id="workbench-inputs"
        aria-label="Parameters"
        className={
          `${open ? "fixed inset-0 z-40 block overflow-y-auto bg-paper p-4" : "hidden"} space-y-6 ` +
          "lg:sticky lg:top-4 lg:z-auto lg:block lg:max-h-[calc(100vh-2rem)] lg:self-start " +
          "lg:overflow-y-auto lg:bg-transparent lg:p-0 lg:pr-2"
        }
      >
        <div className="flex items-center justify-between gap-3 lg:hidden">
          <p className="text-lg font-semibold">Inputs</p>
          <button
            ref={closeRef}
            type="button"
            onClick={close}
            className="rounded-md border border-ink/20 bg-paper-raised px-3 py-1.5 text-sm font-medium"
          >
            Close
          </button>
        </div>
        {children}
      </aside>
    </>
  );
}
