import { closingProgress, mayAct, mayMoveRequest, readingKindsFor, type CurrentUser, type WorkOverview } from '@cc/shared';
import type { CorrectionRepository } from '../corrections/correction.repository';
import { toCorrectionDto } from '../corrections/corrections.service';
import type { LetterRepository } from '../letters/letter.repository';
import type { LettersService } from '../letters/letters.service';
import type { RequestsService } from '../requests/requests.service';
import type { SiteVisitRepository } from '../visits/site-visit.repository';
import { toSiteVisitDto } from '../visits/visits.service';
import { requestWithActors } from './request-actors';
import type { WorkItemRepository } from './work-item.repository';

/** Item states that count as resolved for closing-date tracking: every outcome but "not accepted". */
const RESOLVED = ['done', 'not-done', 'accepted'];

/** The proof side of one request, as one person may see it. */
export class WorkService {
  constructor(
    private readonly access: RequestsService,
    private readonly items: WorkItemRepository,
    private readonly visits: SiteVisitRepository,
    private readonly corrections: CorrectionRepository,
    private readonly letterRecords: LetterRepository,
    private readonly letters: LettersService,
    private readonly atRiskBusinessDays: number,
  ) {}

  async overview(user: CurrentUser, requestId: number, today = new Date().toISOString().slice(0, 10)): Promise<WorkOverview> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    const status = request.status;
    const [items, visits, corrections, letters, reviews] = await Promise.all([
      this.items.listForRequest(requestId),
      this.visits.listForRequest(requestId),
      this.corrections.listForRequest(requestId),
      this.letterRecords.listForRequest(requestId),
      this.letterRecords.reviews(requestId),
    ]);
    const canBook = mayAct(actors, 'book-visit', status);
    const lastReview = reviews.at(-1);
    return {
      requestId,
      reference: request.reference,
      street: request.street,
      status,
      closingDate: request.closingDate,
      closing: {
        ...closingProgress({
          closingDate: request.closingDate,
          today,
          approvedCount: items.length,
          resolvedCount: items.filter((i) => RESOLVED.includes(i.status)).length,
          atRiskBusinessDays: this.atRiskBusinessDays,
        }),
        atRiskBusinessDays: this.atRiskBusinessDays,
      },
      can: {
        bookVisit: canBook,
        recordCorrections: mayAct(actors, 'record-correction', status),
        finishVisit: mayAct(actors, 'finish-visit', status),
        cancelVisit: mayAct(actors, 'cancel-visit', status),
        issueLetter: mayMoveRequest(actors, 'issue-letter', status),
        review: mayMoveRequest(actors, 'accept-proof', status),
        resume: mayMoveRequest(actors, 'resume-work', status),
        seeAccessNotes: mayAct(actors, 'see-access-notes', status),
      },
      quotedVisitKeys: [...new Set(items.map((i) => i.quotedVisitKey))],
      electricians: canBook && request.contractor ? await this.visits.electricians(request.contractor.id) : [],
      visits: visits.map((v) => toSiteVisitDto(v, items, actors, status)),
      items: items.map((i) => {
        const correction = corrections.find((c) => c.itemId === i.id);
        const reason = i.status === 'not-accepted' ? (lastReview?.items.find((x) => x.itemId === i.id)?.reason ?? null) : null;
        return {
          id: i.id,
          code: i.code,
          room: i.room,
          location: i.location,
          quantity: i.quantity,
          necRefs: i.necRefs,
          status: i.status,
          quotedVisitKey: i.quotedVisitKey,
          siteVisitId: i.siteVisitId,
          readingKinds: [...readingKindsFor(i.code)],
          correction: correction ? toCorrectionDto(requestId, correction) : null,
          notAcceptedReason: reason,
        };
      }),
      letters: letters.map((l) => this.letters.toDto(l, letters)),
      reviews: reviews.map((r) => ({
        letterRevision: letters.find((l) => l.id === r.letterId)?.revision ?? 0,
        decision: r.decision,
        note: r.note,
        decidedByName: r.decidedByName,
        decidedAt: r.decidedAt.toISOString(),
      })),
    };
  }
}
