// Where to send a user back to after a page outside the portal (the payment service's page): the
// address they opened the portal at, when it is one the portal answers on, else PUBLIC_URL. The
// session cookie belongs to the host name the user typed, so "localhost" and "127.0.0.1" are
// different sites to the browser: returning to the other one would land on the sign-in page.
// Only PUBLIC_URL's own origin and, when PUBLIC_URL is on loopback, the other loopback names with
// the same scheme and port are taken from the request; anything else (another host, a forged Origin)
// gets PUBLIC_URL, so the return address can never point away from the portal.

const LOOPBACK_NAMES = new Set(['127.0.0.1', 'localhost', '[::1]']);

/** The base URL (no trailing slash) of the portal as `origin` (the request's Origin header) reached it. */
export function portalBaseFor(publicUrl: string, origin: string | undefined): string {
  if (!origin) return publicUrl;
  let asked: URL;
  let own: URL;
  try {
    asked = new URL(origin);
    own = new URL(publicUrl);
  } catch {
    return publicUrl;
  }
  if (asked.origin === own.origin) return publicUrl;
  const sameSiteOnLoopback =
    LOOPBACK_NAMES.has(own.hostname) && LOOPBACK_NAMES.has(asked.hostname) && asked.protocol === own.protocol && asked.port === own.port && asked.pathname === '/' && !asked.username && !asked.password;
  return sameSiteOnLoopback ? `${asked.origin}${own.pathname.replace(/\/$/, '')}` : publicUrl;
}
