/** A reference is this prefix and the id, padded with zeros to this many digits. */
export const REQUEST_REFERENCE_PREFIX = 'CC-';
export const REQUEST_REFERENCE_DIGITS = 5;

/** The reference people quote for a request, e.g. `CC-00042`. */
export function requestReference(id: number): string {
  return `${REQUEST_REFERENCE_PREFIX}${String(id).padStart(REQUEST_REFERENCE_DIGITS, '0')}`;
}

/** The request id in a typed reference (`CC-00042`, `cc-42`, `42`), or null when it is none. */
export function parseRequestReference(text: string): number | null {
  const match = /^(?:cc-?)?0*(\d{1,9})$/i.exec(text.trim());
  return match ? Number(match[1]) : null;
}
