import { z } from "zod";
import { VIEW_STATE_MAX_BYTES } from "./schemas";

/*
 * Request schema and answer shape of a person's own workbench view
 * (/api/parameter-sets/{id}/my-view). The stored JSON is the workbench's view state; the
 * workbench parses it field by field with defaults (lib/workbench/view-state.ts), so the API only
 * insists on an object of bounded size.
 */

export const myViewBodySchema = z.object({
  viewState: z
    .record(z.string(), z.unknown(), { error: "viewState must be a JSON object." })
    // Bytes of UTF-8, not UTF-16 code units: the limit is a storage size.
    .refine((value) => new TextEncoder().encode(JSON.stringify(value)).byteLength <= VIEW_STATE_MAX_BYTES, {
      message: `viewState must be at most ${VIEW_STATE_MAX_BYTES / 1024} KiB of JSON.`,
    }),
});

/** GET/PUT/DELETE …/my-view answer with this item. */
export interface MyWorkbenchView {
  setId: string;
  /** The caller's own view, or null when they have not saved one (or reset it). */
  viewState: Record<string, unknown> | null;
  /** ISO 8601 time of the caller's last save; null without an own view. */
  updatedAt: string | null;
  /** The lab's shared view (parameter_sets.view_state): where a person starts without their own. */
  sharedViewState: Record<string, unknown> | null;
}
