import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";

/** A malformed id cannot name anything: 404, like an unknown one. */
export function requireUuid(value: string, what = "Not found."): string {
  if (!isUuid(value)) throw notFound(what);
  return value;
}
