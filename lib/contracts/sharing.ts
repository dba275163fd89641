import { z } from "zod";
import type { ModelParams } from "@/lib/physics/schema";
import type { UserRef } from "./common";

/* Read-only share links of a parameter set: request schema and answer shapes. */

export const createShareLinkSchema = z.object({}).strict();

/** A live read-only share link of a set; the secret itself appears only in the create response. */
export interface ShareLinkSummary {
  id: string;
  createdAt: string;
  createdBy: UserRef | null;
}

/** What a share link shows (GET /api/shared/{token}): that one set, nothing of its lab or people. */
export interface SharedSet {
  name: string;
  description: string;
  tags: string[];
  version: number;
  updatedAt: string;
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}
