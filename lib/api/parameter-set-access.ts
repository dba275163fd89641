import "server-only";
import { findParameterSetLabId } from "@/db/queries/parameter-sets";
import type { LabRole } from "@/lib/contracts/roles";
import { requireLabRole } from "@/lib/auth/access";
import { type ResourceAccess } from "@/lib/contracts/access";
import { type Caller } from "@/lib/contracts/access";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";

const NOT_FOUND = "No such parameter set.";

/** Resolves a set's lab and checks the caller's role there (404 for unknown ids and non-members alike). */
export async function requireParameterSetRole(caller: Caller, id: string, minRole: LabRole): Promise<ResourceAccess> {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const labId = await findParameterSetLabId({ id });
  if (!labId) throw notFound(NOT_FOUND);
  return requireLabRole(caller, labId, minRole, { notFoundMessage: NOT_FOUND });
}
