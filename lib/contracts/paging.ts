import { z } from "zod";
import { queryInteger, safeString } from "./validation";

/*
 * Paging: every list takes `limit` (default 50, at most 200) and an opaque `cursor` from the
 * previous page's `nextCursor`, and answers a Page. Keyset paging, so a page costs the same
 * however deep it is; the cursor codec lives with the queries (db/paging.ts).
 */

export const PAGE_DEFAULT = 50;
export const PAGE_MAX = 200;

export const pageQuerySchema = z.object({
  limit: queryInteger("limit", { min: 1, max: PAGE_MAX }).default(PAGE_DEFAULT),
  cursor: safeString().max(200, "That cursor is not valid.").optional(),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export interface Page<T> {
  items: T[];
  /** Pass as `cursor` for the next page; null on the last page. */
  nextCursor: string | null;
}
