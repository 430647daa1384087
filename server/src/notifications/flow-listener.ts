// What a move of a request through the flow writes besides the move itself, in its transaction: a
// timeline entry (who, from, to, note) and the messages the move calls for.
import { REQUEST_FLOW, REQUEST_STATUS_LABELS, type RequestEvent, type RequestStatus } from '@cc/shared';
import type { ActivityRepository } from '../activity/activity.repository';
import type { StatusChangeRecord } from '../requests/request.repository';
import type { Trx } from '../db/knex';
import type { NotificationsService } from './notifications.service';

/** The flow's move from `from` to `to` (the first the table lists), or null for a change it has no move for. */
export function moveBetween(from: RequestStatus | null, to: RequestStatus): RequestEvent | null {
  return REQUEST_FLOW.find((m) => m.from.includes(from) && m.to === to)?.event ?? null;
}

export function createFlowListener(activity: ActivityRepository, notifications: NotificationsService) {
  return async (trx: Trx, change: StatusChangeRecord): Promise<void> => {
    const event = moveBetween(change.from, change.to);
    const label = REQUEST_FLOW.find((m) => m.event === event)?.label ?? 'Status changed';
    await activity.record(trx, {
      requestId: change.requestId,
      actorUserId: change.by,
      kind: 'status',
      action: event ?? 'status-change',
      summary: `${label}: ${change.from ? `${REQUEST_STATUS_LABELS[change.from]} → ` : ''}${REQUEST_STATUS_LABELS[change.to]}${change.note ? ` (${change.note})` : ''}`,
      before: change.from ? { status: change.from } : null,
      after: { status: change.to },
    });
    if (event === 'confirm-items') {
      const [{ count }] = await trx('line_items').where({ request_id: change.requestId, status: 'open' }).count({ count: '*' });
      await notifications.notify(trx, { kind: 'ready-to-price', requestId: change.requestId, actorUserId: change.by, itemCount: Number(count) });
    }
  };
}
