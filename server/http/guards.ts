import type { RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import { can, type Capability, type Role } from '../../shared/auth/roles';
import { AppError, forbidden } from './errors';

/** Who is acting: the sign-in guard puts it on the request, every service call carries it,
 * so rules can be checked and records can say who did what. */
export type Actor = {
  userId: string;
  organizationId: string;
  role: Role;
  /** The sign-in this request rides on (the token's `jti`). */
  sessionId?: string;
  /** The firm requires a second step of this role and it is not set up: only the account's own setup answers. */
  secondStepOwed?: boolean;
};

/** The passport instance comes from `app.locals` (auth/ builds it), so this base knows no component. */
const signIn =
  (required: boolean, whileSecondStepOwed = false): RequestHandler =>
  (req, res, next) => {
    const passport = req.app.locals.passport as PassportStatic;
    passport.authenticate('jwt', { session: false }, (err: unknown, actor: Actor | false) => {
      if (err) return next(err);
      if (!actor) return next(required ? new AppError(401, 'unauthenticated', 'Please sign in again.') : undefined);
      if (actor.secondStepOwed && required && !whileSecondStepOwed) {
        return next(new AppError(403, 'second_step_required', 'Your firm requires a second sign-in step for your role; set it up under My account first.'));
      }
      req.user = actor;
      next();
    })(req, res, next);
  };

export const requireSignIn = signIn(true);
/** Signed in, even someone who still owes the second step: their own account and its setup. */
export const requireAccountSignIn = signIn(true, true);
/** Lets anyone through, but tells the route who is signed in (sign-out ends the caller's tokens). */
export const identifyCaller = signIn(false);

export const requireCapability =
  (capability: Capability): RequestHandler =>
  (req, _res, next) => {
    const actor = req.user as Actor;
    next(can(actor.role, capability) ? undefined : forbidden());
  };
