import { mayMoveRequest, requestMove, type FlowActor, type RequestEvent, type RequestStatus } from '@cc/shared';
import type { Trx } from '../db/knex';
import type { RequestRepository } from '../requests/request.repository';
import { ConflictError, ForbiddenError } from '../errors';

/**
 * Moves a request by `event` of the flow table from `from`, as one of `actors`, and records the
 * change in the same transaction. Refuses a move the table does not allow for these actors.
 */
export async function moveRequest(
  requests: RequestRepository,
  move: { requestId: number; event: RequestEvent; from: RequestStatus; actors: readonly FlowActor[]; by: number; note?: string },
  trx: Trx,
): Promise<RequestStatus> {
  const found = requestMove(move.event, move.from);
  if (!found) throw new ConflictError(`The request cannot be moved this way while it is ${move.from}`);
  if (!mayMoveRequest(move.actors, move.event, move.from)) throw new ForbiddenError(`You may not ${found.label.toLowerCase()} on this request`);
  const moved = await requests.changeStatus(move.requestId, { from: move.from, to: found.to, by: move.by, note: move.note ?? found.label }, trx);
  if (!moved) throw new ConflictError('The request changed meanwhile. Reload and try again.');
  return found.to;
}
