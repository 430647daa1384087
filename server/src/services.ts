import type { Config } from './config/config';
import type { Db } from './db/knex';
import { ItemPricingRepository } from './pricing/item-pricing.repository';
import { LineItemRepository } from './intake/line-item.repository';
import { OrganisationRepository } from './organisations/organisation.repository';
import { QuoteRepository } from './quotes/quote.repository';
import { RateBookRepository } from './rate-book/rate-book.repository';
import { ReportFileRepository } from './intake/report-file.repository';
import { RequestRepository } from './requests/request.repository';
import { UserRepository } from './auth/user.repository';
import { AdminService } from './admin/admin.service';
import { AuthService } from './auth/auth.service';
import { BallparkService } from './pricing/ballpark.service';
import { LocalFileStorage } from './integrations/storage/local-file-storage';
import { InvitationsService } from './invitations/invitations.service';
import { LineItemsService } from './intake/line-items.service';
import { Passwords } from './auth/passwords';
import { PricingService } from './pricing/pricing.service';
import { QuotesService } from './quotes/quotes.service';
import { RateBookService } from './rate-book/rate-book.service';
import { readPdfPages } from './intake/report-intake';
import { ReportIntakeService } from './intake/report-intake.service';
import { RequestsService } from './requests/requests.service';
import { FlowService } from './flow/flow.service';
import { CorrectionRepository } from './corrections/correction.repository';
import { CorrectionsService } from './corrections/corrections.service';
import { LetterRepository } from './letters/letter.repository';
import { LettersService } from './letters/letters.service';
import { SiteVisitRepository } from './visits/site-visit.repository';
import { VisitsService } from './visits/visits.service';
import { noProofMessages, type ProofMessages } from './work/proof-messages';
import { WorkItemRepository } from './work/work-item.repository';
import { WorkService } from './work/work.service';

/** Builds every repository and service of the app from one database handle and the config. */
export function createServices(db: Db, config: Config, proofMessages: ProofMessages = noProofMessages) {
  const users = new UserRepository(db);
  const organisations = new OrganisationRepository(db);
  const requests = new RequestRepository(db);
  const items = new LineItemRepository(db);
  const reports = new ReportFileRepository(db);
  const passwords = new Passwords(config.bcryptRounds);
  const storage = new LocalFileStorage(config.storageDir);
  const rateBooks = new RateBookRepository(db);
  const itemPricing = new ItemPricingRepository(db);
  const quotes = new QuoteRepository(db);
  // Every move of a request or an item goes through the flow service (listeners: later the notification outbox).
  const flow = new FlowService(requests, items);
  const requestsService = new RequestsService(db, requests, users, organisations, flow, items, itemPricing, config.publicUrl, config.atRiskBusinessDays);
  const rateBookService = new RateBookService(db, rateBooks, organisations);
  const pricingService = new PricingService(db, requestsService, rateBookService, itemPricing, items, quotes, flow);
  const workItems = new WorkItemRepository(db);
  const siteVisits = new SiteVisitRepository(db);
  const corrections = new CorrectionRepository(db);
  const letterRecords = new LetterRepository(db);
  const letters = new LettersService(db, requestsService, flow, organisations, workItems, corrections, letterRecords, storage, proofMessages, config.publicUrl);
  return {
    repositories: { users, organisations, requests, items, reports },
    flow,
    storage,
    auth: new AuthService(users, passwords),
    admin: new AdminService(users, organisations, passwords),
    requests: requestsService,
    invitations: new InvitationsService(db, requests, users, passwords),
    reportIntake: new ReportIntakeService(db, requestsService, requests, reports, items, storage, readPdfPages, flow),
    lineItems: new LineItemsService(db, requestsService, items, reports, flow),
    rateBook: rateBookService,
    pricing: pricingService,
    ballpark: new BallparkService(requestsService, rateBookService, itemPricing),
    quotes: new QuotesService(db, requestsService, pricingService, rateBookService, rateBooks, requests, organisations, itemPricing, quotes, flow),
    visits: new VisitsService(db, requestsService, flow, siteVisits, workItems, proofMessages),
    corrections: new CorrectionsService(db, requestsService, flow, workItems, siteVisits, corrections, storage, proofMessages),
    letters,
    work: new WorkService(requestsService, workItems, siteVisits, corrections, letterRecords, letters, config.atRiskBusinessDays),
  };
}

export type Services = ReturnType<typeof createServices>;
