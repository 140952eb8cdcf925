import type { KeyObject } from 'node:crypto';
import type { Request } from 'express';
import { Passport, type PassportStatic } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { DataSource } from 'typeorm';
import { preparedQuery } from '../db/prepared';
import type { Actor } from '../db/transaction';
import { SESSION_COOKIE, TOKEN_LIFETIME_SECONDS, type TokenClaims } from './tokens';

const fromSessionCookie = (req: Request) => (req.cookies?.[SESSION_COOKIE] as string | undefined) ?? null;

/** A token stops working when its user is disabled, changes password or
 * signs out (the token version moves on), not only when it expires. A token
 * must say when it expires and be no older than a session lasts. */
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
        if (typeof claims.exp !== 'number') return done(null, false);
        // A prepared statement: this runs on every request.
        preparedQuery<{ role: Actor['role']; disabled: boolean; token_version: number }>(
          db,
          'auth_user',
          `SELECT role, disabled, token_version FROM users WHERE id = $1 AND organization_id = $2`,
          [claims.sub, claims.org],
        )
          .then(([user]) => {
            if (!user || user.disabled || user.token_version !== claims.ver) return done(null, false);
            done(null, { userId: claims.sub, organizationId: claims.org, role: user.role });
          })
          .catch(done);
      },
    ),
  );
  return passport;
}
