import type { FlowActor, ItemEvent, ItemStatus, RequestEvent, RequestStatus } from '@cc/shared';
import type { Trx } from '../db/knex';
import type { FlowService } from '../flow/flow.service';

/** Moves a request by `event` of the flow table through the flow service, as one of `actors`. */
export async function moveRequest(
  flow: FlowService,
  move: { requestId: number; event: RequestEvent; actors: readonly FlowActor[]; by: number; note?: string },
  trx: Trx,
): Promise<RequestStatus> {
  const made = await flow.moveRequest(trx, move.requestId, move.event, { userId: move.by, actors: move.actors }, move.note ?? null, {
    notYours: 'Your part on this request does not make this move',
    notNow: 'The request is not where this move starts. Reload to see where it is.',
  });
  return made.to;
}

/** Moves one item by `event` through the flow service (409 when it changed meanwhile). */
export async function moveItem(
  flow: FlowService,
  item: { id: number; requestId: number; status: ItemStatus; version: number },
  event: ItemEvent,
  mover: { actors: readonly FlowActor[]; by: number },
  trx: Trx,
): Promise<ItemStatus> {
  const made = await flow.moveItem(trx, item, event, { userId: mover.by, actors: mover.actors }, {
    notYours: 'Your part on this request does not make this move',
    notNow: 'This item has an outcome already',
    stale: 'Someone else changed this item meanwhile. Reload and try again.',
  });
  return made.to;
}
