import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'nk_session';
export const CSRF_COOKIE = 'nk_csrf';
export const TOKEN_LIFETIME_SECONDS = 12 * 60 * 60;
/** Time to type the code from the app after the password was right. */
export const SECOND_STEP_TICKET_SECONDS = 5 * 60;
const SECOND_STEP_AUDIENCE = 'nestkeeper:second-step';

/** `jti` names the sign-in's row in `user_sessions`. */
export type TokenClaims = { sub: string; org: string; ver: number; jti: string };
export type SecondStepTicket = { sub: string; org: string; ver: number };

/** The signing key as a KeyObject, made once: jsonwebtoken would otherwise rebuild it on every request. */
export const signingKey = (secret: string): KeyObject => createSecretKey(Buffer.from(secret, 'utf8'));

export function signSessionToken(key: KeyObject, claims: TokenClaims): string {
  const { jti, ...rest } = claims;
  return jwt.sign(rest, key, { expiresIn: TOKEN_LIFETIME_SECONDS, algorithm: 'HS256', jwtid: jti });
}

/** Proof that the password was right, good only for the code step: it carries no `jti`, so no route takes it as a session. */
export function signSecondStepTicket(key: KeyObject, claims: SecondStepTicket): string {
  return jwt.sign(claims, key, { expiresIn: SECOND_STEP_TICKET_SECONDS, algorithm: 'HS256', audience: SECOND_STEP_AUDIENCE });
}

/** The ticket's claims, or null when it is forged, expired or not a ticket. */
export function readSecondStepTicket(key: KeyObject, ticket: string): SecondStepTicket | null {
  try {
    const claims = jwt.verify(ticket, key, { algorithms: ['HS256'], audience: SECOND_STEP_AUDIENCE }) as jwt.JwtPayload;
    if (typeof claims.sub !== 'string' || typeof claims.org !== 'string' || typeof claims.ver !== 'number') return null;
    return { sub: claims.sub, org: claims.org, ver: claims.ver };
  } catch {
    return null;
  }
}
