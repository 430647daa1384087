import {
  actorsOf,
  FLOW_ACTOR_LABELS,
  mayAct,
  REQUEST_ACTIONS,
  REQUEST_STATUS_LABELS,
  type CurrentUser,
  type FlowActor,
  type RepairRequestDetail,
  type RequestAction,
  type RequestStatus,
} from '@cc/shared';
import { ConflictError, ForbiddenError } from '../errors';
import type { RequestsService } from '../requests/requests.service';

export interface RequestWithActors {
  request: RepairRequestDetail;
  actors: FlowActor[];
}

/**
 * The request as `user` may see it (404 otherwise) and the actors they are on it, for the flow
 * table's questions. A contractor sees a request only when their organisation is assigned to it.
 */
export async function requestWithActors(access: RequestsService, user: CurrentUser, requestId: number): Promise<RequestWithActors> {
  const request = await access.get(user, requestId);
  return { request, actors: actorsOf({ role: user.role, myParts: request.myParts, isAssignedContractor: user.role === 'contractor' }) };
}

/**
 * Refuses `action` unless the flow table allows it: 403 when none of the actors may ever do it,
 * 409 when they may but not while the request is in its present state.
 */
export function assertMayAct(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus, whatNow: string): void {
  if (mayAct(actors, action, status)) return;
  const rule = REQUEST_ACTIONS[action];
  const isActor = (rule.by as readonly FlowActor[]).some((a) => actors.includes(a));
  if (!isActor) throw new ForbiddenError(`Only ${(rule.by as readonly FlowActor[]).map((a) => FLOW_ACTOR_LABELS[a]).join(' or ')} can do this`);
  throw new ConflictError(`${whatNow} is not possible while the request is “${REQUEST_STATUS_LABELS[status]}”`);
}
