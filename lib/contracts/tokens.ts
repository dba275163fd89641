import { z } from "zod";
import { safeString } from "./validation";

/* API tokens: request schema and answer shape. */

export const createTokenSchema = z.object({
  name: safeString({ error: "Name the token." }).trim().min(1, "Name the token.").max(80, "At most 80 characters."),
});

/** An API token as listed; the secret itself appears only once, in the create response. */
export interface TokenSummary {
  id: string;
  name: string;
  createdAt: string;
  lastUsedAt: string | null;
}
