/** A name as compared: spaces collapsed and trimmed, case ignored. */
const normalized = (name: string): string => name.trim().replace(/\s+/g, ' ').toLocaleLowerCase('en-US');

/**
 * Who signed, as the approval page says it: the typed name, with the account's name in brackets only
 * when it differs from the typed one ("Ellen Brooks", but "E. Brooks (Ellen Brooks)").
 */
export function signedByText(signerName: string, accountName: string): string {
  return normalized(signerName) === normalized(accountName) ? signerName : `${signerName} (${accountName})`;
}
