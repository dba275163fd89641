import "server-only";
import { findMeasurementSetLabId } from "@/db/queries/measurement-sets";
import type { LabRole } from "@/lib/contracts/roles";
import { requireLabRole } from "@/lib/auth/access";
import { type ResourceAccess } from "@/lib/contracts/access";
import { type Caller } from "@/lib/contracts/access";
import { DomainError, notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { StorageError } from "@/lib/storage/object-store";

export const MEASUREMENT_NOT_FOUND = "No such measurement set.";

/** Resolves a set's lab and checks the caller's role there (404 for unknown ids and non-members alike). */
export async function requireMeasurementSetRole(caller: Caller, id: string, minRole: LabRole): Promise<ResourceAccess> {
  if (!isUuid(id)) throw notFound(MEASUREMENT_NOT_FOUND);
  const labId = await findMeasurementSetLabId({ id });
  if (!labId) throw notFound(MEASUREMENT_NOT_FOUND);
  return requireLabRole(caller, labId, minRole, { notFoundMessage: MEASUREMENT_NOT_FOUND });
}

/** Object-storage faults become a 503 the client can show; the raw SDK message is only logged. */
export async function withStorage<T>(what: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (!(error instanceof StorageError)) throw error;
    console.error(`[api] ${what}:`, error.message);
    throw new DomainError("storage_unavailable", `The file store is unavailable; ${what}. Try again shortly.`, {
      retryAfterS: 5,
    });
  }
}
