import { actorsOnRequest, REQUEST_STATUS_LABELS, type CurrentUser, type FlowActor, type RepairRequestDetail, type RequestAction, type RequestStatus } from '@cc/shared';
import { assertMayAct as assertFlowAllows } from '../flow/flow.service';
import type { RequestsService } from '../requests/requests.service';

export interface RequestWithActors {
  request: RepairRequestDetail;
  actors: FlowActor[];
}

/** The request as `user` may see it (404 otherwise) and the actors they are on it, for the flow table's questions. */
export async function requestWithActors(access: RequestsService, user: CurrentUser, requestId: number): Promise<RequestWithActors> {
  const request = await access.get(user, requestId);
  return { request, actors: actorsOnRequest(user, request) };
}

/** Refuses `action` unless the flow table allows it: 403 for a part that never does it, 409 for the wrong state. */
export function assertMayAct(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus, whatNow: string): void {
  assertFlowAllows(actors, action, status, {
    notYours: `${whatNow} is not for your part on this request`,
    notNow: `${whatNow} is not possible while the request is “${REQUEST_STATUS_LABELS[status]}”`,
  });
}
