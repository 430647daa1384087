import type pg from 'pg';
import type { Config } from './config/config';
import type { Db } from './db/knex';
import { ItemPricingRepository } from './pricing/item-pricing.repository';
import { LineItemRepository } from './intake/line-item.repository';
import { OrganisationRepository } from './organisations/organisation.repository';
import { QuoteRepository } from './quotes/quote.repository';
import { RateBookRepository } from './rate-book/rate-book.repository';
import { ReportFileRepository } from './intake/report-file.repository';
import { LIST_COUNT_CAPS, RequestRepository } from './requests/request.repository';
import { UserRepository } from './auth/user.repository';
import { SessionRepository } from './auth/session.repository';
import { NO_SESSION_CACHE, type SessionInvalidation } from './auth/session-cache';
import { AdminService } from './admin/admin.service';
import { AuthService } from './auth/auth.service';
import { BallparkService } from './pricing/ballpark.service';
import { LocalFileStorage } from './integrations/storage/local-file-storage';
import { ReportReader } from './integrations/report-reader/report-reader';
import { InvitationsService } from './invitations/invitations.service';
import { LineItemsService } from './intake/line-items.service';
import { Passwords } from './auth/passwords';
import { PricingService } from './pricing/pricing.service';
import { QuotesService } from './quotes/quotes.service';
import { RateBookService } from './rate-book/rate-book.service';
import { ReportIntakeService } from './intake/report-intake.service';
import { RequestsService } from './requests/requests.service';
import { FlowService } from './flow/flow.service';
import { createSellerSideServices } from './approvals/seller-side';
import { CorrectionRepository } from './corrections/correction.repository';
import { CorrectionsService } from './corrections/corrections.service';
import { LetterRepository } from './letters/letter.repository';
import { LettersService } from './letters/letters.service';
import { SiteVisitRepository } from './visits/site-visit.repository';
import { VisitsService } from './visits/visits.service';
import { WorkItemRepository } from './work/work-item.repository';
import { WorkService } from './work/work.service';
import { ActivityRepository } from './activity/activity.repository';
import { ActivityService } from './activity/activity.service';
import { DashboardsRepository } from './dashboards/dashboards.repository';
import { DashboardsService } from './dashboards/dashboards.service';
import { CapturedMailRepository } from './integrations/mail/captured-mail.repository';
import { DailyDigest } from './notifications/daily-digest';
import { createFlowListener } from './notifications/flow-listener';
import { NotificationsService } from './notifications/notifications.service';
import { OutboxRepository } from './notifications/outbox.repository';
import { proofMessagesByMail } from './notifications/proof-message-mail';
import { sellerNoticesByMail } from './notifications/seller-notice-mail';
import { PreferencesRepository } from './notifications/preferences.repository';
import { DayPlanRepository } from './day-plan/day-plan.repository';
import { DayPlanService } from './day-plan/day-plan.service';
import { ApprovalRepository } from './approvals/approval.repository';
import { ApprovedScopeReader } from './approvals/approved-scope';
import { ChangeOrderRepository } from './change-orders/change-order.repository';
import { EconomicsRepository } from './economics/economics.repository';
import { EconomicsService } from './economics/economics.service';
import { IntakePhotosService } from './economics/intake-photos';
import { dayPlanDriveTime } from './economics/drive-time';

/** Builds every repository and service of the app from one database handle and the config. */
export function createServices(db: Db, config: Config, readPool: pg.Pool | null = null, sessions: SessionInvalidation = NO_SESSION_CACHE) {
  const users = new UserRepository(db);
  const organisations = new OrganisationRepository(db);
  const requests = new RequestRepository(db, LIST_COUNT_CAPS, readPool);
  const items = new LineItemRepository(db, readPool);
  const reports = new ReportFileRepository(db);
  const passwords = new Passwords(config.bcryptRounds);
  const storage = new LocalFileStorage(config.storageDir);
  const reportReader = new ReportReader({ ...config.reportReader, maxQueue: 8 * config.reportReader.maxThreads });
  const rateBooks = new RateBookRepository(db);
  const itemPricing = new ItemPricingRepository(db);
  const quotes = new QuoteRepository(db);
  // Every move of a request or an item goes through the flow service; its listener writes the timeline
  // entries and the outbox rows of the move in the move's transaction.
  const flow = new FlowService(requests, items);
  const activity = new ActivityRepository(db);
  const outbox = new OutboxRepository(db);
  const notifications = new NotificationsService(db, outbox, new PreferencesRepository(db), activity, {
    publicUrl: config.publicUrl,
    from: config.mail.from,
    secret: config.sessionSecret,
    gatherItemMessagesMs: config.mail.gatherItemMessagesMs,
  });
  flow.listen(createFlowListener(activity, notifications));
  // The seller's side and the proof side tell people through the same notify(), in their transactions.
  const proofMessages = proofMessagesByMail(notifications);
  const requestsService = new RequestsService(db, requests, users, organisations, flow, items, itemPricing, config.publicUrl, notifications, activity, config.atRiskBusinessDays);
  const rateBookService = new RateBookService(db, rateBooks, organisations);
  const pricingService = new PricingService(db, requestsService, rateBookService, itemPricing, items, quotes, flow);
  const dayPlans = new DayPlanRepository(db);
  /** An organisation's time zone: where its days (bookings, how long a quote holds) begin and end. */
  const timeZoneOf = (organisationId: number) => dayPlans.timeZone(organisationId);
  const quotesService = new QuotesService(db, requestsService, pricingService, rateBookService, rateBooks, requests, organisations, itemPricing, quotes, flow, timeZoneOf);
  const workItems = new WorkItemRepository(db);
  const siteVisits = new SiteVisitRepository(db);
  const corrections = new CorrectionRepository(db);
  const letterRecords = new LetterRepository(db);
  const visits = new VisitsService(db, requestsService, flow, siteVisits, workItems, proofMessages, timeZoneOf);
  const letters = new LettersService(db, requestsService, flow, organisations, workItems, corrections, letterRecords, storage, proofMessages, config.publicUrl, siteVisits);
  return {
    repositories: { users, organisations, requests, items, reports, activity },
    flow,
    notifications,
    outbox,
    digest: new DailyDigest(db, notifications, outbox, config.atRiskBusinessDays),
    /** The development mailbox, while mail goes to the local sink. */
    mailbox: config.mail.smtp ? null : new CapturedMailRepository(db),
    activity: new ActivityService(requestsService, activity),
    dashboards: new DashboardsService(new DashboardsRepository(db)),
    storage,
    reportReader,
    auth: new AuthService(users, passwords, new SessionRepository(db), sessions),
    admin: new AdminService(users, organisations, passwords, db, sessions),
    requests: requestsService,
    invitations: new InvitationsService(db, requests, users, passwords),
    reportIntake: new ReportIntakeService(db, requestsService, requests, reports, items, storage, reportReader, flow, notifications),
    lineItems: new LineItemsService(db, requestsService, items, reports, flow, activity),
    rateBook: rateBookService,
    pricing: pricingService,
    ballpark: new BallparkService(requestsService, rateBookService, itemPricing),
    quotes: quotesService,
    sellerSide: createSellerSideServices(db, config, { requests: requestsService, quotes: quotesService, requestRows: requests, quoteRows: quotes, flow, timeZoneOf }, sellerNoticesByMail(notifications)),
    visits,
    dayPlan: new DayPlanService(db, dayPlans, siteVisits, requestsService, visits, proofMessages, config.publicUrl),
    corrections: new CorrectionsService(db, requestsService, flow, workItems, siteVisits, corrections, storage, proofMessages),
    letters,
    work: new WorkService(requestsService, workItems, siteVisits, corrections, letterRecords, letters, config.atRiskBusinessDays),
    economics: new EconomicsService(db, new EconomicsRepository(db), new ApprovedScopeReader(new ApprovalRepository(db), new ChangeOrderRepository(db)), new ApprovalRepository(db), rateBookService, dayPlanDriveTime(db)),
    intakePhotos: new IntakePhotosService(db, requestsService, storage),
  };
}

export type Services = ReturnType<typeof createServices>;
