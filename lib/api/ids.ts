import { z } from "zod";
import { notFound } from "@/lib/contracts/errors";

const uuid = z.uuid();

/** A malformed id cannot name anything: 404, like an unknown one (and never a SQL cast error). */
export function requireUuid(value: string, what = "Not found."): string {
  if (!uuid.safeParse(value).success) throw notFound(what);
  return value;
}

export function isUuid(value: string): boolean {
  return uuid.safeParse(value).success;
}
