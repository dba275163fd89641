"use client";

import { useCallback, useRef, useState } from "react";

/**
 * Width of an element, tracked with a ResizeObserver. Returns a callback ref so it also works when
 * the element mounts later (after a loading state). Width is rounded so sub-pixel jitter does not
 * re-render plots.
 */
export function useElementWidth<T extends HTMLElement>(fallback = 720): [(el: T | null) => void, number] {
  const [width, setWidth] = useState(fallback);
  const observer = useRef<ResizeObserver | null>(null);
  const ref = useCallback((el: T | null) => {
    observer.current?.disconnect();
    observer.current = null;
    if (!el) return;
    const ro = new ResizeObserver((entries) => {
      const w = Math.round(entries[0]?.contentRect.width ?? 0);
      if (w > 0) setWidth(w);
    });
    ro.observe(el);
    observer.current = ro;
    const w = Math.round(el.getBoundingClientRect().width);
    if (w > 0) setWidth(w);
  }, []);
  return [ref, width];
}
