import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'nk_session';
export const CSRF_COOKIE = 'nk_csrf';
export const TOKEN_LIFETIME_SECONDS = 12 * 60 * 60;

export type TokenClaims = { sub: string; org: string; ver: number };

/** The signing key as a KeyObject, made once: jsonwebtoken would otherwise rebuild it on every request. */
export const signingKey = (secret: string): KeyObject => createSecretKey(Buffer.from(secret, 'utf8'));

export function signSessionToken(key: KeyObject, claims: TokenClaims): string {
  return jwt.sign(claims, key, { expiresIn: TOKEN_LIFETIME_SECONDS, algorithm: 'HS256' });
}
