import type { CookieOptions } from 'express';
import { parse } from 'cookie';

/** The browser's session: the signed token in a cookie page scripts cannot read. */
export const SESSION_COOKIE = 'meritline_session';

/** The header the web app sends with every call; a page of another site cannot add it without the server's consent. */
export const APP_REQUEST_HEADER = 'x-requested-with';
export const APP_REQUEST_VALUE = 'meritline';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

interface RequestLike {
  method?: string;
  headers?: Record<string, unknown>;
}

export function sessionCookieOf(request: RequestLike): string | null {
  const header = request.headers?.cookie;
  if (typeof header !== 'string') return null;
  return parse(header)[SESSION_COOKIE] ?? null;
}

export function hasBearerHeader(request: RequestLike): boolean {
  return typeof request.headers?.authorization === 'string';
}

/** A change signed in by the cookie alone must come from the web app itself (defence against cross-site requests). */
export function isCrossSiteChange(request: RequestLike): boolean {
  return (
    !SAFE_METHODS.has(request.method ?? 'GET') &&
    !hasBearerHeader(request) &&
    sessionCookieOf(request) !== null &&
    request.headers?.[APP_REQUEST_HEADER] !== APP_REQUEST_VALUE
  );
}

/** No expiry of its own: the token inside expires, and closing the browser ends the cookie. */
export function sessionCookieOptions(publicUrl: string): CookieOptions {
  return { httpOnly: true, sameSite: 'strict', secure: publicUrl.startsWith('https:'), path: '/api' };
}
