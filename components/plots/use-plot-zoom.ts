"use client";

import { type KeyboardEvent, type PointerEvent, type RefObject, useEffect, useMemo, useRef, useState } from "react";
import { clampDomain, type Domain, panToInclude, zoomDomain } from "@/lib/workbench/zoom";
import { makeScale, type NumScale, paddedExtent, type ScaleType } from "./scale";

/*
 * The x window of a line plot and the gestures that change it: drag across the plot to zoom into
 * a range (a press without travel stays a click), Ctrl/⌘ + wheel about the pointer, and + / − / 0
 * on the focused plot. Without onXViewChange the plot shows all data and none of this is active.
 */

/** Pointer travel (px) that turns a press into a drag-to-zoom rather than a click. */
const DRAG_PX = 5;
const ZOOM_STEP = 0.5;

export interface PlotZoomInput {
  xs: readonly number[];
  xType: ScaleType;
  /** The visible x window in display units; null shows all data. */
  xView: Domain | null;
  onXViewChange: ((view: [number, number] | null) => void) | undefined;
  /** Left edge of the plotting area, px in the SVG. */
  leftPx: number;
  /** Width of the plotting area, px. */
  widthPx: number;
}

export interface PlotZoom {
  /** The data's whole x range. */
  fullX: [number, number];
  /** The zoomed window, or null when the whole range shows. */
  windowX: [number, number] | null;
  /** What the x axis shows. */
  shownX: [number, number];
  xScale: NumScale;
  zoomable: boolean;
  /** The range being dragged across, px, while a drag is on. */
  brush: { from: number; to: number } | null;
  /** The pointer overlay, which gets the (non-passive) wheel listener. */
  overlayRef: RefObject<SVGRectElement | null>;
  onPointerDown: (e: PointerEvent<SVGRectElement>) => void;
  /** The pointer moved to px (x in the SVG). */
  onPointerMove: (px: number) => void;
  onPointerUp: (e: PointerEvent<SVGRectElement>) => void;
  onPointerCancel: () => void;
  /** A press is on (a click or a drag in progress). */
  isPressed: () => boolean;
  /** True, once, for the click that ends a drag, which must not pick. */
  takeDragClick: () => boolean;
  /** The zoom keys (+, −, 0) about `centre` (display units; null: the window's middle); true when handled. */
  onZoomKey: (e: KeyboardEvent<HTMLDivElement>, centre: number | null) => boolean;
  /** When zoomed, pans the window so that it includes x. */
  follow: (x: number) => void;
}

/** x of a pointer event in the SVG's own coordinates. */
export function localX(e: { clientX: number; currentTarget: SVGRectElement }): number {
  const rect = e.currentTarget.ownerSVGElement?.getBoundingClientRect();
  return rect ? e.clientX - rect.left : 0;
}

/** The data's whole x range, the zoomed window (null: all) and what the axis shows. */
export function useXWindow(xs: readonly number[], xType: ScaleType, xView: Domain | null) {
  const fullX = useMemo<[number, number]>(() => {
    const ext = paddedExtent([xs], xType === "log") ?? [1, 10];
    // No padding on x: the range the user asked for is the frame.
    let lo = Infinity;
    let hi = -Infinity;
    for (const x of xs)
      if (Number.isFinite(x) && (xType !== "log" || x > 0)) {
        lo = Math.min(lo, x);
        hi = Math.max(hi, x);
      }
    return Number.isFinite(lo) && lo < hi ? [lo, hi] : ext;
  }, [xs, xType]);
  const viewLo = xView?.[0];
  const viewHi = xView?.[1];
  const windowX = useMemo<[number, number] | null>(
    () => (viewLo !== undefined && viewHi !== undefined ? clampDomain([viewLo, viewHi], fullX, xType) : null),
    [viewLo, viewHi, fullX, xType],
  );
  return { fullX, windowX, shownX: windowX ?? fullX };
}

export function usePlotZoom({ xs, xType, xView, onXViewChange, leftPx, widthPx }: PlotZoomInput): PlotZoom {
  const { fullX, windowX, shownX } = useXWindow(xs, xType, xView);
  const xScale = useMemo(() => makeScale(xType, shownX, [leftPx, leftPx + widthPx], false), [xType, shownX, widthPx, leftPx]);

  // Zoom about a display-unit x (the cursor, the pointer or the window's middle).
  const zoomAbout = (factor: number, centre: number | null) => {
    if (!onXViewChange) return;
    const mid = centre ?? xScale.invert(leftPx + widthPx / 2);
    onXViewChange(zoomDomain(shownX, factor, mid, fullX, xType));
  };

  // Drag across the plot to zoom into that x range; a press without travel stays a click.
  const [brush, setBrush] = useState<{ from: number; to: number } | null>(null);
  const press = useRef<{ from: number; dragged: boolean } | null>(null);
  const swallowClick = useRef(false);
  const onPointerDown = (e: PointerEvent<SVGRectElement>) => {
    if (!onXViewChange || e.button !== 0) return;
    press.current = { from: localX(e), dragged: false };
    swallowClick.current = false;
    e.currentTarget.setPointerCapture?.(e.pointerId);
  };
  const onPointerMove = (px: number) => {
    const p = press.current;
    if (!p) return;
    if (!p.dragged && Math.abs(px - p.from) >= DRAG_PX) p.dragged = true;
    if (p.dragged) setBrush({ from: p.from, to: Math.min(leftPx + widthPx, Math.max(leftPx, px)) });
  };
  const onPointerUp = (e: PointerEvent<SVGRectElement>) => {
    const p = press.current;
    press.current = null;
    setBrush(null);
    if (!p?.dragged || !onXViewChange) return;
    swallowClick.current = true;
    const a = xScale.invert(Math.min(p.from, localX(e)));
    const b = xScale.invert(Math.max(p.from, localX(e)));
    onXViewChange(clampDomain([Math.min(a, b), Math.max(a, b)], fullX, xType));
  };
  const onPointerCancel = () => {
    press.current = null;
    setBrush(null);
  };
  const takeDragClick = () => {
    if (!swallowClick.current) return false;
    swallowClick.current = false;
    return true;
  };

  // Ctrl/⌘ + wheel zooms about the pointer. A plain wheel keeps scrolling the page. React's wheel
  // listeners are passive, so this one is attached by hand to be allowed to preventDefault.
  const overlayRef = useRef<SVGRectElement>(null);
  const wheelZoom = useRef<(e: WheelEvent) => void>(() => undefined);
  wheelZoom.current = (e: WheelEvent) => {
    if (!onXViewChange || !(e.ctrlKey || e.metaKey) || e.deltaY === 0) return;
    e.preventDefault();
    const rect = overlayRef.current?.ownerSVGElement?.getBoundingClientRect();
    const centre = rect ? xScale.invert(e.clientX - rect.left) : null;
    zoomAbout(e.deltaY < 0 ? 0.8 : 1.25, centre);
  };
  const zoomable = onXViewChange !== undefined;
  useEffect(() => {
    const el = overlayRef.current;
    if (!el || !zoomable) return;
    const listener = (e: WheelEvent) => wheelZoom.current(e);
    el.addEventListener("wheel", listener, { passive: false });
    return () => el.removeEventListener("wheel", listener);
  }, [zoomable]);

  const onZoomKey = (e: KeyboardEvent<HTMLDivElement>, centre: number | null) => {
    if (!onXViewChange || e.ctrlKey || e.metaKey || e.altKey) return false;
    if (e.key === "+" || e.key === "=") {
      e.preventDefault();
      zoomAbout(ZOOM_STEP, centre);
      return true;
    }
    if (e.key === "-" || e.key === "_") {
      e.preventDefault();
      zoomAbout(1 / ZOOM_STEP, centre);
      return true;
    }
    if (e.key === "0") {
      e.preventDefault();
      onXViewChange(null);
      return true;
    }
    return false;
  };

  const follow = (x: number) => {
    if (onXViewChange && windowX && !(x >= windowX[0] && x <= windowX[1])) onXViewChange(panToInclude(windowX, x, fullX, xType));
  };

  return {
    fullX,
    windowX,
    shownX,
    xScale,
    zoomable,
    brush,
    overlayRef,
    onPointerDown,
    onPointerMove,
    onPointerUp,
    onPointerCancel,
    isPressed: () => press.current !== null,
    takeDragClick,
    onZoomKey,
    follow,
  };
}
