import type { RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import { can, type Capability, type Role } from '../../shared/auth/roles';
import { AppError, forbidden } from './errors';

/** Who is acting: the sign-in guard puts it on the request, every service call carries it,
 * so rules can be checked and records can say who did what. */
export type Actor = { userId: string; organizationId: string; role: Role };

/** The passport instance comes from `app.locals` (auth/ builds it), so this base knows no component. */
const signIn =
  (required: boolean): RequestHandler =>
  (req, res, next) => {
    const passport = req.app.locals.passport as PassportStatic;
    passport.authenticate('jwt', { session: false }, (err: unknown, actor: Actor | false) => {
      if (err) return next(err);
      if (!actor) return next(required ? new AppError(401, 'unauthenticated', 'Please sign in again.') : undefined);
      req.user = actor;
      next();
    })(req, res, next);
  };

export const requireSignIn = signIn(true);
/** Lets anyone through, but tells the route who is signed in (sign-out ends the caller's tokens). */
export const identifyCaller = signIn(false);

export const requireCapability =
  (capability: Capability): RequestHandler =>
  (req, _res, next) => {
    const actor = req.user as Actor;
    next(can(actor.role, capability) ? undefined : forbidden());
  };
