import { z } from "zod";
import { runSpecSchema } from "@/lib/lab-runs/kinds";
import type { LabRole } from "./roles";
import { queryInteger } from "./validation";

/*
 * Lab runs: their states, the request schemas and the JSON shapes of the lab-run API, for both
 * sides (no server import, so the browser bundle can use them).
 */

/** Every state a lab run can be in; the database enum is built from this list. */
export const LAB_RUN_STATES = ["queued", "running", "done", "failed", "cancelled"] as const;
export type LabRunState = (typeof LAB_RUN_STATES)[number];

/** The states in which a run still has work ahead (it can be cancelled, and screens keep polling). */
export const ACTIVE_LAB_RUN_STATES = ["queued", "running"] as const satisfies readonly LabRunState[];

export function isActiveLabRun(state: LabRunState): boolean {
  return (ACTIVE_LAB_RUN_STATES as readonly LabRunState[]).includes(state);
}

export interface LabRunSummary {
  id: string;
  labId: string;
  labName: string;
  kind: string;
  title: string;
  cells: number;
  state: LabRunState;
  /** 0…1 */
  progress: number;
  /** 0…1: where the current attempt began (chunks saved by an earlier attempt count as done). */
  progressAtStart: number;
  cancelRequested: boolean;
  error: string | null;
  workerId: string | null;
  attempt: number;
  /** The engine version the run was made for (lib/lab-runs/engine.ts). */
  engineVersion: string;
  submittedBy: { id: string; name: string };
  parameterSet: { id: string | null; name: string; version: number; edited: boolean } | null;
  /** ISO 8601 */
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  updatedAt: string;
  /** The caller's role in the run's lab. */
  role: LabRole;
}

export interface LabRunDetail extends LabRunSummary {
  payload: Record<string, unknown>;
}

/** GET /api/runs/{id}/result: the columns as numbers (NaN as null) and what they mean. */
export interface LabRunResultBody {
  runId: string;
  workerId: string;
  attempt: number;
  computeMs: number;
  /** The engine version of the worker that computed it. */
  engineVersion: string;
  meta: Record<string, unknown>;
  columns: Record<string, (number | null)[]>;
}

const uuid = z.string().uuid("must be an id");

/** POST /api/runs */
export const submitRunSchema = z.intersection(
  z.object({
    labId: uuid,
    /** The set (and its current version) the parameters came from, when they came from one. */
    parameterSetId: uuid.optional(),
  }),
  runSpecSchema,
);
export type SubmitRunInput = z.infer<typeof submitRunSchema>;

export const listRunsQuery = z.object({
  labId: uuid.optional(),
  limit: queryInteger("limit", { min: 1, max: 200 }).default(50),
});
