import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'nk_session';
export const CSRF_COOKIE = 'nk_csrf';
export const TOKEN_LIFETIME_SECONDS = 12 * 60 * 60;

export type TokenClaims = { sub: string; org: string; ver: number };

export function signSessionToken(secret: string, claims: TokenClaims): string {
  return jwt.sign(claims, secret, { expiresIn: TOKEN_LIFETIME_SECONDS, algorithm: 'HS256' });
}
