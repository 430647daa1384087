// Row shapes of the tables, as Knex returns them. Only repositories see these; everything past a
// repository is a camelCase domain object.
import type { PartyRole, RequestStatus, Role, OrganisationKind } from '@cc/shared';

export interface OrganisationRow {
  id: number;
  name: string;
  kind: OrganisationKind;
  phone: string | null;
  address: string | null;
  licence_number: string | null;
  licence_state: string | null;
  licence_class: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  role: Role;
  organisation_id: number | null;
  created_at: Date;
  updated_at: Date;
}

export interface RepairRequestRow {
  id: number;
  street: string;
  city: string;
  state: string;
  zip: string;
  year_built: number;
  closing_date: string;
  nec_edition: number;
  status: RequestStatus;
  contractor_organisation_id: number | null;
  created_by: number;
  created_at: Date;
  updated_at: Date;
}

export interface RequestPartyRow {
  id: number;
  request_id: number;
  role: PartyRole;
  email: string;
  user_id: number | null;
  invite_token: string | null;
  invite_expires_at: Date | null;
  invited_by: number | null;
  joined_at: Date | null;
  created_at: Date;
}

export interface RequestStatusChangeRow {
  id: number;
  request_id: number;
  from_status: RequestStatus | null;
  to_status: RequestStatus;
  changed_by: number | null;
  /** The part the person played (a flow actor); null for changes recorded before parts were. */
  actor: string | null;
  note: string | null;
  created_at: Date;
}

export interface LineItemRow {
  id: number;
  request_id: number;
  code: string;
  room: string;
  location: string | null;
  quantity: number | null;
  evidence: string | null;
  page: number | null;
  severity: string;
  nec_refs: string[];
  status: string;
  is_edited: boolean;
  version: number;
  report_file_id: number | null;
  evidence_start: number | null;
  evidence_end: number | null;
  /** What the contractor set while pricing. */
  entry_id: number | null;
  adder_ids: number[];
  /** The contractor's own quantity; null: the item's. */
  pricing_quantity: number | null;
  is_quantity_assumed: boolean;
  visit_key: string;
  out_of_scope_reason: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface ReportFileRow {
  id: number;
  request_id: number;
  sha256: string;
  kind: 'pdf' | 'text' | 'pasted';
  original_name: string;
  size_bytes: number;
  page_count: number;
  storage_key: string;
  pages: string[];
  skipped_count: number;
  skipped: unknown[];
  uploaded_by: number | null;
  created_at: Date;
}
