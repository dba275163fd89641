import { validationError } from "@/lib/contracts/errors";
import { type PageQuery, pageQuerySchema } from "@/lib/contracts/paging";

/* Reads a list's `limit` and `cursor` from the query string (the cursor itself is decoded by db/paging.ts). */

export function readPage(request: Request): PageQuery {
  const search = new URL(request.url).searchParams;
  const parsed = pageQuerySchema.safeParse({ limit: search.get("limit") ?? undefined, cursor: search.get("cursor") || undefined });
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}
