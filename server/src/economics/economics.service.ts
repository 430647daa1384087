import {
  buildPickList,
  divideRoundHalfUp,
  priceScope,
  lineSharesOfVisit,
  minutesPerUnitOnVisit,
  minutesVsBook,
  singleVisitRates,
  totalsOf,
  visitRates,
  type CurrentUser,
  type DayEconomics,
  type DayQuery,
  type LineBreakdown,
  type OutcomeRecord,
  type PeriodEconomics,
  type PeriodQuery,
  type PickItem,
  type PickList,
  type SpareSettings,
  type SpareSettingsView,
  type TickPickLine,
  type TimedItem,
  type VisitEconomics,
} from '@cc/shared';
import type { Db } from '../db/knex';
import { ForbiddenError, NotFoundError, ValidationError } from '../errors';
import type { ApprovedScope, ApprovedScopeReader } from '../approvals/approved-scope';
import type { ApprovalRepository } from '../approvals/approval.repository';
import type { RateBookService } from '../rate-book/rate-book.service';
import type { DriveTimeSource } from './drive-time';
import type { EconomicsRepository, EconomicsVisit, VisitCorrection } from './economics.repository';

/** A contractor organisation's day economics: pick lists, first-visit outcomes, earnings per visit, day and period. */
export class EconomicsService {
  constructor(
    private readonly db: Db,
    private readonly repo: EconomicsRepository,
    private readonly scopes: ApprovedScopeReader,
    private readonly approvals: ApprovalRepository,
    private readonly rateBooks: RateBookService,
    /** Where drive minutes come from: the day plan, once it is plugged in. */
    public driveTime: DriveTimeSource,
  ) {}

  /** Only a contractor's people see their organisation's economics. */
  private organisationOf(user: CurrentUser): number {
    if (user.role !== 'contractor' || user.organisationId === null) throw new ForbiddenError('Only a contractor’s people see the day economics');
    return user.organisationId;
  }

  /** The electrician, who must be of the user's organisation (anyone else: 404). */
  private async electrician(organisationId: number, electricianId: number): Promise<{ id: number; name: string }> {
    const found = (await this.repo.electricians(organisationId)).find((e) => e.id === electricianId);
    if (!found) throw new NotFoundError('No such electrician');
    return found;
  }

  async organisationName(user: CurrentUser): Promise<string> {
    const loaded = await this.rateBooks.load(this.organisationOf(user));
    return loaded?.book.contractorName ?? 'Contractor';
  }

  async electricians(user: CurrentUser): Promise<{ id: number; name: string }[]> {
    return this.repo.electricians(this.organisationOf(user));
  }

  /** Planned days (an electrician and a date with visits) from `from` to `to`. */
  async plannedDays(user: CurrentUser, from: string, to: string): Promise<{ date: string; electrician: { id: number; name: string }; visitCount: number }[]> {
    const visits = await this.repo.visits(this.organisationOf(user), from, to);
    const days = new Map<string, { date: string; electrician: { id: number; name: string }; visitCount: number }>();
    for (const v of visits) {
      const key = `${v.date}|${v.electricianId}`;
      const day = days.get(key) ?? { date: v.date, electrician: { id: v.electricianId, name: v.electricianName }, visitCount: 0 };
      day.visitCount += 1;
      days.set(key, day);
    }
    return [...days.values()];
  }

  /** Rate-book keys of the organisation's entries and site conditions by their engine ids (deleted ones keep their id). */
  private async keysOf(organisationId: number): Promise<{ entry: (id: string) => string; adder: (id: string) => string }> {
    const loaded = await this.rateBooks.load(organisationId);
    const entries = new Map((loaded?.entries ?? []).map((e) => [String(e.id), e.key]));
    const adders = new Map((loaded?.adders ?? []).map((a) => [String(a.id), a.key]));
    return { entry: (id) => entries.get(id) ?? id, adder: (id) => adders.get(id) ?? id };
  }

  private async scopesOf(requestIds: Iterable<number>): Promise<Map<number, PricedScope | null>> {
    const scopes = new Map<number, PricedScope | null>();
    for (const id of new Set(requestIds)) scopes.set(id, await this.scopeOf(id));
    return scopes;
  }

  /**
   * The signed scope (with its approved change orders); for a request approved without a signing
   * record (the demo history), its latest quote for the items that reached approved work.
   */
  private async scopeOf(requestId: number): Promise<PricedScope | null> {
    const signed = await this.scopes.load(requestId);
    if (signed) return signed;
    const version = await this.repo.latestQuoteVersion(requestId);
    const pricing = version === null ? null : await this.approvals.quotePricing(requestId, version);
    if (!pricing) return null;
    const approvedKeys = (await this.repo.approvedWorkItemIds(requestId)).map(String);
    return { book: pricing.book, input: pricing.input, changes: [], breakdown: priceScope({ book: pricing.book, input: pricing.input, approvedKeys }) };
  }

  async pickList(user: CurrentUser, query: DayQuery): Promise<PickList> {
    const organisationId = this.organisationOf(user);
    const electrician = await this.electrician(organisationId, query.electricianId);
    let visits = await this.inDrivingOrder(organisationId, electrician.id, query.date, await this.repo.visits(organisationId, query.date, query.date, electrician.id));
    if (query.siteVisitId !== undefined) {
      visits = visits.filter((v) => v.id === query.siteVisitId);
      if (!visits.length) throw new NotFoundError('No such site visit on this day');
    }
    const position = new Map(visits.map((v, i) => [v.id, i]));
    // Items in the visits' order, so that each line names its visits in driving order too.
    const items = (await this.repo.bookedItems(visits.map((v) => v.id))).sort((a, b) => position.get(a.siteVisitId)! - position.get(b.siteVisitId)!);
    const scopes = await this.scopesOf(visits.map((v) => v.requestId));
    const label = (v: EconomicsVisit) => `Site visit ${v.number} · ${v.street}`;
    const keys = await this.keysOf(organisationId);
    const pickItems: PickItem[] = items.map((item) => {
      const visit = visits.find((v) => v.id === item.siteVisitId)!;
      const scope = scopes.get(item.requestId) ?? null;
      const line = scopeLine(scope, item.id);
      const found = line ? scope!.book.entries.find((e) => e.id === line.entryId) : undefined;
      // The pick list knows entries and site conditions by their rate-book keys (spares and extras are kept by key).
      const entry = found ? { ...found, id: keys.entry(found.id) } : null;
      return { itemId: item.id, code: item.code, room: item.room, visitLabel: label(visit), entry, quantity: line?.quantity ?? item.quantity, adderIds: (line?.adderIds ?? []).map(keys.adder) };
    });
    const built = buildPickList(pickItems, await this.repo.spares(organisationId));
    const ticks = await this.repo.ticks(electrician.id, query.date);
    const lines = built.lines.map((l) => ({ ...l, isTicked: ticks.has(l.key) }));
    return {
      date: query.date,
      electrician,
      siteVisitId: query.siteVisitId ?? null,
      visits: visits.map((v) => ({ id: v.id, requestId: v.requestId, reference: v.reference, street: v.street, number: v.number, itemCount: items.filter((i) => i.siteVisitId === v.id).length })),
      lines,
      itemsWithoutMaterials: built.itemsWithoutMaterials,
      tickedCount: lines.filter((l) => l.isTicked).length,
    };
  }

  /** The day's visits in the day plan's driving order (visits the plan does not know, after, as booked). */
  private async inDrivingOrder(organisationId: number, electricianId: number, date: string, visits: EconomicsVisit[]): Promise<EconomicsVisit[]> {
    const stops = (await this.driveTime(organisationId, electricianId, date)) ?? [];
    const order = new Map(stops.map((s, i) => [s.siteVisitId, i]));
    return [...visits].sort((a, b) => (order.get(a.id) ?? stops.length) - (order.get(b.id) ?? stops.length));
  }

  /** Ticks a line of the day's pick list as loaded (or takes the tick off); answers the list. */
  async tick(user: CurrentUser, input: TickPickLine): Promise<PickList> {
    const organisationId = this.organisationOf(user);
    await this.electrician(organisationId, input.electricianId);
    const list = await this.pickList(user, { date: input.date, electricianId: input.electricianId });
    if (!list.lines.some((l) => l.key === input.lineKey)) throw new NotFoundError('No such line on this pick list');
    await this.repo.setTick(organisationId, input.electricianId, input.date, input.lineKey, input.isTicked, user.id);
    return this.pickList(user, { date: input.date, electricianId: input.electricianId });
  }

  async spares(user: CurrentUser): Promise<SpareSettingsView> {
    const organisationId = this.organisationOf(user);
    const loaded = await this.rateBooks.load(organisationId);
    const spares = await this.repo.spares(organisationId);
    return {
      entries: (loaded?.entries ?? []).map((e) => ({
        entryKey: e.key,
        name: e.name,
        hasMaterials: e.pricing.mode === 'time-and-materials' && e.pricing.materials.length > 0,
        spareUnits: spares[e.key] ?? 0,
      })),
    };
  }

  async saveSpares(user: CurrentUser, input: SpareSettings): Promise<SpareSettingsView> {
    const organisationId = this.organisationOf(user);
    const loaded = await this.rateBooks.load(organisationId);
    const keys = new Set((loaded?.entries ?? []).map((e) => e.key));
    const details = input.spares.flatMap((s, i) => (keys.has(s.entryKey) ? [] : [{ path: `spares.${i}.entryKey`, message: 'No such entry in your rate book' }]));
    if (details.length) throw new ValidationError('Name entries of your rate book', details);
    await this.db.transaction((trx) => this.repo.saveSpares(organisationId, input.spares, trx));
    return this.spares(user);
  }

  /** One electrician's day: each visit's money and minutes, and the day's totals. */
  async day(user: CurrentUser, query: DayQuery): Promise<DayEconomics> {
    const organisationId = this.organisationOf(user);
    const electrician = await this.electrician(organisationId, query.electricianId);
    const computed = await this.compute(organisationId, query.date, query.date, electrician.id);
    const loaded = await this.rateBooks.load(organisationId);
    return {
      date: query.date,
      electrician,
      hasDayPlan: computed.hasDayPlan,
      visits: computed.visits,
      totals: totalsOf(computed.visits),
      firstHourMinimumCents: loaded?.book.terms.firstHourMinimumCents ?? 0,
    };
  }

  /** A week or a month: days, visits, totals, the single-visit completion rate and minutes against the rate book. */
  async period(user: CurrentUser, query: PeriodQuery): Promise<PeriodEconomics> {
    const organisationId = this.organisationOf(user);
    if (query.electricianId !== undefined) await this.electrician(organisationId, query.electricianId);
    const computed = await this.compute(organisationId, query.from, query.to, query.electricianId);
    const dates = [...new Set(computed.visits.map((v) => v.date))].sort();
    return {
      from: query.from,
      to: query.to,
      hasDayPlan: computed.hasDayPlan,
      days: dates.map((date) => ({ date, totals: totalsOf(computed.visits.filter((v) => v.date === date)) })),
      visits: computed.visits,
      totals: totalsOf(computed.visits),
      singleVisit: singleVisitRates(computed.outcomes),
      minutesVsBook: minutesVsBook(computed.timed),
    };
  }

  private async compute(organisationId: number, from: string, to: string, electricianId?: number) {
    const visits = await this.repo.visits(organisationId, from, to, electricianId);
    const keys = await this.keysOf(organisationId);
    const corrections = await this.repo.corrections(visits.map((v) => v.id));
    const scopes = await this.scopesOf(visits.map((v) => v.requestId));
    const drive = new Map<number, number>();
    let hasDayPlan = visits.length > 0;
    for (const key of new Set(visits.map((v) => `${v.electricianId}|${v.date}`))) {
      const [id, date] = key.split('|');
      const stops = await this.driveTime(organisationId, Number(id), date);
      if (stops === null) hasDayPlan = false;
      for (const s of stops ?? []) drive.set(s.siteVisitId, s.driveMinutes);
    }
    const shares = new Map<number, Map<string, number>>();
    for (const [requestId, scope] of scopes) {
      const map = new Map<string, number>();
      for (const visit of scope?.breakdown?.visits ?? []) for (const [k, v] of lineSharesOfVisit(visit)) map.set(k, v);
      shares.set(requestId, map);
    }
    const outcomes: OutcomeRecord[] = [];
    const timed: { item: TimedItem; minutesPerUnit: number }[] = [];
    const result: VisitEconomics[] = visits.map((v) => {
      const scope = scopes.get(v.requestId) ?? null;
      const done = corrections.filter((c) => c.siteVisitId === v.id && c.outcome === 'corrected');
      const lines = done.map((c) => ({ c, line: breakdownLine(scope, c.itemId) }));
      const billedCents = done.reduce((s, c) => s + (shares.get(v.requestId)?.get(String(c.itemId)) ?? 0), 0);
      const materialsCostCents = lines.reduce((s, { line }) => s + (line?.materialsCostCents ?? 0), 0);
      const onSiteMinutes = v.startedAt && v.finishedAt ? divideRoundHalfUp(Math.max(0, v.finishedAt.getTime() - v.startedAt.getTime()), 60_000) : null;
      const driveMinutes = drive.get(v.id) ?? null;
      for (const c of corrections.filter((x) => x.siteVisitId === v.id)) {
        const outcome = outcomeOf(c, scope, v);
        if (outcome) outcomes.push(outcome);
      }
      if (onSiteMinutes !== null) {
        const items: TimedItem[] = lines.flatMap(({ c, line }) => {
          if (!line) return [];
          const entry = scope!.book.entries.find((e) => e.id === line.entryId);
          const bookMinutes = entry?.pricing.mode === 'time-and-materials' ? entry.pricing.labourMinutesPerUnit : null;
          return [{ key: String(c.itemId), code: c.code, entryKey: keys.entry(line.entryId), entryName: line.entryName, quantity: line.quantity, pricedMinutes: line.labourMinutes, bookMinutesPerUnit: bookMinutes }];
        });
        const perUnit = minutesPerUnitOnVisit(onSiteMinutes, items);
        for (const item of items) timed.push({ item, minutesPerUnit: perUnit.get(item.key)! });
      }
      return {
        siteVisitId: v.id,
        requestId: v.requestId,
        reference: v.reference,
        street: v.street,
        date: v.date,
        electrician: { id: v.electricianId, name: v.electricianName },
        correctedCount: done.length,
        billedCents,
        materialsCostCents,
        onSiteMinutes,
        driveMinutes,
        ...visitRates({ billedCents, materialsCostCents, onSiteMinutes, driveMinutes }),
      };
    });
    return { visits: result, outcomes, timed, hasDayPlan };
  }
}

/** What the economics read of a request's scope: the book and input it was priced with, the changes since, the priced breakdown. */
type PricedScope = Pick<ApprovedScope, 'book' | 'input' | 'changes' | 'breakdown'>;

/** The priced input line of an item in the approved scope (with change orders applied). */
function scopeLine(scope: PricedScope | null, itemId: number) {
  const line = breakdownLine(scope, itemId);
  if (!scope || !line) return null;
  const key = String(itemId);
  const input = scope.input.lines.find((l) => l.key === key);
  const added = [...scope.changes].reverse().find((c) => c.key === key && c.kind === 'add');
  return { entryId: line.entryId, quantity: line.quantity, adderIds: input?.adderIds ?? (added?.kind === 'add' ? (added.adderIds ?? []) : []) };
}

function breakdownLine(scope: PricedScope | null, itemId: number): LineBreakdown | null {
  const key = String(itemId);
  for (const visit of scope?.breakdown?.visits ?? []) {
    const line = visit.lines.find((l) => l.key === key);
    if (line) return line;
  }
  return null;
}

/**
 * The item's first-visit outcome: finished on the first visit only when corrected, recorded so, and
 * untouched by a change order. Declined on site is the seller's choice, not a return: left out.
 */
function outcomeOf(c: VisitCorrection, scope: PricedScope | null, v: EconomicsVisit): OutcomeRecord | null {
  if (c.outcome === 'declined-on-site') return null;
  const changed = scope?.changes.some((ch) => ch.key === String(c.itemId)) ?? false;
  const isFirstVisit = c.outcome === 'corrected' && c.isFirstVisit && !changed;
  return {
    code: c.code,
    electricianName: v.electricianName,
    month: v.date.slice(0, 7),
    isFirstVisit,
    returnCause: isFirstVisit ? null : (c.returnCause ?? (changed ? 'change-order' : 'other')),
  };
}
