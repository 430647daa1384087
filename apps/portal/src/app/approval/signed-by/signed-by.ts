import { signedInCapacity, type ChangeOrder, type SignerCapacity } from '@cc/shared';

/** A name as compared: spaces collapsed and trimmed, case ignored. */
const normalized = (name: string): string => name.trim().replace(/\s+/g, ' ').toLocaleLowerCase('en-US');

/**
 * Who signed, as the approval page says it: the typed name, with the account's name in brackets only
 * when it differs from the typed one ("Ellen Brooks", but "E. Brooks (Ellen Brooks)"), and the
 * capacity ("Robert Hale, listing agent, for the seller").
 */
export function signedByText(signerName: string, accountName: string, capacity: SignerCapacity): string {
  const who = normalized(signerName) === normalized(accountName) ? signerName : `${signerName} (${accountName})`;
  return signedInCapacity(who, capacity);
}

/** Who decided a change order, as the quote's signature says it ("Robert Hale, listing agent, for the seller"); '' while it waits. */
export function changeOrderDecidedBy(order: Pick<ChangeOrder, 'signerName' | 'signerCapacity'>): string {
  if (!order.signerName) return '';
  return order.signerCapacity ? signedInCapacity(order.signerName, order.signerCapacity) : order.signerName;
}
