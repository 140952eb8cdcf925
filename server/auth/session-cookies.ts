import { randomBytes } from 'node:crypto';
import type { Response } from 'express';
import { CSRF_COOKIE, SESSION_COOKIE, TOKEN_LIFETIME_SECONDS } from './tokens';

/** The httpOnly session cookie and the readable CSRF cookie the client echoes (csrf.ts). */
export function setSessionCookies(res: Response, token: string, secure: boolean) {
  const base = { sameSite: 'lax' as const, secure, path: '/', maxAge: TOKEN_LIFETIME_SECONDS * 1000 };
  res.cookie(SESSION_COOKIE, token, { ...base, httpOnly: true });
  res.cookie(CSRF_COOKIE, randomBytes(24).toString('base64url'), { ...base, httpOnly: false });
}

export function clearSessionCookies(res: Response) {
  res.clearCookie(SESSION_COOKIE, { path: '/' });
  res.clearCookie(CSRF_COOKIE, { path: '/' });
}
