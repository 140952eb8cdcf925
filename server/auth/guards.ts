import type { RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import { can, type Capability } from '../../shared/auth/roles';
import type { Actor } from '../db/transaction';
import { AppError, forbidden } from '../http/errors';

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
