import { portalBaseFor } from './portal-origin';

describe('portalBaseFor: where the payment page sends the seller back', () => {
  it.each([
    // [PUBLIC_URL, Origin header, base used]
    ['http://127.0.0.1:4300', 'http://localhost:4300', 'http://localhost:4300'],
    ['http://127.0.0.1:4300', 'http://[::1]:4300', 'http://[::1]:4300'],
    ['http://localhost:4300', 'http://127.0.0.1:4300', 'http://127.0.0.1:4300'],
    ['http://127.0.0.1:4300', 'http://127.0.0.1:4300', 'http://127.0.0.1:4300'],
    ['https://portal.example.test', 'https://portal.example.test', 'https://portal.example.test'],
  ])('PUBLIC_URL %s, opened at %s: back to %s', (publicUrl, origin, expected) => {
    expect(portalBaseFor(publicUrl, origin)).toBe(expected);
  });

  it.each([
    ['no Origin header', undefined],
    ['another host', 'http://elsewhere.test'],
    ['another port on loopback', 'http://localhost:5555'],
    ['another scheme on loopback', 'https://localhost:4300'],
    ['user information in the origin', 'http://user:pw@localhost:4300'],
    ['a path smuggled into the header', 'http://localhost:4300/evil'],
    ['not a URL', 'null'],
  ])('falls back to PUBLIC_URL for %s', (_case, origin) => {
    expect(portalBaseFor('http://127.0.0.1:4300', origin)).toBe('http://127.0.0.1:4300');
  });

  it('never takes a loopback alias when PUBLIC_URL is a public host', () => {
    expect(portalBaseFor('https://portal.example.test', 'http://localhost:4300')).toBe('https://portal.example.test');
  });
});
