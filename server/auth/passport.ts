import type { Request } from 'express';
import { Passport, type PassportStatic } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { DataSource } from 'typeorm';
import type { Actor } from '../db/transaction';
import { User } from '../users/user.entity';
import { SESSION_COOKIE, type TokenClaims } from './tokens';

const fromSessionCookie = (req: Request) => (req.cookies?.[SESSION_COOKIE] as string | undefined) ?? null;

/** A token stops working when its user is disabled or changes password
 * (the token version moves on), not only when it expires. */
export function createPassport(db: DataSource, secret: string): PassportStatic {
  const passport = new Passport() as PassportStatic;
  passport.use(
    'jwt',
    new JwtStrategy(
      {
        secretOrKey: secret,
        algorithms: ['HS256'],
        jwtFromRequest: ExtractJwt.fromExtractors([ExtractJwt.fromAuthHeaderAsBearerToken(), fromSessionCookie]),
      },
      (claims: TokenClaims, done: (err: unknown, user?: Actor | false) => void) => {
        db.getRepository(User)
          .findOne({ where: { id: claims.sub, organizationId: claims.org } })
          .then((user) => {
            if (!user || user.disabled || user.tokenVersion !== claims.ver) return done(null, false);
            done(null, { userId: user.id, organizationId: user.organizationId, role: user.role });
          })
          .catch(done);
      },
    ),
  );
  return passport;
}
