import { createHash, randomInt } from 'node:crypto';
import {
  NOT_A_PDF_MESSAGE,
  mayMoveItem,
  mayMoveRequest,
  PARTY_ROLE_LABELS,
  requestReference,
  type CompletionLetter,
  type CurrentUser,
  type LetterVerification,
  type PdfCheck,
  IssueLetterSchema,
  ProofReviewSchema,
} from '@cc/shared';
import type { z } from 'zod';
import type { Db } from '../db/knex';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import type { FlowService } from '../flow/flow.service';
import type { FileStorage } from '../integrations/storage/file-storage';
import { StagedFiles } from '../integrations/storage/staged-files';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import type { CorrectionRepository } from '../corrections/correction.repository';
import { toCorrectionDto } from '../corrections/corrections.service';
import { paymentStatusOf } from '../work/payment-status';
import type { ProofMessages } from '../work/proof-messages';
import { requestWithActors } from '../work/request-actors';
import { moveItem, moveRequest } from '../work/request-moves';
import type { WorkItemRepository } from '../work/work-item.repository';
import { renderLetterPdf, type LetterContent } from './letter-pdf';
import type { LetterRecord, LetterRepository } from './letter.repository';
import type { SiteVisitRepository } from '../visits/site-visit.repository';

const CODE_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';
const CODE_LENGTH = 10;
export const VERIFICATION_CODE = new RegExp(`^[${CODE_ALPHABET}]{${CODE_LENGTH}}$`);

function newVerificationCode(): string {
  return Array.from({ length: CODE_LENGTH }, () => CODE_ALPHABET[randomInt(CODE_ALPHABET.length)]).join('');
}

/**
 * The inspection report the letter answers: the report files uploaded to the request (name, upload
 * date), with the inspector where named; never the request's own reference.
 */
export function reportReferenceOf(files: readonly { name: string; kind: string; uploadedOn: string }[], inspectorName: string | null): string {
  if (!files.length) return `No report file was uploaded to Closing Circuit${inspectorName ? ` (inspection by ${inspectorName})` : ''}; the items are those listed below.`;
  return files.map((f) => `${f.kind === 'pasted' ? 'Pasted report text' : f.name} (added ${f.uploadedOn})`).join('; ') + (inspectorName ? `; inspection by ${inspectorName}` : '');
}

const sha256Of = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
const dateOf = (d: Date) => d.toISOString().slice(0, 10);

/** What the public check says of a PDF that is no issued letter, byte for byte. */
export const UNKNOWN_PDF_MESSAGE = 'This PDF is not a completion letter issued through Closing Circuit (or it was changed after issue).';
/** Whether bytes start like a PDF file (ISO 32000-1:2008, 7.5.2: the header `%PDF-` in the first 1024 bytes). */
const isPdf = (bytes: Buffer): boolean => bytes.subarray(0, 1024).includes('%PDF-');

/** Completion letters: issuing revisions, downloading them, the public verification and the inspector's review. */
export class LettersService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly flow: FlowService,
    private readonly organisations: OrganisationRepository,
    private readonly items: WorkItemRepository,
    private readonly corrections: CorrectionRepository,
    private readonly letters: LetterRepository,
    private readonly storage: FileStorage,
    private readonly messages: ProofMessages,
    private readonly publicUrl: string,
    private readonly siteVisits: SiteVisitRepository,
  ) {}

  verificationUrl(code: string): string {
    return `${this.publicUrl}/verify/${code}`;
  }

  /** Issues the next revision once every approved item has an outcome; the PDF is stored with its SHA-256. */
  async issue(user: CurrentUser, requestId: number, input: z.output<typeof IssueLetterSchema>): Promise<CompletionLetter> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    if (!mayMoveRequest(actors, 'issue-letter', request.status)) {
      if (!actors.includes('contractor')) throw new ForbiddenError('Only the contractor issues the completion letter');
      throw new ConflictError('The letter is issued once every approved item has an outcome');
    }
    const org = await this.organisations.findById(request.contractor!.id);
    if (!org) throw new NotFoundError('No such contractor');
    const revision = await StagedFiles.around(this.storage, (files) =>
      this.db.transaction(async (trx) => {
        const locked = await this.items.lockRequest(requestId, trx);
        if (!locked || locked.status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
        const previous = await this.letters.listForRequest(requestId, trx);
        const revision = (previous.at(-1)?.revision ?? 0) + 1;
        const number = `CL-${requestReference(requestId).slice(3)}`;
        const code = newVerificationCode();
        const items = await this.items.listForRequest(requestId, trx);
        const corrections = await this.corrections.listForRequest(requestId, trx);
        const photos = new Map<number, Buffer>();
        for (const c of corrections) for (const p of c.photos) photos.set(p.id, await this.storage.get(p.storageKey));
        const issuedAt = new Date();
        const content: LetterContent = {
          number,
          revision,
          issuedOn: dateOf(issuedAt),
          requestReference: request.reference,
          contractor: {
            name: org.name,
            licence: org.licenceNumber ? `Licence ${org.licenceNumber}${org.licenceState ? ` (${org.licenceState})` : ''}${org.licenceClass ? ` · ${org.licenceClass}` : ''}` : 'Licence number not on file',
            contact: [org.address, org.phone].filter(Boolean).join(' · '),
          },
          property: `${request.street}, ${request.city}, ${request.state} ${request.zip}`,
          parties: request.parties.filter((p) => p.name).map((p) => ({ role: PARTY_ROLE_LABELS[p.role], name: p.name! })),
          reportReference: reportReferenceOf(await this.letters.reportFiles(requestId, trx), request.parties.find((p) => p.role === 'inspector')?.name ?? null),
          items: items.map((i) => {
            const c = corrections.find((x) => x.itemId === i.id);
            return { code: i.code, room: i.room, location: i.location, quantity: i.quantity, necRefs: i.necRefs, correction: c ? toCorrectionDto(requestId, c) : null };
          }),
          declinedItems: (await this.items.listDeclined(requestId, trx)).map((i) => ({ code: i.code, room: i.room, location: i.location, quantity: i.quantity })),
          permit: input.permitNumber ? `Permit number ${input.permitNumber}.` : 'No permit was required for this work under the local rules where the property is.',
          warranty: input.warranty || (await this.letters.quoteWarranty(requestId, trx)) || 'Workmanship is warranted for one year from the date of this letter; parts carry their manufacturers’ warranties.',
          paymentStatus: await paymentStatusOf(trx, requestId),
          signatureName: input.signatureName,
          verificationUrl: this.verificationUrl(code),
          verificationCode: code,
          photos,
        };
        const pdf = await renderLetterPdf(content);
        const sha256 = sha256Of(pdf);
        const storageKey = `letter-${sha256}.pdf`;
        await files.stage(storageKey, pdf);
        await this.letters.insert(
          { requestId, number, revision, verificationCode: code, sha256, storageKey, itemCount: items.length, permitNumber: input.permitNumber || null, issuedBy: user.id, issuedAt },
          trx,
        );
        // The letter says the work is done: a visit still on site ends with it (nobody is left working).
        const finished = await this.siteVisits.finishStarted(requestId, issuedAt, trx);
        const visitsNote = finished.length ? `; visit ${finished.join(', ')} finished with it` : '';
        await moveRequest(this.flow, { requestId, event: 'issue-letter', actors, by: user.id, note: `Completion letter ${number} revision ${revision} issued${visitsNote}` }, trx);
        await this.messages.letterIssued(trx, { requestId, letterNumber: number, revision, by: user.id });
        return revision;
      }),
    );
    const letters = await this.letters.listForRequest(requestId);
    const letter = letters.find((l) => l.revision === revision)!;
    return this.toDto(letter, letters);
  }

  async list(user: CurrentUser, requestId: number): Promise<CompletionLetter[]> {
    await this.access.get(user, requestId);
    const letters = await this.letters.listForRequest(requestId);
    return letters.map((l) => this.toDto(l, letters));
  }

  async pdf(user: CurrentUser, requestId: number, revision: number): Promise<{ fileName: string; pdf: Buffer }> {
    await this.access.get(user, requestId);
    const letter = await this.letters.findByRevision(requestId, revision);
    if (!letter) throw new NotFoundError('No such letter revision');
    return { fileName: `${letter.number}-rev${letter.revision}.pdf`, pdf: await this.storage.get(letter.storageKey) };
  }

  /** What anyone holding the code may see: no names, no address. */
  async verify(code: string): Promise<LetterVerification> {
    const letter = VERIFICATION_CODE.test(code) ? await this.letters.findByCode(code) : null;
    if (!letter) throw new NotFoundError('No letter has this verification code');
    return this.publicView(letter);
  }

  /** Whether uploaded bytes are a letter this product issued, and its current revision. */
  async checkPdf(bytes: Buffer, code: string | null): Promise<PdfCheck> {
    if (!isPdf(bytes)) throw new ValidationError('This file is not a PDF', [{ path: 'file', message: NOT_A_PDF_MESSAGE }]);
    const letter = await this.letters.findBySha256(sha256Of(bytes));
    // A code that names no letter does not hide the answer about the file: it just matches nothing.
    const named = code && VERIFICATION_CODE.test(code) ? await this.letters.findByCode(code) : null;
    if (!letter) {
      return { isGenuine: false, isCurrent: false, matchesCode: code === null ? null : false, letter: named ? await this.publicView(named) : null, message: UNKNOWN_PDF_MESSAGE };
    }
    const view = await this.publicView(letter);
    const matchesCode = code === null ? null : letter.verificationCode === code;
    const message =
      matchesCode === false
        ? named
          ? 'This file is a genuine letter, but not the one this code names.'
          : 'This file is a genuine letter, but no letter has the code typed: check the code printed beside the QR code.'
        : view.isCurrent
          ? `Genuine: this is letter ${view.number}, revision ${view.revision}, the current revision.`
          : `Genuine but superseded: revision ${view.supersededBy!.revision} replaced this revision on ${view.supersededBy!.issuedOn}.`;
    return { isGenuine: true, isCurrent: view.isCurrent, matchesCode, letter: view, message };
  }

  private async publicView(letter: LetterRecord): Promise<LetterVerification> {
    const all = await this.letters.listForRequest(letter.requestId);
    const latest = all.at(-1)!;
    return {
      number: letter.number,
      revision: letter.revision,
      issuedOn: dateOf(letter.issuedAt),
      itemCount: letter.itemCount,
      sha256: letter.sha256,
      isCurrent: latest.id === letter.id,
      supersededBy: latest.id === letter.id ? null : { revision: latest.revision, issuedOn: dateOf(latest.issuedAt) },
      isAccepted: await this.letters.isAccepted(letter.id),
    };
  }

  /** The inspector or buyer's agent accepts the corrections, or lists items not accepted (which reopens the request). */
  async review(user: CurrentUser, requestId: number, input: z.output<typeof ProofReviewSchema>): Promise<void> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    const event = input.decision === 'accept' ? 'accept-proof' : 'reject-proof';
    if (!mayMoveRequest(actors, event, request.status)) {
      if (!mayMoveRequest(actors, event, 'letter-issued')) throw new ForbiddenError('Only the inspector or the buyer’s agent records the re-inspection');
      throw new ConflictError('There is no issued letter waiting for review');
    }
    await this.db.transaction(async (trx) => {
      const locked = await this.items.lockRequest(requestId, trx);
      if (!locked || locked.status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
      const letter = (await this.letters.listForRequest(requestId, trx)).at(-1);
      if (!letter) throw new ConflictError('No completion letter was issued through Closing Circuit for this request');
      const items = await this.items.listForRequest(requestId, trx, true);
      const notAccepted = input.decision === 'not-accept' ? input.items : [];
      for (const [index, entry] of notAccepted.entries()) {
        const item = items.find((i) => i.id === entry.itemId);
        if (!item || !mayMoveItem(actors, 'not-accept', item.status)) {
          throw new ValidationError('Only corrected items can be listed as not accepted', [{ path: `items.${index}.itemId`, message: 'Choose an item recorded as corrected' }]);
        }
        await moveItem(this.flow, { ...item, requestId }, 'not-accept', { actors, by: user.id }, trx);
      }
      if (input.decision === 'accept') {
        for (const item of items) if (mayMoveItem(actors, 'accept', item.status)) await moveItem(this.flow, { ...item, requestId }, 'accept', { actors, by: user.id }, trx);
      }
      await this.letters.addReview({ requestId, letterId: letter.id, decision: input.decision, note: input.note, items: notAccepted, decidedBy: user.id }, trx);
      const note = input.decision === 'accept' ? 'Re-inspection accepted' : `${notAccepted.length} item(s) not accepted`;
      await moveRequest(this.flow, { requestId, event, actors, by: user.id, note: input.note ? `${note}: ${input.note}` : note }, trx);
    });
  }

  /** The contractor takes items that were not accepted back in hand: they are approved work again, to book and correct. */
  async resume(user: CurrentUser, requestId: number): Promise<void> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    if (!mayMoveRequest(actors, 'resume-work', request.status)) {
      if (!actors.includes('contractor')) throw new ForbiddenError('Only the contractor takes the items back in hand');
      throw new ConflictError('Only a reopened request can be taken back in hand');
    }
    await this.db.transaction(async (trx) => {
      const locked = await this.items.lockRequest(requestId, trx);
      if (!locked || locked.status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
      for (const item of await this.items.listForRequest(requestId, trx, true)) {
        if (!mayMoveItem(actors, 'rework', item.status)) continue;
        await moveItem(this.flow, { ...item, requestId }, 'rework', { actors, by: user.id }, trx);
        await this.items.planOnVisit([item.id], null, trx);
      }
      await moveRequest(this.flow, { requestId, event: 'resume-work', actors, by: user.id }, trx);
    });
  }

  toDto(letter: LetterRecord, all: readonly LetterRecord[]): CompletionLetter {
    return {
      number: letter.number,
      revision: letter.revision,
      issuedAt: letter.issuedAt.toISOString(),
      issuedByName: letter.issuedByName,
      itemCount: letter.itemCount,
      sha256: letter.sha256,
      verificationCode: letter.verificationCode,
      verificationUrl: this.verificationUrl(letter.verificationCode),
      isCurrent: all.at(-1)?.id === letter.id,
      pdfPath: `/api/requests/${letter.requestId}/letters/${letter.revision}.pdf`,
    };
  }
}

