import { z } from "zod";
import { MAX_WAVELENGTHS } from "@/lib/physics/schema";
import { COMPARE_QUANTITIES } from "./compare";
import { X_UNITS, Y_MODES } from "./units";

/*
 * What the workbench remembers per parameter set (PUT /api/parameter-sets/{id}/view-state): axes,
 * units, markers, chosen plots and the wavelength range. Stored JSON outlives code versions, so
 * every field falls back to its default instead of rejecting the whole state: an old or
 * hand-edited view state must never stop the workbench from opening.
 */

export const DEFAULT_MARKERS_NM = [632.8, 800, 1064, 1550] as const;
export const MAX_MARKERS = 24;
/** Markers are laser lines and band edges: from the deep ultraviolet to the mid-infrared. */
export const MARKER_MIN_NM = 1;
export const MARKER_MAX_NM = 5000;

export const rangeSchema = z
  .strictObject({
    fromNm: z.number().gt(0, "must be > 0 nm").max(1e7, "must be ≤ 1e7 nm"),
    toNm: z.number().gt(0, "must be > 0 nm").max(1e7, "must be ≤ 1e7 nm"),
    points: z.number().int("must be a whole number").min(2, "at least 2 points").max(MAX_WAVELENGTHS, `at most ${MAX_WAVELENGTHS} points`),
    spacing: z.enum(["log", "linear"]),
  })
  .refine((r) => r.toNm > r.fromNm, { path: ["toNm"], message: "must be above the start of the range" });

export type WavelengthRange = z.infer<typeof rangeSchema>;

export const DEFAULT_RANGE: WavelengthRange = { fromNm: 300, toNm: 3000, points: 256, spacing: "log" };

const seriesSchema = z.strictObject({
  total: z.boolean(),
  electric: z.boolean(),
  magnetic: z.boolean(),
  cross: z.boolean(),
  // Shown only for sets with the diamagnetic term on; absent (older views) = shown.
  diamagnetic: z.boolean().optional(),
});

export const PANEL_KEYS = ["share", "spinTrace", "maps", "compare"] as const;
export type PanelKey = (typeof PANEL_KEYS)[number];

export const viewStateSchema = z.object({
  v: z.literal(1).catch(1),
  xUnit: z.enum(X_UNITS).catch("nm"),
  xScale: z.enum(["log", "linear"]).catch("log"),
  yMode: z.enum(Y_MODES).catch("rad"),
  series: seriesSchema.catch({ total: true, electric: true, magnetic: true, cross: false }),
  showEllipticity: z.boolean().catch(false),
  // A stored marker outside the accepted range (older views allowed up to 1e7 nm) is dropped, not
  // the whole list.
  markersNm: z
    .array(z.number())
    .max(MAX_MARKERS)
    .transform((nms) => nms.filter((nm) => Number.isFinite(nm) && nm >= MARKER_MIN_NM && nm <= MARKER_MAX_NM))
    .catch([...DEFAULT_MARKERS_NM]),
  range: rangeSchema.catch(DEFAULT_RANGE),
  panels: z
    .strictObject({ share: z.boolean(), spinTrace: z.boolean(), maps: z.boolean(), compare: z.boolean() })
    .catch({ share: true, spinTrace: false, maps: false, compare: false }),
  spinTrace: z
    .strictObject({
      wavelengthNm: z.number().gt(0).max(1e7),
      intensityWPerM2: z.number().min(0).max(1e20),
      periods: z.number().int().min(1).max(50),
    })
    .catch({ wavelengthNm: 632.8, intensityWPerM2: 1e13, periods: 12 }),
  compareSetIds: z.array(z.string().max(100)).max(8).catch([]),
  // What the compare panel overlays; the Verdet constant compares sets of different B0 and L.
  compareQuantity: z.enum(COMPARE_QUANTITIES).catch("verdet"),
});

export type ViewState = z.infer<typeof viewStateSchema>;

export const DEFAULT_VIEW_STATE: ViewState = viewStateSchema.parse({});

/** Parses a stored view state (anything, including null) into a complete one. */
export function parseViewState(raw: unknown): ViewState {
  const base = raw !== null && typeof raw === "object" && !Array.isArray(raw) ? raw : {};
  return viewStateSchema.parse(base);
}
