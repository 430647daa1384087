import * as z from 'zod';

/** States of one line item, from the parser's proposal to the inspector's acceptance. */
export const ITEM_STATUSES = [
  'proposed',
  'open',
  'priced',
  'approved',
  'declined',
  'out-of-scope',
  'done',
  'not-done',
  'accepted',
  'not-accepted',
  'removed',
] as const;
export const ItemStatusSchema = z.enum(ITEM_STATUSES);
export type ItemStatus = z.infer<typeof ItemStatusSchema>;

export const ITEM_STATUS_LABELS: Record<ItemStatus, string> = {
  proposed: 'Proposed by the reader',
  open: 'Confirmed',
  priced: 'Priced',
  // Decided on the seller's side: by the seller, or for them by the listing agent (the signature
  // says who, in what capacity), so the state itself names nobody.
  approved: 'Approved',
  declined: 'Declined',
  'out-of-scope': 'Not in contractor’s scope',
  done: 'Corrected',
  'not-done': 'Not corrected',
  accepted: 'Accepted as corrected',
  'not-accepted': 'Not accepted',
  removed: 'Removed',
};
