import type { LabRole } from "@/lib/api/dto";

/* Response shapes of the REST API (shared-contract/foundation.md): one definition, lib/api/dto.ts. */

export type {
  ItemResponse,
  ItemsResponse,
  LabRole,
  ParameterSet,
  ParameterSetSummary,
  ParameterSetVersion,
  UserRef,
  LabSummary as Lab,
  MemberSummary as LabMember,
  TokenSummary as ApiToken,
} from "@/lib/api/dto";

const RANK: Record<LabRole, number> = { viewer: 0, editor: 1, owner: 2 };

/** Mirrors the server's rule (owner > editor > viewer); hiding controls is convenience only. */
export function hasRole(role: LabRole | undefined, min: LabRole): boolean {
  return role !== undefined && RANK[role] >= RANK[min];
}
