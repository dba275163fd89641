import { z } from "zod";
import { DomainError } from "@/lib/contracts/errors";
import type { Page } from "@/lib/contracts/paging";
import { INT4_MAX, timestampTextSchema } from "@/lib/contracts/validation";

/*
 * Keyset paging shared by every list query: a page is `{ items, nextCursor }`; the cursor is the
 * sort key of the page's last row, base64url-encoded JSON, opaque to clients. A tampered cursor is
 * a validation error naming the field, never a database error.
 */

export function encodeCursor(key: readonly (string | number)[]): string {
  return Buffer.from(JSON.stringify(key), "utf8").toString("base64url");
}

const badCursor = () =>
  new DomainError("validation", "That cursor is not valid; start again from the first page.", {
    fields: { cursor: "Not a cursor of this list." },
  });

/** The decoded sort key, checked against the list's own tuple shape. */
export function decodeCursor<S extends z.ZodType>(cursor: string | undefined, shape: S): z.infer<S> | null {
  if (cursor === undefined) return null;
  let value: unknown;
  try {
    value = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
  } catch {
    throw badCursor();
  }
  const parsed = shape.safeParse(value);
  if (!parsed.success) throw badCursor();
  return parsed.data;
}

/**
 * A timestamp + uuid sort key (newest first lists). The timestamp is PostgreSQL's own text form
 * (microseconds): a JavaScript Date keeps only milliseconds and would skip rows saved within the
 * same millisecond.
 */
export const timeIdCursor = z.tuple([timestampTextSchema, z.uuid()]);

/** A version number sort key (a set's versions): an integer PostgreSQL holds. */
export const versionCursor = z.tuple([z.number().int().min(1).max(INT4_MAX)]);

/** An offset into a short list ordered by something other than a unique key (members). */
export const offsetCursor = z.tuple([z.literal("o"), z.number().int().min(0).max(1_000_000)]);

/** Rows fetched with limit + 1: the extra row only says whether there is a next page. */
export function toPage<R, T>(rows: R[], limit: number, map: (row: R) => T, keyOf: (row: R) => readonly (string | number)[]): Page<T> {
  const pageRows = rows.slice(0, limit);
  const last = pageRows[pageRows.length - 1];
  return { items: pageRows.map(map), nextCursor: rows.length > limit && last !== undefined ? encodeCursor(keyOf(last)) : null };
}
