import {
  actorsOf,
  mayAct,
  mayMoveRequest,
  REQUEST_ACTIONS,
  REQUEST_FLOW,
  REQUEST_STATUS_LABELS,
  type CurrentUser,
  type FlowActor,
  type RepairRequestDetail,
  type RequestAction,
  type RequestEvent,
  type RequestStatus,
} from '@cc/shared';
import { ConflictError, ForbiddenError } from '../errors';
import { isAssignedContractor } from '../pricing/pricing.service';

// Questions about who may do what on a request, asked of the shared flow table and answered as
// the errors the API gives: 403 when the person's part may never do it, 409 when the request is not
// in a state that allows it now.

export function actorsOn(user: CurrentUser, request: RepairRequestDetail): FlowActor[] {
  return actorsOf({ role: user.role, myParts: request.myParts, isAssignedContractor: isAssignedContractor(user, request) });
}

const shares = (a: readonly FlowActor[], b: readonly FlowActor[]) => a.some((x) => b.includes(x));
const stateLabel = (status: RequestStatus) => REQUEST_STATUS_LABELS[status];

export function assertMayAct(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus, what: string): void {
  if (!shares(actors, REQUEST_ACTIONS[action].by)) throw new ForbiddenError(`Your part on this request does not ${what}`);
  if (!mayAct(actors, action, status)) throw new ConflictError(`This cannot be done while the request is "${stateLabel(status)}"`);
}

export function assertMayMove(actors: readonly FlowActor[], event: RequestEvent, status: RequestStatus, what: string): void {
  if (!REQUEST_FLOW.some((m) => m.event === event && shares(actors, m.by))) throw new ForbiddenError(`Your part on this request does not ${what}`);
  if (!mayMoveRequest(actors, event, status)) throw new ConflictError(`This cannot be done while the request is "${stateLabel(status)}"`);
}
