import type { ModelParams } from "@/lib/physics/schema";

/* Response shapes of the REST API (shared-contract/foundation.md), as the browser sees them. */

export type LabRole = "owner" | "editor" | "viewer";

export interface UserRef {
  id: string;
  name: string;
}

export interface ParameterSetSummary {
  id: string;
  labId: string;
  labName: string;
  name: string;
  description: string;
  tags: string[];
  version: number;
  createdAt: string;
  updatedAt: string;
  createdBy: UserRef;
  updatedBy: UserRef;
  role: LabRole;
}

export interface ParameterSet extends ParameterSetSummary {
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}

export interface ParameterSetVersion {
  version: number;
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
  createdAt: string;
  createdBy: UserRef;
}

export interface Lab {
  id: string;
  name: string;
  role: LabRole;
}

export interface LabMember {
  userId: string;
  email: string;
  name: string;
  role: LabRole;
}

export interface ApiToken {
  id: string;
  name: string;
  createdAt: string;
  lastUsedAt: string | null;
}

export interface ItemsResponse<T> {
  items: T[];
}

export interface ItemResponse<T> {
  item: T;
}

const RANK: Record<LabRole, number> = { viewer: 0, editor: 1, owner: 2 };

/** Mirrors the server's rule (owner > editor > viewer); hiding controls is convenience only. */
export function hasRole(role: LabRole | undefined, min: LabRole): boolean {
  return role !== undefined && RANK[role] >= RANK[min];
}
