import { priceScope, type Quote, type QuoteContractor, type QuoteBreakdown, type RateBook, type ScopeChange } from '@cc/shared';
import type { Trx } from '../db/knex';
import type { ChangeOrderRepository, StoredChangeOrder } from '../change-orders/change-order.repository';
import type { ApprovalRepository, StoredApproval } from './approval.repository';

/** The signed scope of a request: what the seller approved, with the approved change orders, priced now. */
export interface ApprovedScope {
  approval: StoredApproval;
  contractor: QuoteContractor;
  book: RateBook;
  input: Quote;
  approvedKeys: string[];
  changes: ScopeChange[];
  breakdown: QuoteBreakdown | null;
  totalCents: number;
  cardDepositBp: number;
}

/** The changes a change order makes to the scope (its lines in order). */
export function changesOf(co: Pick<StoredChangeOrder, 'lines'>): ScopeChange[] {
  return co.lines.map((l): ScopeChange => {
    const key = String(l.lineItemId);
    if (l.kind === 'add') return { kind: 'add', key, entryId: l.entryId ?? '', quantity: l.quantityAfter ?? 1 };
    if (l.kind === 'quantity') return { kind: 'quantity', key, quantity: l.quantityAfter ?? 1 };
    return { kind: 'remove', key };
  });
}

export class ApprovedScopeReader {
  constructor(
    private readonly approvals: ApprovalRepository,
    private readonly changeOrders: ChangeOrderRepository,
  ) {}

  /** The scope as signed and changed since, or null before the seller signed. */
  async load(requestId: number, trx?: Trx): Promise<ApprovedScope | null> {
    const approval = await this.approvals.find(requestId, trx);
    if (!approval) return null;
    // One query after the other: a transaction's connection runs one at a time.
    const pricing = await this.approvals.quotePricing(requestId, approval.quoteVersion, trx);
    const decisions = await this.approvals.decisions(requestId, trx);
    const changeOrders = await this.changeOrders.list(requestId, trx);
    if (!pricing) throw new Error(`Quote version ${approval.quoteVersion} of request ${requestId} is missing`);
    const approvedKeys = decisions.filter((d) => d.changeOrderNumber === null && d.decision === 'approved').map((d) => String(d.lineItemId));
    const changes = changeOrders.filter((c) => c.status === 'approved').flatMap(changesOf);
    const breakdown = priceScope({ book: pricing.book, input: pricing.input, approvedKeys, changes });
    const cardDepositBp = pricing.book.terms.cardDepositBp;
    return { approval, contractor: pricing.contractor, book: pricing.book, input: pricing.input, approvedKeys, changes, breakdown, totalCents: breakdown?.totalCents ?? 0, cardDepositBp };
  }
}

