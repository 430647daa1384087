import { REQUEST_STATUS_LABELS, type RequestStatus } from '@cc/shared';
import type { RefusalMessages } from '../flow/flow.service';

/** What the seller's side hears when the flow table refuses: never theirs to do (403), or not now (409). */
export function refusalMessages(what: string, status: RequestStatus): RefusalMessages {
  return { notYours: `Your part on this request does not ${what}`, notNow: `This cannot be done while the request is "${REQUEST_STATUS_LABELS[status]}"` };
}
