// Row shapes of the rate-book, pricing and quote tables, as Knex returns them. Only repositories
// see these; everything past a repository is a camelCase domain object.
import type { AdderKind, Material, PricingMode } from '@cc/shared';
import type { LineItemRow } from './tables';

export interface RateBookRow {
  id: number;
  organisation_id: number;
  service_call_cents: number;
  first_hour_minimum_cents: number;
  first_hour_covers_minutes: number;
  hourly_rate_cents: number;
  billing_increment_minutes: number;
  materials_markup_bp: number;
  materials_tax_bp: number;
  permit_fee_cents: number;
  permit_handling_cents: number;
  card_deposit_bp: number;
  quote_validity_days: number;
  warranty_text: string;
  visit_capacity_minutes: number;
  version: number;
  created_at: Date;
  updated_at: Date;
}

export interface RateBookEntryRow {
  id: number;
  organisation_id: number;
  key: string;
  position: number;
  current_version: number;
  deleted_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export interface RateBookEntryVersionRow {
  id: number;
  entry_id: number;
  version: number;
  code: string | null;
  name: string;
  unit: string;
  mode: PricingMode;
  labour_minutes_per_unit: number | null;
  materials_cents_per_unit: number | null;
  markup_bp: number | null;
  materials: Material[];
  minutes_low: number | null;
  minutes_high: number | null;
  first_unit_cents: number | null;
  additional_unit_cents: number | null;
  hard_site_multiplier_bp: number | null;
  created_by: number | null;
  created_at: Date;
}

export interface RateBookAdderRow {
  id: number;
  organisation_id: number;
  key: string;
  name: string;
  kind: AdderKind;
  minutes: number | null;
  multiplier_bp: number | null;
  applies_when_built_before: number | null;
  position: number;
  version: number;
  deleted_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export interface RateBookChangeRow {
  id: number;
  organisation_id: number;
  changed_by: number | null;
  subject: 'terms' | 'entry' | 'adder';
  subject_id: number | null;
  action: 'create' | 'update' | 'delete' | 'import';
  before: unknown;
  after: unknown;
  created_at: Date;
}

/** The pricing columns of `line_items` (with the columns pricing reads). */
export type ItemPricingRow = Pick<
  LineItemRow,
  'id' | 'request_id' | 'code' | 'room' | 'location' | 'quantity' | 'status' | 'version' | 'entry_id' | 'adder_ids' | 'pricing_quantity' | 'is_quantity_assumed' | 'visit_key' | 'out_of_scope_reason'
>;

export interface PricingVisitRow {
  id: number;
  request_id: number;
  key: string;
  position: number;
  adder_ids: number[];
  has_permit: boolean;
}

export interface QuoteRow {
  id: number;
  request_id: number;
  version: number;
  organisation_id: number;
  sent_by: number | null;
  sent_at: Date;
  valid_until: string;
  subtotal_cents: number;
  tax_cents: number;
  total_cents: number;
  deposit_cents: number;
  warranty_text: string;
  safety_notice: string;
  note: string | null;
  contractor: unknown;
  property: unknown;
  rate_book: unknown;
  pricing_input: unknown;
  breakdown: unknown;
}

export interface QuoteLineRow {
  id: number;
  quote_id: number;
  position: number;
  line_item_id: number | null;
  kind: 'priced' | 'out-of-scope';
  code: string;
  room: string;
  location: string;
  entry_version_id: number | null;
  entry: unknown;
  quantity: number | null;
  is_quantity_assumed: boolean;
  adders: unknown;
  visit_key: string | null;
  labour_minutes: number;
  labour_cents: number;
  materials_cents: number;
  flat_cents: number;
  line_cents: number;
  out_of_scope_reason: string | null;
  edition_note: unknown;
}
