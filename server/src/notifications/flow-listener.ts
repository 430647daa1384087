// What every move of the flow writes besides the move itself, in its transaction (hung on the flow
// service's listener hook): a timeline entry (who, from, to, note) and the messages the move calls for.
import { REQUEST_STATUS_LABELS, findingCodeInfo, itemStateAfter, type FindingCode } from '@cc/shared';
import type { ActivityRepository } from '../activity/activity.repository';
import type { Trx } from '../db/knex';
import type { FlowListener, ItemMoveMade, RequestMoveMade } from '../flow/flow.service';
import type { NotificationsService } from './notifications.service';

export function createFlowListener(activity: ActivityRepository, notifications: NotificationsService): FlowListener {
  return {
    async requestMoved(trx: Trx, made: RequestMoveMade): Promise<void> {
      const { requestId, move, from, to, byUserId, note, at } = made;
      if (from !== to) {
        await activity.record(trx, {
          requestId,
          actorUserId: byUserId,
          kind: 'status',
          action: move.event,
          summary: `${move.label}: ${from ? `${REQUEST_STATUS_LABELS[from]} → ` : ''}${REQUEST_STATUS_LABELS[to]}${note ? ` (${note})` : ''}`,
          before: from ? { status: from } : null,
          after: { status: to },
          at,
        });
      }
      if (move.event === 'confirm-items') {
        // The items being confirmed (whether the flow moves them before or after the request).
        const [{ count }] = await trx('line_items').where({ request_id: requestId }).whereIn('status', ['proposed', 'open']).count({ count: '*' });
        await notifications.notify(trx, { kind: 'ready-to-price', requestId, actorUserId: byUserId, itemCount: Number(count), at });
      }
      if (move.event === 'accept-proof' || move.event === 'reject-proof') {
        // The review was written before the move (letters.service review()): its id keys the message.
        const review: { id: number } | undefined = await trx('proof_reviews').where({ request_id: requestId }).orderBy('id', 'desc').first('id');
        if (!review) throw new Error('A re-inspection move was made without its review record');
        const [{ count }] = await trx('line_items').where({ request_id: requestId, status: itemStateAfter('not-accept') }).count({ count: '*' });
        await notifications.notify(trx, {
          kind: 'proof-reviewed',
          requestId,
          actorUserId: byUserId,
          isAccepted: move.event === 'accept-proof',
          notAcceptedCount: move.event === 'accept-proof' ? 0 : Number(count),
          reviewRef: String(review.id),
          at,
        });
      }
      if (move.event === 'send-quote') {
        const quote = await trx('quotes').where({ request_id: requestId }).orderBy('version', 'desc').first('version', 'total_cents');
        if (quote) await notifications.notify(trx, { kind: 'quote-sent', requestId, actorUserId: byUserId, version: quote.version, totalCents: quote.total_cents, at });
      }
    },

    async itemMoved(trx: Trx, made: ItemMoveMade): Promise<void> {
      // Items read from a report are summed up by the report's own entry.
      if (made.move.event === 'propose') return;
      const item = await trx('line_items').where({ id: made.itemId }).first('code');
      await activity.record(trx, {
        requestId: made.requestId,
        itemId: made.itemId,
        actorUserId: made.byUserId,
        kind: 'items',
        action: `item-${made.move.event}`,
        summary: `${made.move.label}: ${(item && findingCodeInfo(item.code as FindingCode)?.label) ?? `item #${made.itemId}`}`,
        before: made.from ? { status: made.from } : null,
        after: { status: made.to },
        at: made.at,
      });
    },
  };
}
