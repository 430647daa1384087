import { DEFAULT_DAY_PLAN_SETTINGS, effectiveTimeZone, PLANNED_VISIT_STATUSES, type PlannedVisitStatus, type SiteVisitStatus, type UsState } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** The organisation's planning settings as stored (defaults filled in until saved). */
export interface StoredDayPlanSettings {
  roadFactorPercent: number;
  averageSpeedMph: number;
  setupMinutes: number;
  flatItemMinutes: number;
  dayStart: string;
  dayEnd: string;
  lunchStart: string;
  lunchMinutes: number;
  shop: { street: string; city: string; state: UsState; zip: string; latitude: number | null; longitude: number | null };
  /** The time zone chosen (IANA name); null: the shop's state's. */
  timeZone: string | null;
  /** 0 until saved. */
  version: number;
}

/** A property's address and the coordinates entered for it. */
export interface PropertyRecord {
  requestId: number;
  street: string;
  city: string;
  state: string;
  zip: string;
  latitude: number | null;
  longitude: number | null;
}

/** A site visit with its property and the priced minutes of its items. */
export interface PlannedVisitRecord extends PropertyRecord {
  visitId: number;
  visitNumber: number;
  date: string;
  electricianId: number;
  arrivalFrom: string;
  arrivalTo: string;
  status: PlannedVisitStatus;
  /** Counts the visit's changes (a calendar's SEQUENCE; sent back to cancel it). */
  version: number;
  itemCount: number;
  /** Labour minutes of its items in the current quote; items without labour (flat rate) counted apart. */
  labourMinutes: number;
  flatItemCount: number;
}

/** A visit as a calendar shows it: cancelled ones too, marked so (RFC 5545 STATUS:CANCELLED). */
export type CalendarVisitRecord = Omit<PlannedVisitRecord, 'status'> & { status: SiteVisitStatus };

/** An approved request of the organisation with items that wait for a visit. */
export interface UnscheduledJobRecord extends PropertyRecord {
  closingDate: string;
  itemCount: number;
  labourMinutes: number;
  flatItemCount: number;
}

interface SettingsRow {
  road_factor_percent: number;
  average_speed_mph: number;
  setup_minutes: number;
  flat_item_minutes: number;
  day_start: string;
  day_end: string;
  lunch_start: string;
  lunch_minutes: number;
  shop_street: string;
  shop_city: string;
  shop_state: string;
  time_zone: string | null;
  shop_zip: string;
  shop_latitude: number | null;
  shop_longitude: number | null;
  version: number;
}

/** Street, city, state and ZIP read from an organisation's one-line address ("77 Foundry Lane, Marlow Springs, CO 80903"). */
function shopFromAddress(address: string | null): StoredDayPlanSettings['shop'] {
  const parts = (address ?? '').split(',').map((p) => p.trim());
  const stateZip = /^([A-Z]{2})\s+(\d{5})/.exec(parts[2] ?? '');
  return { street: parts[0] ?? '', city: parts[1] ?? '', state: (stateZip?.[1] ?? 'CO') as UsState, zip: stateZip?.[2] ?? '', latitude: null, longitude: null };
}

/**
 * Per-item minutes: the labour minutes of the item's line in the request's latest quote. A flat-rate
 * line carries none; those items are counted so the plan can give them the organisation's minutes.
 */
const ITEM_MINUTES = `
  LEFT JOIN LATERAL (
    SELECT ql.labour_minutes FROM quote_lines ql JOIN quotes q ON q.id = ql.quote_id
    WHERE ql.line_item_id = li.id AND ql.kind = 'priced'
    ORDER BY q.version DESC LIMIT 1
  ) priced ON true`;

const MINUTE_COLUMNS = `
  count(li.id)::int AS item_count,
  coalesce(sum(priced.labour_minutes), 0)::int AS labour_minutes,
  count(li.id) FILTER (WHERE coalesce(priced.labour_minutes, 0) = 0)::int AS flat_item_count`;

const PROPERTY = (row: Record<string, unknown>): PropertyRecord => ({
  requestId: row.request_id as number,
  street: row.street as string,
  city: row.city as string,
  state: row.state as string,
  zip: row.zip as string,
  latitude: row.latitude as number | null,
  longitude: row.longitude as number | null,
});

export class DayPlanRepository {
  constructor(private readonly db: Db) {}

  async settings(organisationId: number, trx?: Trx): Promise<StoredDayPlanSettings> {
    const row: SettingsRow | undefined = await (trx ?? this.db)('day_plan_settings').where({ organisation_id: organisationId }).first();
    if (!row) {
      const org = await (trx ?? this.db)('organisations').where({ id: organisationId }).first('address');
      return { ...DEFAULT_DAY_PLAN_SETTINGS, shop: shopFromAddress(org?.address ?? null), timeZone: null, version: 0 };
    }
    return {
      roadFactorPercent: row.road_factor_percent,
      averageSpeedMph: row.average_speed_mph,
      setupMinutes: row.setup_minutes,
      flatItemMinutes: row.flat_item_minutes,
      dayStart: row.day_start,
      dayEnd: row.day_end,
      lunchStart: row.lunch_start,
      lunchMinutes: row.lunch_minutes,
      shop: { street: row.shop_street, city: row.shop_city, state: row.shop_state as UsState, zip: row.shop_zip, latitude: row.shop_latitude, longitude: row.shop_longitude },
      timeZone: row.time_zone,
      version: row.version,
    };
  }

  /** The organisation's time zone in use: the one chosen in the settings, else the shop's state's. */
  async timeZone(organisationId: number, trx?: Trx): Promise<string> {
    const settings = await this.settings(organisationId, trx);
    return effectiveTimeZone(settings.timeZone, settings.shop.state);
  }

  /** Saves the settings when `version` is the stored one (0: none saved yet); false when it is not. */
  async saveSettings(organisationId: number, version: number, s: Omit<StoredDayPlanSettings, 'version'>, by: number, trx: Trx): Promise<boolean> {
    const columns = {
      road_factor_percent: s.roadFactorPercent,
      average_speed_mph: s.averageSpeedMph,
      setup_minutes: s.setupMinutes,
      flat_item_minutes: s.flatItemMinutes,
      day_start: s.dayStart,
      day_end: s.dayEnd,
      lunch_start: s.lunchStart,
      lunch_minutes: s.lunchMinutes,
      shop_street: s.shop.street,
      shop_city: s.shop.city,
      shop_state: s.shop.state,
      shop_zip: s.shop.zip,
      shop_latitude: s.shop.latitude,
      shop_longitude: s.shop.longitude,
      time_zone: s.timeZone,
      updated_by: by,
      updated_at: new Date(),
    };
    const existing = await trx('day_plan_settings').where({ organisation_id: organisationId }).forUpdate().first('version');
    if ((existing?.version ?? 0) !== version) return false;
    if (existing) await trx('day_plan_settings').where({ organisation_id: organisationId }).update({ ...columns, version: version + 1 });
    else await trx('day_plan_settings').insert({ ...columns, organisation_id: organisationId, version: 1 });
    return true;
  }

  /** The contractor users of the organisation: the people who can be sent on a visit. */
  async electricians(organisationId: number): Promise<{ id: number; name: string }[]> {
    return this.db('users').where({ organisation_id: organisationId, role: 'contractor' }).orderBy('name').select('id', 'name');
  }

  /**
   * Site visits of the organisation's electricians from `from` to `to` (inclusive), with `electricianId`
   * when given: the planned ones (booked, on site, finished); cancelled ones only for a calendar.
   */
  async visits(organisationId: number, from: string, to: string, electricianId?: number, trx?: Trx): Promise<PlannedVisitRecord[]> {
    return (await this.visitRows(organisationId, from, to, electricianId, false, trx)) as PlannedVisitRecord[];
  }

  /** The same with the cancelled visits, which a calendar keeps as cancelled events so that subscribed calendars drop them. */
  async calendarVisits(organisationId: number, from: string, to: string, electricianId?: number): Promise<CalendarVisitRecord[]> {
    return this.visitRows(organisationId, from, to, electricianId, true);
  }

  private async visitRows(organisationId: number, from: string, to: string, electricianId: number | undefined, withCancelled: boolean, trx?: Trx): Promise<CalendarVisitRecord[]> {
    const rows = await (trx ?? this.db)
      .select(
        'v.id AS visit_id',
        'v.number',
        'v.visit_date',
        'v.electrician_id',
        'v.arrival_from',
        'v.arrival_to',
        'v.status',
        'v.version',
        'r.id AS request_id',
        'r.street',
        'r.city',
        'r.state',
        'r.zip',
        'r.latitude',
        'r.longitude',
        this.db.raw(MINUTE_COLUMNS),
      )
      .from('site_visits as v')
      .join('repair_requests as r', 'r.id', 'v.request_id')
      .join('users as u', 'u.id', 'v.electrician_id')
      .joinRaw(`LEFT JOIN line_items li ON li.site_visit_id = v.id ${ITEM_MINUTES}`)
      .where('r.contractor_organisation_id', organisationId)
      .where('u.organisation_id', organisationId)
      .whereBetween('v.visit_date', [from, to])
      .modify((q) => {
        if (electricianId !== undefined) q.where('v.electrician_id', electricianId);
        if (!withCancelled) q.whereIn('v.status', PLANNED_VISIT_STATUSES);
      })
      .groupBy('v.id', 'r.id')
      .orderBy([{ column: 'v.visit_date' }, { column: 'v.arrival_from' }, { column: 'v.id' }]);
    return rows.map((row: Record<string, unknown>) => ({
      ...PROPERTY(row),
      visitId: row.visit_id as number,
      visitNumber: row.number as number,
      date: row.visit_date as string,
      electricianId: row.electrician_id as number,
      arrivalFrom: row.arrival_from as string,
      arrivalTo: row.arrival_to as string,
      status: row.status as SiteVisitStatus,
      version: row.version as number,
      itemCount: row.item_count as number,
      labourMinutes: row.labour_minutes as number,
      flatItemCount: row.flat_item_count as number,
    }));
  }

  /** Approved requests assigned to the organisation whose approved items are not yet on a visit. */
  async unscheduledJobs(organisationId: number, limit = 200): Promise<UnscheduledJobRecord[]> {
    const rows = await this.db
      .select('r.id AS request_id', 'r.street', 'r.city', 'r.state', 'r.zip', 'r.latitude', 'r.longitude', 'r.closing_date', this.db.raw(MINUTE_COLUMNS))
      .from('repair_requests as r')
      .joinRaw(`JOIN line_items li ON li.request_id = r.id AND li.status = 'approved' AND li.site_visit_id IS NULL ${ITEM_MINUTES}`)
      .where({ 'r.contractor_organisation_id': organisationId, 'r.status': 'approved' })
      .groupBy('r.id')
      .orderBy([{ column: 'r.closing_date' }, { column: 'r.id' }])
      .limit(limit);
    return rows.map((row: Record<string, unknown>) => ({
      ...PROPERTY(row),
      closingDate: row.closing_date as string,
      itemCount: row.item_count as number,
      labourMinutes: row.labour_minutes as number,
      flatItemCount: row.flat_item_count as number,
    }));
  }

  /** One site visit of the organisation (its request assigned to it), or null. */
  async findVisit(organisationId: number, visitId: number, trx?: Trx): Promise<{ id: number; requestId: number; number: number; date: string; electricianId: number; arrivalFrom: string; arrivalTo: string; status: SiteVisitStatus } | null> {
    const row = await (trx ?? this.db)('site_visits as v')
      .join('repair_requests as r', 'r.id', 'v.request_id')
      .where({ 'v.id': visitId, 'r.contractor_organisation_id': organisationId })
      .modify((q) => {
        if (trx) q.forUpdate();
      })
      .first('v.id', 'v.request_id', 'v.number', 'v.visit_date', 'v.electrician_id', 'v.arrival_from', 'v.arrival_to', 'v.status');
    return row
      ? { id: row.id, requestId: row.request_id, number: row.number, date: row.visit_date, electricianId: row.electrician_id, arrivalFrom: row.arrival_from, arrivalTo: row.arrival_to, status: row.status }
      : null;
  }

  async isRequestOf(organisationId: number, requestId: number): Promise<boolean> {
    return Boolean(await this.db('repair_requests').where({ id: requestId, contractor_organisation_id: organisationId }).first('id'));
  }

  async setPin(requestId: number, latitude: number | null, longitude: number | null): Promise<void> {
    await this.db('repair_requests').where({ id: requestId }).update({ latitude, longitude, updated_at: new Date() });
  }

  async replaceFeedToken(userId: number, tokenSha256: string, by: number): Promise<void> {
    await this.db('calendar_feeds')
      .insert({ user_id: userId, token_sha256: tokenSha256, created_by: by, created_at: new Date() })
      .onConflict('user_id')
      .merge(['token_sha256', 'created_by', 'created_at']);
  }

  /** The electrician a feed token belongs to (still a contractor of an organisation), or null. */
  async feedOwner(tokenSha256: string): Promise<{ id: number; name: string; organisationId: number } | null> {
    const row = await this.db('calendar_feeds as f')
      .join('users as u', 'u.id', 'f.user_id')
      .where({ 'f.token_sha256': tokenSha256, 'u.role': 'contractor', 'u.is_active': true })
      .whereNotNull('u.organisation_id')
      .first('u.id', 'u.name', 'u.organisation_id');
    return row ? { id: row.id, name: row.name, organisationId: row.organisation_id } : null;
  }
}
