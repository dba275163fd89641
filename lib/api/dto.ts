import type { ModelParams } from "@/lib/physics/schema";

/*
 * The JSON shapes the REST API answers with (shared-contract/foundation.md), in one place for
 * both sides: db/queries builds them, lib/query reads them. Types only and no server import, so
 * the browser bundle can import it.
 */

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
  /** ISO 8601 */
  createdAt: string;
  /** ISO 8601 */
  updatedAt: string;
  createdBy: UserRef;
  updatedBy: UserRef;
  /** The caller's role in the set's lab (site admins: owner). */
  role: LabRole;
}

export interface ParameterSet extends ParameterSetSummary {
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}

/** One immutable snapshot of a set (GET …/versions). */
export interface ParameterSetVersion {
  version: number;
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
  /** Where the version came from when not typed in (a fit: lib/fit/provenance.ts FitProvenance); null otherwise. */
  provenance: Record<string, unknown> | null;
  createdAt: string;
  createdBy: UserRef;
}

/** A lab with the caller's role in it (GET /api/labs). */
export interface LabSummary {
  id: string;
  name: string;
  role: LabRole;
}

export interface MemberSummary {
  userId: string;
  email: string;
  name: string;
  role: LabRole;
}

/** An API token as listed; the secret itself appears only once, in the create response. */
export interface TokenSummary {
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

/** A measurement set as listed (GET /api/measurement-sets); the points come from …/{id}/points. */
export interface MeasurementSetSummary {
  id: string;
  labId: string;
  labName: string;
  name: string;
  sample: string;
  /** What the values are: a Verdet constant in rad/(T·m) or a rotation in rad. */
  quantity: "verdet" | "rotation";
  rowCount: number;
  wavelengthSpanNm: { min: number; max: number };
  /** Distinct values over the rows, ascending. */
  temperaturesK: number[];
  fieldsT: number[];
  lengthsM: number[];
  fileName: string;
  fileBytes: number;
  uploadedBy: UserRef;
  /** ISO 8601 */
  createdAt: string;
  /** The caller's role in the set's lab (site admins: owner). */
  role: LabRole;
}

/** A pending invitation to a lab (GET /api/labs/{id}/invitations). */
export interface InvitationSummary {
  id: string;
  email: string;
  role: LabRole;
  createdAt: string;
  expiresAt: string;
  invitedBy: UserRef | null;
}

/** A live read-only share link of a set; the secret itself appears only in the create response. */
export interface ShareLinkSummary {
  id: string;
  createdAt: string;
  createdBy: UserRef | null;
}

/** What a share link shows (GET /api/shared/{token}): that one set, nothing of its lab or people. */
export interface SharedSet {
  name: string;
  description: string;
  tags: string[];
  version: number;
  updatedAt: string;
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}
