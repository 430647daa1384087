import { createHmac, timingSafeEqual } from 'node:crypto';

// The link in a digest that turns digests off without signing in: the user id and an HMAC of it
// under the server's secret (nothing stored; a changed secret voids old links).
const PURPOSE = 'digest-unsubscribe';

const mac = (secret: string, userId: number) => createHmac('sha256', secret).update(`${PURPOSE}:${userId}`).digest('base64url').slice(0, 32);

export function unsubscribeToken(secret: string, userId: number): string {
  return `${userId}.${mac(secret, userId)}`;
}

/** The user id the token was made for, or null when it is not one of ours. */
export function readUnsubscribeToken(secret: string, token: string): number | null {
  const match = /^([1-9]\d{0,9})\.([A-Za-z0-9_-]{32})$/.exec(token);
  if (!match) return null;
  const userId = Number(match[1]);
  const expected = Buffer.from(mac(secret, userId));
  const given = Buffer.from(match[2]);
  return expected.length === given.length && timingSafeEqual(expected, given) ? userId : null;
}
