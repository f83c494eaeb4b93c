import { describe, expect, it } from 'vitest';
import { isCrossSiteChange, sessionCookieOf, sessionCookieOptions } from './session-cookie.js';

const cookie = 'theme=dark; meritline_session=abc.def.ghi';

describe('session cookie', () => {
  it('should be marked Secure only where the app is served over HTTPS', () => {
    expect(sessionCookieOptions('https://lab.example')).toMatchObject({ httpOnly: true, sameSite: 'strict', path: '/api', secure: true });
    expect(sessionCookieOptions('http://localhost:3000').secure).toBe(false);
  });

  it('should find the session among other cookies', () => {
    expect(sessionCookieOf({ headers: { cookie } })).toBe('abc.def.ghi');
    expect(sessionCookieOf({ headers: { cookie: 'theme=dark' } })).toBeNull();
    expect(sessionCookieOf({ headers: {} })).toBeNull();
  });

  it("should take a change signed in by the cookie alone only with the web app's header", () => {
    expect(isCrossSiteChange({ method: 'POST', headers: { cookie } })).toBe(true);
    expect(isCrossSiteChange({ method: 'DELETE', headers: { cookie, 'x-requested-with': 'XMLHttpRequest' } })).toBe(true);
    expect(isCrossSiteChange({ method: 'POST', headers: { cookie, 'x-requested-with': 'meritline' } })).toBe(false);
    expect(isCrossSiteChange({ method: 'GET', headers: { cookie } })).toBe(false);
    expect(isCrossSiteChange({ method: 'POST', headers: { cookie, authorization: 'Bearer x' } })).toBe(false);
    expect(isCrossSiteChange({ method: 'POST', headers: {} })).toBe(false);
  });
});
