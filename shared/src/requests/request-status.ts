// The states as plain lists, without zod: the portal's first load reads them (through the flow table)
// and stays small. The schema is in request-status.schema.ts.

/** States of a repair request, in the order a request normally moves through them. */
export const REQUEST_STATUSES = [
  'draft',
  'intake',
  'pricing',
  'quoted',
  'approved',
  'scheduled',
  'in-progress',
  'corrected',
  'letter-issued',
  'accepted',
  'reopened',
  'declined',
  'withdrawn',
] as const;
export type RequestStatus = (typeof REQUEST_STATUSES)[number];

export const REQUEST_STATUS_LABELS: Record<RequestStatus, string> = {
  draft: 'Draft',
  intake: 'Report in review',
  pricing: 'Awaiting prices',
  quoted: 'Quote with seller',
  approved: 'Approved',
  scheduled: 'Visit booked',
  'in-progress': 'Work under way',
  corrected: 'Work finished',
  'letter-issued': 'Letter issued',
  accepted: 'Proof accepted',
  reopened: 'Reopened',
  declined: 'Quote declined',
  withdrawn: 'Withdrawn',
};

/** States after which nothing more happens on the request. */
export const FINAL_STATUSES: readonly RequestStatus[] = ['accepted', 'declined', 'withdrawn'];

export function isFinalStatus(status: RequestStatus): boolean {
  return FINAL_STATUSES.includes(status);
}

/** States in which the agents may still choose or change the contractor (until a quote is sent). */
export const CONTRACTOR_CHANGE_STATES: readonly RequestStatus[] = ['draft', 'intake', 'pricing'];
