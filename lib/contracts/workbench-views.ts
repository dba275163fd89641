import { z } from "zod";
import { jsonProblem } from "./validation";

/*
 * Workbench views: the view state a lab shares with a parameter set
 * (PUT /api/parameter-sets/{id}/view-state) and the one a person keeps for themself
 * (/api/parameter-sets/{id}/my-view). The stored JSON is the workbench's view state; the workbench
 * parses it field by field with defaults (lib/workbench/view-state.ts), so the API only insists on
 * an object of bounded size and depth — the same rule for both.
 */

export const VIEW_STATE_MAX_BYTES = 32 * 1024;
/** The workbench's own view state is a few levels deep; anything far deeper is not one. */
export const VIEW_STATE_MAX_DEPTH = 16;

const viewStateObject = z
  .record(z.string(), z.unknown(), { error: "viewState must be a JSON object." })
  .superRefine((value, ctx) => {
    const problem = jsonProblem(value, VIEW_STATE_MAX_DEPTH);
    if (problem) ctx.addIssue({ code: "custom", message: `viewState: ${problem}`, abort: true });
  })
  // Bytes of UTF-8, not UTF-16 code units: the limit is a storage size.
  .refine((value) => new TextEncoder().encode(JSON.stringify(value)).byteLength <= VIEW_STATE_MAX_BYTES, {
    message: `viewState must be at most ${VIEW_STATE_MAX_BYTES / 1024} KiB of JSON.`,
  });

/** The lab's shared view of a set; null clears it. */
export const viewStateSchema = z.object({ viewState: viewStateObject.nullable() });

/** A person's own view of a set. */
export const myViewBodySchema = z.object({ viewState: viewStateObject });

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
