import type { ChangeOrder } from '@cc/shared';
import type { StoredChangeOrder } from './change-order.repository';

export function toChangeOrderDto(c: StoredChangeOrder): ChangeOrder {
  return {
    id: c.id,
    number: c.number,
    reason: c.reason,
    status: c.status,
    createdAt: c.createdAt.toISOString(),
    createdByName: c.createdByName,
    lines: c.lines.map((l) => ({ kind: l.kind, lineItemId: l.lineItemId, code: l.code as ChangeOrder['lines'][number]['code'], location: l.location, workName: l.workName, quantityBefore: l.quantityBefore, quantityAfter: l.quantityAfter })),
    priceCents: c.priceCents,
    scopeBeforeCents: c.scopeBeforeCents,
    scopeAfterCents: c.scopeAfterCents,
    decidedAt: c.decidedAt?.toISOString() ?? null,
    signerName: c.signerName,
    signerCapacity: c.signerCapacity,
    decisionNote: c.decisionNote,
  };
}
