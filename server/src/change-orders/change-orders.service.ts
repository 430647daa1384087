import {
  actorsOnRequest,
  changeOrderConsentText,
  findingCodeInfo,
  mayMoveItem,
  mayMoveRequest,
  priceScope,
  signedInCapacity,
  signerCapacityOf,
  type ApiErrorDetail,
  type CreateChangeOrderParsed,
  type CurrentUser,
  type DecideChangeOrderParsed,
  type ItemEvent,
} from '@cc/shared';
import type { Db } from '../db/knex';
import type { ApprovalRepository } from '../approvals/approval.repository';
import type { ApprovedScopeReader } from '../approvals/approved-scope';
import { changesOf } from '../approvals/approved-scope';
import type { SigningContext } from '../approvals/approvals.service';
import { assertMayAct, type FlowService } from '../flow/flow.service';
import { refusalMessages } from '../approvals/approval-messages';
import type { SellerNotices } from '../approvals/seller-notices';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import type { ChangeOrderRepository, StoredChangeOrderLine } from './change-order.repository';

/**
 * Change orders: the contractor adds an item found on site, changes an approved item's quantity
 * or takes out an item that cannot be done, at a price the shared engine computes (the scope with
 * the change less the scope without it); the seller's side approves or declines it like a quote.
 */
export class ChangeOrdersService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly flow: FlowService,
    private readonly approvals: ApprovalRepository,
    private readonly scopes: ApprovedScopeReader,
    private readonly changeOrders: ChangeOrderRepository,
    private readonly notices: SellerNotices,
  ) {}

  async create(user: CurrentUser, requestId: number, input: CreateChangeOrderParsed): Promise<number> {
    const request = await this.access.get(user, requestId);
    const actors = actorsOnRequest(user, request);
    assertMayAct(actors, 'send-change-order', request.status, refusalMessages('send change orders', request.status));
    const { id } = await this.db.transaction(async (trx) => {
      await this.approvals.lockRequest(requestId, trx);
      const scope = await this.scopes.load(requestId, trx);
      if (!scope) throw new ConflictError('Nothing is approved yet: change the quote instead');
      const open = (await this.changeOrders.list(requestId, trx)).find((c) => c.status === 'sent');
      if (open) throw new ConflictError(`Change order ${open.number} is waiting for the seller's decision. Send the next one after it.`);
      const inScope = new Map((scope.breakdown?.visits ?? []).flatMap((v) => v.lines.map((l) => [Number(l.key), l] as const)));
      const items = new Map((await this.approvals.lineItems(requestId, trx)).map((i) => [i.id, i]));
      const entries = new Map(scope.book.entries.map((e) => [e.id, e]));
      const problems: ApiErrorDetail[] = [];
      const touched = new Set<number>();
      input.lines.forEach((line, i) => {
        if (line.kind === 'add') {
          if (!entries.has(line.entryId)) problems.push({ path: `lines.${i}.entryId`, message: 'Choose work from the rate book the quote was priced with' });
        } else if (!inScope.has(line.lineItemId)) {
          problems.push({ path: `lines.${i}.lineItemId`, message: `Item #${line.lineItemId} is not in the approved work` });
        } else if (touched.has(line.lineItemId)) {
          problems.push({ path: `lines.${i}.lineItemId`, message: `Item #${line.lineItemId} is changed twice` });
        } else {
          touched.add(line.lineItemId);
        }
      });
      if (problems.length) throw new ValidationError('Some changes need attention', problems);

      const { id, number } = await this.changeOrders.create({ requestId, createdBy: user.id, reason: input.reason }, trx);
      const lines: StoredChangeOrderLine[] = [];
      for (const line of input.lines) {
        if (line.kind === 'add') {
          const [itemId] = await this.flow.createItems(
            trx,
            'add-by-change-order',
            { userId: user.id, actors },
            [{ requestId, code: line.code, room: line.room, location: line.location, quantity: line.quantity, evidence: null, page: null, severity: findingCodeInfo(line.code).severity, necRefs: [], isEdited: true, reportFileId: null, evidenceStart: null, evidenceEnd: null }],
            refusalMessages('add items', request.status),
          );
          await this.approvals.linkToChangeOrder([itemId], id, trx);
          const entry = entries.get(line.entryId)!;
          lines.push({ kind: 'add', lineItemId: itemId, code: line.code, location: line.location, workName: entry.name, entryId: line.entryId, quantityBefore: null, quantityAfter: line.quantity });
        } else {
          const item = items.get(line.lineItemId)!;
          const priced = inScope.get(line.lineItemId)!;
          lines.push({ kind: line.kind, lineItemId: item.id, code: item.code, location: item.location, workName: entries.get(priced.entryId)?.name ?? priced.entryName, entryId: null, quantityBefore: priced.quantity, quantityAfter: line.kind === 'quantity' ? line.quantity : 0 });
        }
      }
      const after = priceScope({ ...scope, changes: [...scope.changes, ...changesOf({ lines })] })?.totalCents ?? 0;
      await this.changeOrders.setPricing(id, { lines, priceCents: after - scope.totalCents, scopeBeforeCents: scope.totalCents, scopeAfterCents: after }, trx);
      await this.notices.changeOrderSent(trx, { requestId, by: user.id, changeOrderId: id });
      return { id, number };
    });
    return id;
  }

  async decide(user: CurrentUser, requestId: number, changeOrderId: number, input: DecideChangeOrderParsed, context: SigningContext): Promise<void> {
    const request = await this.access.get(user, requestId);
    const actors = actorsOnRequest(user, request);
    assertMayAct(actors, 'decide-change-order', request.status, refusalMessages('decide on change orders', request.status));
    const isApproved = input.decision === 'approve';
    await this.db.transaction(async (trx) => {
      const status = await this.approvals.lockRequest(requestId, trx);
      const co = (await this.changeOrders.list(requestId, trx)).find((c) => c.id === changeOrderId);
      if (!co) throw new NotFoundError('No such change order on this request');
      if (co.status !== 'sent') throw new ConflictError(`Change order ${co.number} was ${co.status} already`);
      const items = new Map((await this.approvals.lineItems(requestId, trx)).map((i) => [i.id, i]));
      const decisions: { lineItemId: number; decision: 'approved' | 'declined' }[] = [];
      for (const line of co.lines) {
        // Added items are approved or declined; an item taken out is declined when the change is approved.
        const event: ItemEvent | null = line.kind === 'add' ? (isApproved ? 'approve' : 'decline') : line.kind === 'remove' && isApproved ? 'decline' : null;
        if (!event) continue;
        const item = items.get(line.lineItemId);
        if (!item) throw new ConflictError(`Item #${line.lineItemId} is gone`);
        await this.flow.moveItem(trx, { id: item.id, requestId, status: item.status, version: item.version }, event, { userId: user.id, actors }, {
          notYours: 'Your part on this request does not decide on items',
          notNow: `Item #${item.id} cannot be ${event}d now (it is ${item.status})`,
          stale: `Item #${item.id} changed meanwhile. Reload and decide again.`,
        });
        decisions.push({ lineItemId: item.id, decision: event === 'approve' ? 'approved' : 'declined' });
      }
      const signerName = input.signerName;
      // Kept with the decision and said wherever it is shown, as for the quote's approval.
      const signerCapacity = signerCapacityOf(actors);
      if (!(await this.changeOrders.decide(co.id, { status: isApproved ? 'approved' : 'declined', decidedBy: user.id, signerName, signerCapacity, ipAddress: context.ipAddress.slice(0, 64), userAgent: context.userAgent.slice(0, 500), note: input.note || null }, trx))) {
        throw new ConflictError('The change order was decided meanwhile');
      }
      await this.approvals.insertDecisions(decisions.map((d) => ({ ...d, requestId, approvalId: null, changeOrderId: co.id, note: input.note || null, decidedBy: user.id })), trx);
      const consent = changeOrderConsentText({ contractorName: request.contractor?.name ?? 'the contractor', number: co.number, decision: input.decision });
      // Approved new work on a request whose work was finished puts it back under way (the flow's move).
      if (isApproved && status === request.status && mayMoveRequest(actors, 'approve-change-order', request.status)) {
        await this.flow.moveRequest(trx, requestId, 'approve-change-order', { userId: user.id, actors }, `Change order ${co.number} approved by ${signedInCapacity(signerName, signerCapacity)}. ${consent}`, refusalMessages('approve change orders', request.status));
      }
      await this.notices.changeOrderDecided(trx, { requestId, by: user.id, changeOrderId, isApproved });
    });
  }
}

