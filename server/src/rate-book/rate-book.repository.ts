import type {
  AdderEffect,
  CreateSiteAdder,
  EntryPricing,
  Page,
  RateBookChange,
  RateBookEntryContent,
  RateBookEntryRecord,
  RateBookEntryVersion,
  RateBookTermsRecord,
  SiteAdderRecord,
  VisitTerms,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { RateBookAdderRow, RateBookChangeRow, RateBookEntryRow, RateBookEntryVersionRow, RateBookRow } from '../db/pricing-tables';

type EntryJoinRow = RateBookEntryRow & RateBookEntryVersionRow & { entry_updated_at: Date; is_on_sent_quote: boolean };

function toTerms(row: RateBookRow): RateBookTermsRecord {
  return {
    terms: {
      serviceCallCents: row.service_call_cents,
      firstHourMinimumCents: row.first_hour_minimum_cents,
      firstHourCoversMinutes: row.first_hour_covers_minutes,
      hourlyRateCents: row.hourly_rate_cents,
      billingIncrementMinutes: row.billing_increment_minutes,
      materialsMarkupBp: row.materials_markup_bp,
      materialsTaxBp: row.materials_tax_bp,
      permit: { feeCents: row.permit_fee_cents, handlingCents: row.permit_handling_cents },
      cardDepositBp: row.card_deposit_bp,
      quoteValidityDays: row.quote_validity_days,
      warrantyText: row.warranty_text,
      visitCapacityMinutes: row.visit_capacity_minutes,
    },
    version: row.version,
    updatedAt: row.updated_at.toISOString(),
  };
}

function termsToRow(terms: VisitTerms): Omit<RateBookRow, 'id' | 'organisation_id' | 'version' | 'created_at' | 'updated_at'> {
  return {
    service_call_cents: terms.serviceCallCents,
    first_hour_minimum_cents: terms.firstHourMinimumCents,
    first_hour_covers_minutes: terms.firstHourCoversMinutes,
    hourly_rate_cents: terms.hourlyRateCents,
    billing_increment_minutes: terms.billingIncrementMinutes,
    materials_markup_bp: terms.materialsMarkupBp,
    materials_tax_bp: terms.materialsTaxBp,
    permit_fee_cents: terms.permit.feeCents,
    permit_handling_cents: terms.permit.handlingCents,
    card_deposit_bp: terms.cardDepositBp,
    quote_validity_days: terms.quoteValidityDays,
    warranty_text: terms.warrantyText,
    visit_capacity_minutes: terms.visitCapacityMinutes,
  };
}

function toPricing(row: RateBookEntryVersionRow): EntryPricing {
  if (row.mode === 'flat') {
    return {
      mode: 'flat',
      firstUnitCents: row.first_unit_cents ?? 0,
      additionalUnitCents: row.additional_unit_cents ?? 0,
      hardSiteMultiplierBp: row.hard_site_multiplier_bp ?? 10_000,
    };
  }
  return {
    mode: 'time-and-materials',
    labourMinutesPerUnit: row.labour_minutes_per_unit ?? 0,
    materialsCentsPerUnit: row.materials_cents_per_unit ?? 0,
    markupBp: row.markup_bp,
    materials: row.materials,
    minutesLow: row.minutes_low ?? 0,
    minutesHigh: row.minutes_high ?? 0,
  };
}

function contentToRow(content: RateBookEntryContent): Partial<RateBookEntryVersionRow> {
  const p = content.pricing;
  const isTimed = p.mode === 'time-and-materials';
  return {
    code: content.code,
    name: content.name,
    unit: content.unit,
    mode: p.mode,
    labour_minutes_per_unit: isTimed ? p.labourMinutesPerUnit : null,
    materials_cents_per_unit: isTimed ? p.materialsCentsPerUnit : null,
    markup_bp: isTimed ? p.markupBp : null,
    materials: JSON.stringify(isTimed ? p.materials : []) as unknown as RateBookEntryVersionRow['materials'],
    minutes_low: isTimed ? p.minutesLow : null,
    minutes_high: isTimed ? p.minutesHigh : null,
    first_unit_cents: isTimed ? null : p.firstUnitCents,
    additional_unit_cents: isTimed ? null : p.additionalUnitCents,
    hard_site_multiplier_bp: isTimed ? null : p.hardSiteMultiplierBp,
  };
}

function toEntry(row: EntryJoinRow): RateBookEntryRecord {
  return {
    id: row.entry_id,
    key: row.key,
    version: row.version,
    code: row.code,
    name: row.name,
    unit: row.unit,
    pricing: toPricing(row),
    position: row.position,
    isOnSentQuote: row.is_on_sent_quote,
    updatedAt: row.entry_updated_at.toISOString(),
  };
}

function toEffect(row: RateBookAdderRow): AdderEffect {
  if (row.kind === 'labour-multiplier') return { kind: row.kind, multiplierBp: row.multiplier_bp ?? 10_000 };
  return { kind: row.kind, minutes: row.minutes ?? 0 };
}

function effectToRow(effect: AdderEffect): Pick<RateBookAdderRow, 'kind' | 'minutes' | 'multiplier_bp'> {
  return effect.kind === 'labour-multiplier'
    ? { kind: effect.kind, minutes: null, multiplier_bp: effect.multiplierBp }
    : { kind: effect.kind, minutes: effect.minutes, multiplier_bp: null };
}

function toAdder(row: RateBookAdderRow): SiteAdderRecord {
  return {
    id: row.id,
    key: row.key,
    version: row.version,
    name: row.name,
    effect: toEffect(row),
    appliesWhenBuiltBefore: row.applies_when_built_before,
    position: row.position,
    updatedAt: row.updated_at.toISOString(),
  };
}

export interface NewRateBookChange {
  organisationId: number;
  changedBy: number | null;
  subject: RateBookChangeRow['subject'];
  subjectId: number | null;
  action: RateBookChangeRow['action'];
  before: unknown;
  after: unknown;
}

/** Terms, entries (with their versions), site adders and the change log of contractors' rate books. */
export class RateBookRepository {
  constructor(private readonly db: Db) {}

  async findTerms(organisationId: number, trx?: Trx): Promise<RateBookTermsRecord | null> {
    const row = await (trx ?? this.db)<RateBookRow>('rate_books').where({ organisation_id: organisationId }).first();
    return row ? toTerms(row) : null;
  }

  async insertTerms(organisationId: number, terms: VisitTerms, trx: Trx): Promise<void> {
    await trx<RateBookRow>('rate_books').insert({ organisation_id: organisationId, ...termsToRow(terms) });
  }

  /** Saves the terms only if they are still at `version`; returns whether they were. */
  async updateTerms(organisationId: number, version: number, terms: VisitTerms, trx: Trx): Promise<boolean> {
    const updated = await trx<RateBookRow>('rate_books')
      .where({ organisation_id: organisationId, version })
      .update({ ...termsToRow(terms), version: version + 1, updated_at: new Date() });
    return updated === 1;
  }

  private entries(trx?: Trx) {
    const db = trx ?? this.db;
    return db('rate_book_entries as e')
      .join('rate_book_entry_versions as v', function () {
        this.on('v.entry_id', 'e.id').andOn('v.version', 'e.current_version');
      })
      .whereNull('e.deleted_at')
      .select(
        'e.key',
        'e.position',
        'e.organisation_id',
        'e.updated_at as entry_updated_at',
        'v.*',
        db.raw("EXISTS (SELECT 1 FROM quote_lines ql WHERE ql.entry_version_id = v.id) AS is_on_sent_quote"),
      );
  }

  async listEntries(organisationId: number, trx?: Trx): Promise<RateBookEntryRecord[]> {
    const rows: EntryJoinRow[] = await this.entries(trx).where('e.organisation_id', organisationId).orderBy([{ column: 'e.position' }, { column: 'e.id' }]);
    return rows.map(toEntry);
  }

  async findEntry(organisationId: number, id: number, trx?: Trx): Promise<RateBookEntryRecord | null> {
    const row: EntryJoinRow | undefined = await this.entries(trx).where({ 'e.organisation_id': organisationId, 'e.id': id }).first();
    return row ? toEntry(row) : null;
  }

  /** Row ids of the current versions of `entryIds`: what a quote line points at. */
  async currentVersionRowIds(entryIds: number[], trx?: Trx): Promise<Map<number, number>> {
    if (entryIds.length === 0) return new Map();
    const rows: { entry_id: number; id: number }[] = await (trx ?? this.db)('rate_book_entries as e')
      .join('rate_book_entry_versions as v', function () {
        this.on('v.entry_id', 'e.id').andOn('v.version', 'e.current_version');
      })
      .whereIn('e.id', entryIds)
      .select('v.entry_id', 'v.id');
    return new Map(rows.map((r) => [r.entry_id, r.id]));
  }

  async entryVersions(entryId: number): Promise<RateBookEntryVersion[]> {
    const rows: (RateBookEntryVersionRow & { by_name: string | null })[] = await this.db('rate_book_entry_versions as v')
      .leftJoin('users as u', 'u.id', 'v.created_by')
      .where('v.entry_id', entryId)
      .select('v.*', 'u.name as by_name')
      .orderBy('v.version', 'desc');
    return rows.map((r) => ({
      version: r.version,
      code: r.code,
      name: r.name,
      unit: r.unit,
      pricing: toPricing(r),
      createdAt: r.created_at.toISOString(),
      createdByName: r.by_name,
    }));
  }

  /** Keys of the organisation's live entries or adders. */
  async liveKeys(table: 'rate_book_entries' | 'rate_book_adders', organisationId: number, trx?: Trx): Promise<Set<string>> {
    const rows: { key: string }[] = await (trx ?? this.db)(table).where({ organisation_id: organisationId }).whereNull('deleted_at').select('key');
    return new Set(rows.map((r) => r.key));
  }

  private async nextPosition(table: 'rate_book_entries' | 'rate_book_adders', organisationId: number, trx: Trx): Promise<number> {
    const row = await trx(table).where({ organisation_id: organisationId }).max<{ max: number | null }>('position as max').first();
    return (row?.max ?? 0) + 1;
  }

  async createEntry(organisationId: number, key: string, content: RateBookEntryContent, by: number | null, trx: Trx): Promise<number> {
    const position = await this.nextPosition('rate_book_entries', organisationId, trx);
    const [entry] = await trx<RateBookEntryRow>('rate_book_entries').insert({ organisation_id: organisationId, key, position }).returning('id');
    await trx('rate_book_entry_versions').insert({ entry_id: entry.id, version: 1, created_by: by, ...contentToRow(content) });
    return entry.id;
  }

  /** Makes `content` version `version + 1` of the entry, only if it is still at `version`. */
  async addEntryVersion(entryId: number, version: number, content: RateBookEntryContent, by: number | null, trx: Trx): Promise<boolean> {
    const updated = await trx<RateBookEntryRow>('rate_book_entries')
      .where({ id: entryId, current_version: version })
      .whereNull('deleted_at')
      .update({ current_version: version + 1, updated_at: new Date() });
    if (updated !== 1) return false;
    await trx('rate_book_entry_versions').insert({ entry_id: entryId, version: version + 1, created_by: by, ...contentToRow(content) });
    return true;
  }

  /** Hides the entry (its versions stay for the quotes that use them), only if still at `version`. */
  async deleteEntry(entryId: number, version: number, trx: Trx): Promise<boolean> {
    const updated = await trx<RateBookEntryRow>('rate_book_entries')
      .where({ id: entryId, current_version: version })
      .whereNull('deleted_at')
      .update({ deleted_at: new Date(), updated_at: new Date() });
    return updated === 1;
  }

  async listAdders(organisationId: number, trx?: Trx): Promise<SiteAdderRecord[]> {
    const rows = await (trx ?? this.db)<RateBookAdderRow>('rate_book_adders')
      .where({ organisation_id: organisationId })
      .whereNull('deleted_at')
      .orderBy([{ column: 'position' }, { column: 'id' }]);
    return rows.map(toAdder);
  }

  async findAdder(organisationId: number, id: number, trx?: Trx): Promise<SiteAdderRecord | null> {
    const row = await (trx ?? this.db)<RateBookAdderRow>('rate_book_adders').where({ organisation_id: organisationId, id }).whereNull('deleted_at').first();
    return row ? toAdder(row) : null;
  }

  async createAdder(organisationId: number, key: string, adder: Omit<CreateSiteAdder, 'key'>, trx: Trx): Promise<number> {
    const position = await this.nextPosition('rate_book_adders', organisationId, trx);
    const [row] = await trx<RateBookAdderRow>('rate_book_adders')
      .insert({
        organisation_id: organisationId,
        key,
        name: adder.name,
        ...effectToRow(adder.effect),
        applies_when_built_before: adder.appliesWhenBuiltBefore,
        position,
      })
      .returning('id');
    return row.id;
  }

  /** Saves the adder only if it is still at `version`; returns whether it was. */
  async updateAdder(id: number, version: number, adder: Pick<SiteAdderRecord, 'name' | 'effect' | 'appliesWhenBuiltBefore'>, trx: Trx): Promise<boolean> {
    const updated = await trx<RateBookAdderRow>('rate_book_adders')
      .where({ id, version })
      .whereNull('deleted_at')
      .update({
        name: adder.name,
        ...effectToRow(adder.effect),
        applies_when_built_before: adder.appliesWhenBuiltBefore,
        version: version + 1,
        updated_at: new Date(),
      });
    return updated === 1;
  }

  async deleteAdder(id: number, version: number, trx: Trx): Promise<boolean> {
    const updated = await trx<RateBookAdderRow>('rate_book_adders').where({ id, version }).whereNull('deleted_at').update({ deleted_at: new Date(), updated_at: new Date() });
    return updated === 1;
  }

  async recordChange(change: NewRateBookChange, trx: Trx): Promise<void> {
    await trx('rate_book_changes').insert({
      organisation_id: change.organisationId,
      changed_by: change.changedBy,
      subject: change.subject,
      subject_id: change.subjectId,
      action: change.action,
      before: change.before === null ? null : JSON.stringify(change.before),
      after: change.after === null ? null : JSON.stringify(change.after),
    });
  }

  async listChanges(organisationId: number, page: number, pageSize: number): Promise<Page<RateBookChange>> {
    const rows: (RateBookChangeRow & { by_name: string | null; total_count: string })[] = await this.db('rate_book_changes as c')
      .leftJoin('users as u', 'u.id', 'c.changed_by')
      .where('c.organisation_id', organisationId)
      .select('c.*', 'u.name as by_name', this.db.raw('count(*) over() AS total_count'))
      .orderBy([{ column: 'c.created_at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
      .limit(pageSize)
      .offset(page * pageSize);
    return {
      items: rows.map((r) => ({
        id: r.id,
        at: r.created_at.toISOString(),
        byName: r.by_name,
        subject: r.subject,
        subjectId: r.subject_id,
        action: r.action,
        before: r.before ?? null,
        after: r.after ?? null,
      })),
      total: rows.length ? Number(rows[0].total_count) : 0,
      page,
      pageSize,
    };
  }
}
