import { randomBytes } from 'node:crypto';
import { Router, type CookieOptions, type Response } from 'express';
import { ipKeyGenerator, rateLimit, type Store } from 'express-rate-limit';
import { changeOwnPasswordPayload, loginPayload } from '../../shared/schemas/users';
import type { Actor } from '../db/transaction';
import { endpoint } from '../http/endpoint';
import { AppError } from '../http/errors';
import type { AuthService } from './auth.service';
import { CSRF_COOKIE, SESSION_COOKIE, TOKEN_LIFETIME_SECONDS } from './tokens';

/** The e-mail as the login schema reads it (trimmed, lower case), so a padded or re-cased address counts against the same limit. */
const signInName = (raw: unknown) => {
  const read = loginPayload.shape.email.safeParse(raw);
  return read.success ? read.data : String(raw ?? '');
};

export function authRoutes(auth: AuthService, opts: { secureCookies: boolean; attemptsPer10Min: number; attemptStore: Store }): Router {
  const router = Router();
  const at = '/api/auth';
  const cookieBase: CookieOptions = { sameSite: 'lax', secure: opts.secureCookies, path: '/', maxAge: TOKEN_LIFETIME_SECONDS * 1000 };

  const startSession = (res: Response, token: string) => {
    res.cookie(SESSION_COOKIE, token, { ...cookieBase, httpOnly: true });
    res.cookie(CSRF_COOKIE, randomBytes(24).toString('base64url'), { ...cookieBase, httpOnly: false });
  };

  // Per address and e-mail, so one person's typos do not lock out the whole office; counted in PostgreSQL, so the limit holds across instances.
  // The address is the socket's unless TRUST_PROXY names the proxy in front; the e-mail is read as sign-in reads it.
  router.post(
    '/login',
    rateLimit({
      windowMs: 10 * 60 * 1000,
      limit: opts.attemptsPer10Min,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      skipSuccessfulRequests: true,
      store: opts.attemptStore,
      keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${signInName(req.body?.email)}`,
      handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many sign-in attempts; wait a few minutes and try again.')),
    }),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/login', summary: 'Sign in; returns a token and sets the session cookie', access: 'public', body: loginPayload },
    async ({ body, res }) => {
      const session = await auth.login(body.email, body.password);
      startSession(res, session.token);
      return session;
    },
  );
  endpoint(router, at, { method: 'get', path: '/me', summary: 'The signed-in user and their organization', access: 'signed-in' }, ({ actor }) =>
    auth.me(actor),
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/logout', summary: "Sign out: the caller's tokens stop working and the session cookie is cleared", access: 'if-signed-in' },
    async ({ req, res }) => {
      const caller = req.user as Actor | undefined;
      if (caller) await auth.signOut(caller);
      res.clearCookie(SESSION_COOKIE, { path: '/' });
      res.clearCookie(CSRF_COOKIE, { path: '/' });
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/password', summary: 'Change your own password', access: 'signed-in', body: changeOwnPasswordPayload },
    async ({ actor, body, res }) => {
      // Older tokens stop working; this browser keeps going with a fresh one.
      startSession(res, await auth.changeOwnPassword(actor, body.currentPassword, body.newPassword));
      return undefined;
    },
  );
  return router;
}
