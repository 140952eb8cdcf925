import type { KeyObject } from 'node:crypto';
import type { Request } from 'express';
import { Passport, type PassportStatic } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { DataSource } from 'typeorm';
import { secondStepRoles } from '../../shared/auth/roles';
import { preparedQuery } from '../db/prepared';
import type { Actor } from '../db/transaction';
import { isUuid } from '../http/ids';
import { SESSION_COOKIE, TOKEN_LIFETIME_SECONDS, type TokenClaims } from './tokens';

type SessionCheck = { role: Actor['role']; disabled: boolean; token_version: number; ended: boolean; stale: boolean; owed: boolean };

/** One row per request: the person, their sign-in's row (`jti`), and whether the firm requires a second step they lack. */
/** The per-request sign-in check (exported for the prepared-statement benchmark). */
export const SESSION_CHECK = `
  SELECT u.role, u.disabled, u.token_version, s.ended_at IS NOT NULL AS ended, s.last_seen_at < now() - interval '1 minute' AS stale,
         (u.totp_enabled_at IS NULL AND u.role = ANY($4::text[]) AND coalesce((o.settings->>'secondStepRequired')::boolean, false)) AS owed
    FROM users u
    JOIN user_sessions s ON s.id = $3 AND s.user_id = u.id
    JOIN organizations o ON o.id = u.organization_id
   WHERE u.id = $1 AND u.organization_id = $2`;

const fromSessionCookie = (req: Request) => (req.cookies?.[SESSION_COOKIE] as string | undefined) ?? null;

/** A token stops working when its user is disabled, changes password or
 * signs out everywhere (the token version moves on), when its own session is ended,
 * not only when it expires. A token must say when it expires and be no older than a
 * session lasts. The session's "last seen" moves at most once a minute. */
export function createPassport(db: DataSource, key: KeyObject): PassportStatic {
  const passport = new Passport() as PassportStatic;
  passport.use(
    'jwt',
    new JwtStrategy(
      {
        // jsonwebtoken accepts a KeyObject; the typings only know strings and buffers.
        secretOrKey: key as unknown as string,
        algorithms: ['HS256'],
        // jsonwebtoken checks `exp` only when present; maxAge bounds the age by `iat` (and requires it).
        jsonWebTokenOptions: { maxAge: TOKEN_LIFETIME_SECONDS },
        jwtFromRequest: ExtractJwt.fromExtractors([ExtractJwt.fromAuthHeaderAsBearerToken(), fromSessionCookie]),
      },
      (claims: TokenClaims & { exp?: unknown }, done: (err: unknown, user?: Actor | false) => void) => {
        if (typeof claims.exp !== 'number' || ![claims.sub, claims.org, claims.jti].every((id) => typeof id === 'string' && isUuid(id))) {
          return done(null, false);
        }
        // A prepared statement: this runs on every request.
        preparedQuery<SessionCheck>(db, 'auth_session', SESSION_CHECK, [claims.sub, claims.org, claims.jti, secondStepRoles])
          .then(async ([user]) => {
            if (!user || user.disabled || user.ended || user.token_version !== claims.ver) return done(null, false);
            if (user.stale) await db.query(`UPDATE user_sessions SET last_seen_at = now() WHERE id = $1`, [claims.jti]);
            done(null, { userId: claims.sub, organizationId: claims.org, role: user.role, sessionId: claims.jti, secondStepOwed: user.owed });
          })
          .catch(done);
      },
    ),
  );
  return passport;
}
