import { createHash, randomBytes } from 'node:crypto';
import {
  addDays,
  clockOf,
  effectiveTimeZone,
  driveMinutes,
  minutesOfDay,
  todayIn,
  USUAL_MAX_DRIVE_MINUTES,
  type BookSuggestionSchema,
  type CurrentUser,
  type DayPlan,
  type DayPlanSettings,
  type DayPlanSuggestion,
  type MoveVisitResult,
  type MoveVisitSchema,
  type SetPropertyLocationSchema,
  type UpdateDayPlanSettingsSchema,
  type WeekPlan,
} from '@cc/shared';
import type { z } from 'zod';
import type { Db } from '../db/knex';
import { inTransaction } from '../db/transaction';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import type { SiteVisitRepository } from '../visits/site-visit.repository';
import { assertBookable, type VisitsService } from '../visits/visits.service';
import type { ProofMessages } from '../work/proof-messages';
import { assertMayAct, requestWithActors } from '../work/request-actors';
import { visitsCalendar } from './calendar';
import type { DayPlanRepository, PlannedVisitRecord, StoredDayPlanSettings } from './day-plan.repository';
import { addressOf, buildDayPlan, onSiteMinutes, placeOf, planDay, shopPlace } from './plan-day';

const MAX_SUGGESTIONS = 5;
/** A suggested job is booked with a window of this many minutes from its planned arrival (rounded down to the half hour). */
const SUGGESTED_WINDOW_MINUTES = 120;
const FEED_DAYS_BACK = 30;
const FEED_DAYS_AHEAD = 366;

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** The office side of planning days: the plan, the week, moving visits, settings, locations and calendars. */
export class DayPlanService {
  constructor(
    private readonly db: Db,
    private readonly plans: DayPlanRepository,
    private readonly siteVisits: SiteVisitRepository,
    private readonly access: RequestsService,
    private readonly visits: VisitsService,
    private readonly messages: ProofMessages,
    private readonly publicUrl: string,
  ) {}

  /** The organisation whose days `user` plans: any user of a contractor organisation (403 for other roles). */
  private organisationOf(user: CurrentUser): number {
    if (user.role !== 'contractor' || user.organisationId === null) throw new ForbiddenError('Only a contractor plans visits');
    return user.organisationId;
  }

  private async electricianOf(organisationId: number, electricianId: number): Promise<{ id: number; name: string }> {
    const electrician = (await this.plans.electricians(organisationId)).find((e) => e.id === electricianId);
    if (!electrician) throw new NotFoundError('No such electrician in your organisation');
    return electrician;
  }

  /** The people of the organisation who can be sent on a visit. */
  async electricians(user: CurrentUser): Promise<{ id: number; name: string }[]> {
    return this.plans.electricians(this.organisationOf(user));
  }

  async settings(user: CurrentUser): Promise<DayPlanSettings> {
    const settings = await this.plans.settings(this.organisationOf(user));
    return { ...settings, isShopLocated: shopPlace(settings) !== null, effectiveTimeZone: effectiveTimeZone(settings.timeZone, settings.shop.state) };
  }

  async saveSettings(user: CurrentUser, input: z.output<typeof UpdateDayPlanSettingsSchema>): Promise<DayPlanSettings> {
    const organisationId = this.organisationOf(user);
    const { version, ...settings } = input;
    const saved = await inTransaction(this.db, (trx) => this.plans.saveSettings(organisationId, version, settings, user.id, trx));
    if (!saved) throw new ConflictError('Someone saved the settings meanwhile. Reload and try again.');
    return this.settings(user);
  }

  async day(user: CurrentUser, date: string, electricianId: number): Promise<DayPlan> {
    const organisationId = this.organisationOf(user);
    await this.electricianOf(organisationId, electricianId);
    const plan = await planDay(this.db, organisationId, electricianId, date);
    return { ...plan, suggestions: await this.suggestions(organisationId, plan) };
  }

  /**
   * Approved jobs without a visit that fit the day without making it overflow, within the usual drive
   * of the route (common practice: 20–30 minutes), least extra driving first.
   */
  private async suggestions(organisationId: number, plan: DayPlan): Promise<DayPlanSuggestion[]> {
    // Nothing can be booked on a past day (the booking rule), so nothing is suggested for one.
    const settings = await this.plans.settings(organisationId);
    if (plan.overflowMinutes > 0 || plan.date < todayIn(effectiveTimeZone(settings.timeZone, settings.shop.state))) return [];
    const shop = shopPlace(settings);
    if (!shop) return [];
    const visits = await this.plans.visits(organisationId, plan.date, plan.date, plan.electrician.id);
    const route = [shop, ...plan.stops.map((s) => s.place).filter((p) => p !== null)];
    const found: DayPlanSuggestion[] = [];
    for (const job of await this.plans.unscheduledJobs(organisationId)) {
      const place = placeOf(job);
      if (!place || Math.min(...route.map((p) => driveMinutes(p, place, settings))) > USUAL_MAX_DRIVE_MINUTES) continue;
      const trial = this.trialPlan(settings, plan, visits, job);
      if (trial.overflowMinutes > 0 || trial.stops.some((s) => s.isLate)) continue;
      const stop = trial.stops.find((s) => s.visitId === 0)!;
      found.push({
        requestId: job.requestId,
        address: addressOf(job),
        closingDate: job.closingDate,
        itemCount: job.itemCount,
        onSiteMinutes: onSiteMinutes(settings, job),
        detourMinutes: trial.totalDriveMinutes - plan.totalDriveMinutes,
        ...windowFrom(stop.arrival, settings.dayEnd),
      });
    }
    return found.sort((a, b) => a.detourMinutes - b.detourMinutes || a.closingDate.localeCompare(b.closingDate)).slice(0, MAX_SUGGESTIONS);
  }

  /** The day as it would be with `job` added (as visit 0, with the whole working day as its window). */
  private trialPlan(settings: StoredDayPlanSettings, plan: DayPlan, visits: readonly PlannedVisitRecord[], job: Awaited<ReturnType<DayPlanRepository['unscheduledJobs']>>[number]): DayPlan {
    const trialVisit: PlannedVisitRecord = {
      ...job,
      visitId: 0,
      visitNumber: 0,
      date: plan.date,
      electricianId: plan.electrician.id,
      arrivalFrom: settings.dayStart,
      arrivalTo: settings.dayEnd,
      status: 'booked',
      version: 0,
    };
    return buildDayPlan(settings, plan.electrician, plan.date, [...visits, trialVisit]);
  }

  /** Books a suggested job on the day: the usual visit booking, with a window where it fits the route. */
  async bookSuggestion(user: CurrentUser, input: z.output<typeof BookSuggestionSchema>): Promise<DayPlan> {
    const organisationId = this.organisationOf(user);
    await this.electricianOf(organisationId, input.electricianId);
    if (!(await this.plans.isRequestOf(organisationId, input.requestId))) throw new NotFoundError('No such request');
    assertBookable(input, await this.plans.timeZone(organisationId));
    const plan = await planDay(this.db, organisationId, input.electricianId, input.date);
    const job = (await this.plans.unscheduledJobs(organisationId)).find((j) => j.requestId === input.requestId);
    if (!job) throw new ConflictError('This job has no approved items waiting for a visit any more.');
    const settings = await this.plans.settings(organisationId);
    const visits = await this.plans.visits(organisationId, input.date, input.date, input.electricianId);
    const stop = this.trialPlan(settings, plan, visits, job).stops.find((s) => s.visitId === 0)!;
    await this.visits.book(user, input.requestId, { date: input.date, electricianId: input.electricianId, accessNotes: '', quotedVisitKey: null, ...windowFrom(stop.arrival, settings.dayEnd) });
    return this.day(user, input.date, input.electricianId);
  }

  async week(user: CurrentUser, start: string): Promise<WeekPlan> {
    const organisationId = this.organisationOf(user);
    const dates = Array.from({ length: 7 }, (_, i) => addDays(start, i));
    const electricians = await this.plans.electricians(organisationId);
    const settings = await this.plans.settings(organisationId);
    const visits = await this.plans.visits(organisationId, dates[0], dates[6]);
    const days = electricians.flatMap((electrician) =>
      dates.map((date) => {
        const plan = buildDayPlan(settings, electrician, date, visits.filter((v) => v.electricianId === electrician.id && v.date === date));
        return {
          date,
          electricianId: electrician.id,
          visits: plan.stops.map((s) => ({ visitId: s.visitId, requestId: s.requestId, visitNumber: s.visitNumber, address: s.address, arrivalFrom: s.arrivalFrom, arrivalTo: s.arrivalTo, status: s.status })),
          driveMinutes: plan.totalDriveMinutes,
          onSiteMinutes: plan.totalOnSiteMinutes,
          overflowMinutes: plan.overflowMinutes,
        };
      }),
    );
    return { start, dates, electricians, days };
  }

  /** Moves a booked visit to another day or electrician (the flow table's `book-visit` right), and plans both days again. */
  async move(user: CurrentUser, visitId: number, input: z.output<typeof MoveVisitSchema>): Promise<MoveVisitResult> {
    const organisationId = this.organisationOf(user);
    const visit = await this.plans.findVisit(organisationId, visitId);
    if (!visit) throw new NotFoundError('No such site visit');
    const { request, actors } = await requestWithActors(this.access, user, visit.requestId);
    assertMayAct(actors, 'book-visit', request.status, 'Moving a visit');
    if (!(await this.plans.electricians(organisationId)).some((e) => e.id === input.electricianId)) {
      throw new ValidationError('Choose one of your electricians', [{ path: 'electricianId', message: 'Choose a person of your organisation' }]);
    }
    const window = { arrivalFrom: input.arrivalFrom ?? visit.arrivalFrom, arrivalTo: input.arrivalTo ?? visit.arrivalTo };
    assertBookable({ date: input.date, arrivalFrom: window.arrivalFrom }, await this.plans.timeZone(organisationId));
    if (window.arrivalTo <= window.arrivalFrom) throw new ValidationError('The window ends after it starts', [{ path: 'arrivalTo', message: 'The window ends after it starts' }]);
    await inTransaction(this.db, async (trx) => {
      const locked = await this.plans.findVisit(organisationId, visitId, trx);
      if (!locked || locked.status !== 'booked') throw new ConflictError('Only a visit not yet started can be moved');
      await this.siteVisits.reschedule(visitId, { date: input.date, electricianId: input.electricianId, ...window }, trx);
      // The seller's side hears the new day or window, written to the outbox with the move itself.
      if (input.date !== visit.date || window.arrivalFrom !== visit.arrivalFrom || window.arrivalTo !== visit.arrivalTo) {
        const previous = { date: visit.date, arrivalFrom: visit.arrivalFrom, arrivalTo: visit.arrivalTo };
        await this.messages.visitScheduled(trx, { requestId: visit.requestId, visitNumber: visit.number, date: input.date, ...window, by: user.id, previous });
      }
      // The electricians hear of it too: the one it was booked for and, when it changes hands, the one who takes it.
      await this.messages.visitAssigned(trx, {
        requestId: visit.requestId,
        visitId,
        visitNumber: visit.number,
        before: { electricianId: locked.electricianId, date: locked.date, arrivalFrom: locked.arrivalFrom, arrivalTo: locked.arrivalTo },
        after: { electricianId: input.electricianId, date: input.date, ...window },
        by: user.id,
      });
    });
    return {
      from: await this.day(user, visit.date, visit.electricianId),
      to: await this.day(user, input.date, input.electricianId),
    };
  }

  /** Coordinates for a property (a dropped pin or typed in), or null and null to go back to its ZIP code's centre. */
  async setLocation(user: CurrentUser, requestId: number, input: z.output<typeof SetPropertyLocationSchema>): Promise<void> {
    this.organisationOf(user);
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    assertMayAct(actors, 'book-visit', request.status, 'Placing the property for a visit');
    await this.plans.setPin(requestId, input.latitude, input.longitude);
  }

  /** One visit as a calendar file. */
  async visitCalendar(user: CurrentUser, visitId: number): Promise<string> {
    const organisationId = this.organisationOf(user);
    const visit = await this.plans.findVisit(organisationId, visitId);
    if (!visit) throw new NotFoundError('No such site visit');
    const electrician = await this.electricianOf(organisationId, visit.electricianId);
    const record = (await this.plans.calendarVisits(organisationId, visit.date, visit.date, visit.electricianId)).find((v) => v.visitId === visitId);
    if (!record) throw new NotFoundError('No such site visit');
    return visitsCalendar([record], () => electrician.name, await this.plans.timeZone(organisationId));
  }

  /** A new secret feed address for an electrician's visits; the previous one stops working. */
  async renewFeed(user: CurrentUser, electricianId: number): Promise<{ url: string }> {
    const organisationId = this.organisationOf(user);
    await this.electricianOf(organisationId, electricianId);
    const token = randomBytes(24).toString('base64url');
    await this.plans.replaceFeedToken(electricianId, hashToken(token), user.id);
    return { url: `${this.publicUrl}/api/calendar/${token}.ics` };
  }

  /** The feed of the electrician a token belongs to (404 for any other token). */
  async feed(token: string): Promise<string> {
    if (!/^[A-Za-z0-9_-]{32}$/.test(token)) throw new NotFoundError('No such calendar');
    const owner = await this.plans.feedOwner(hashToken(token));
    if (!owner) throw new NotFoundError('No such calendar');
    const zone = await this.plans.timeZone(owner.organisationId);
    const today = todayIn(zone);
    // Cancelled visits stay in the feed as cancelled events: a calendar that had the visit drops it.
    const visits = await this.plans.calendarVisits(owner.organisationId, addDays(today, -FEED_DAYS_BACK), addDays(today, FEED_DAYS_AHEAD), owner.id);
    return visitsCalendar(visits, () => owner.name, zone, `Site visits · ${owner.name}`);
  }
}

/** An arrival window that starts at the half hour at or before `arrival` and lasts two hours (within the day). */
function windowFrom(arrival: string, dayEnd: string): { arrivalFrom: string; arrivalTo: string } {
  const from = Math.floor(minutesOfDay(arrival) / 30) * 30;
  const to = Math.min(from + SUGGESTED_WINDOW_MINUTES, Math.max(from + 30, minutesOfDay(dayEnd)));
  return { arrivalFrom: clockOf(Math.min(from, 23 * 60)), arrivalTo: clockOf(Math.min(to, 23 * 60 + 59)) };
}
