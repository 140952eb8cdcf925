import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit, type Store } from 'express-rate-limit';
import jwt from 'jsonwebtoken';
import type { ResetRequestedView, SessionProbeView } from '../../shared/auth/views';
import {
  changeOwnPasswordPayload,
  completePasswordResetPayload,
  linkTokenPayload,
  loginPayload,
  requestPasswordResetPayload,
  secondStepSignInPayload,
} from '../../shared/schemas/users';
import type { Actor } from '../db/transaction';
import { endpoint } from '../http/endpoint';
import { AppError } from '../http/errors';
import type { AccountLinksService } from './account-links.service';
import type { AuthService } from './auth.service';
import { clearSessionCookies, setSessionCookies } from './session-cookies';

/** The e-mail as the login schema reads it (trimmed, lower case), so a padded or re-cased address counts against the same limit. */
const signInName = (raw: unknown) => {
  const read = loginPayload.shape.email.safeParse(raw);
  return read.success ? read.data : String(raw ?? '');
};
const address = (req: Request) => ipKeyGenerator(req.ip ?? '');
/** Whom a second-step ticket names (read unverified: only to count attempts; the service verifies it). */
const ticketPerson = (raw: unknown) => String((typeof raw === 'string' && (jwt.decode(raw) as { sub?: unknown } | null)?.sub) || 'unreadable');

/** Every answer to "forgot password", whoever the address belongs to. */
const RESET_REQUESTED: ResetRequestedView = {
  message: 'If that address belongs to an active Nestkeeper account, a link to set a new password is on its way. It works for one hour.',
};

export type AuthLimits = {
  attemptsPer10Min: number;
  resetsPerHourPerEmail: number;
  resetsPerHourPerAddress: number;
  /** A PostgreSQL-backed counter per limit (`login_attempts`), shared by every instance. */
  store: (prefix: string) => Store;
};

const limit = (o: { windowMs: number; limit: number; store: Store; key: (req: Request) => string; skipSuccessful: boolean; message: string }) =>
  rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: o.skipSuccessful,
    store: o.store,
    keyGenerator: o.key,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', o.message)),
  });

export function authRoutes(auth: AuthService, links: AccountLinksService, opts: { secureCookies: boolean; limits: AuthLimits }): Router {
  const router = Router();
  const at = '/api/auth';
  const { limits } = opts;

  // Per address and e-mail, so one person's typos do not lock out the whole office; counted in PostgreSQL, so the limit holds across instances.
  // The address is the socket's unless TRUST_PROXY names the proxy in front; the e-mail is read as sign-in reads it.
  // The code step counts failures on the same store per address and person, so guessing codes meets the same limit.
  const signInLimit = (key: (req: Request) => string) =>
    limit({
      windowMs: 10 * 60 * 1000,
      limit: limits.attemptsPer10Min,
      store: limits.store('login:'),
      key,
      skipSuccessful: true,
      message: 'Too many sign-in attempts; wait a few minutes and try again.',
    });
  router.post(
    '/login',
    signInLimit((req) => `${address(req)}|${signInName(req.body?.email)}`),
  );
  router.post(
    '/login/code',
    signInLimit((req) => `${address(req)}|code:${ticketPerson(req.body?.ticket)}`),
  );

  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/login',
      summary: 'Sign in; returns a token and sets the session cookie, or a ticket for the second step',
      access: 'public',
      body: loginPayload,
    },
    async ({ body, req, res }) => {
      const answer = await auth.login(body.email, body.password, req.get('user-agent'));
      if ('token' in answer) setSessionCookies(res, answer.token, opts.secureCookies);
      return answer;
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/login/code',
      summary: 'The second step: a code from the app or a recovery code',
      access: 'public',
      body: secondStepSignInPayload,
    },
    async ({ body, req, res }) => {
      const session = await auth.loginWithCode(body.ticket, body.code, req.get('user-agent'));
      setSessionCookies(res, session.token, opts.secureCookies);
      return session;
    },
  );
  endpoint(router, at, { method: 'get', path: '/me', summary: 'The signed-in user, their organization and second step', access: 'account' }, ({ actor }) =>
    auth.me(actor),
  );
  // How a page starts: who is signed in, if anyone. Signed out is an answer here, not an error (no 401 in the browser's console).
  endpoint(
    router,
    at,
    { method: 'get', path: '/session', summary: 'The session if someone is signed in, else `{ session: null }`', access: 'if-signed-in' },
    async ({ req }): Promise<SessionProbeView> => {
      const caller = req.user as Actor | undefined;
      return { session: caller ? await auth.me(caller) : null };
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/logout', summary: "Sign out: the caller's session ends and the session cookie is cleared", access: 'if-signed-in' },
    async ({ req, res }) => {
      const caller = req.user as Actor | undefined;
      if (caller) await auth.signOut(caller);
      clearSessionCookies(res);
      return undefined;
    },
  );
  endpoint(
    router,
    at,
    { method: 'post', path: '/password', summary: 'Change your own password (every other session ends)', access: 'signed-in', body: changeOwnPasswordPayload },
    async ({ actor, body, req, res }) => {
      setSessionCookies(res, await auth.changeOwnPassword(actor, body.currentPassword, body.newPassword, req.get('user-agent')), opts.secureCookies);
      return undefined;
    },
  );

  // Forgot password: limited per e-mail (a mailbox is not flooded) and per address (one caller cannot sweep many addresses).
  router.post(
    '/password-reset',
    limit({
      windowMs: 60 * 60 * 1000,
      limit: limits.resetsPerHourPerAddress,
      store: limits.store('reset-address:'),
      key: address,
      skipSuccessful: false,
      message: 'Too many reset requests from here; wait an hour and try again.',
    }),
    limit({
      windowMs: 60 * 60 * 1000,
      limit: limits.resetsPerHourPerEmail,
      store: limits.store('reset-email:'),
      key: (req) => signInName(req.body?.email),
      skipSuccessful: false,
      message: 'Too many reset requests for this address; check the mail already sent, or wait an hour.',
    }),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/password-reset',
      summary: 'Ask for a password reset link; the same answer whether or not the address has an account',
      access: 'public',
      body: requestPasswordResetPayload,
      status: 202,
    },
    async ({ body, res }) => {
      // The answer leaves before the address is looked up: neither its words nor its timing depend on the account.
      res.status(202).json(RESET_REQUESTED);
      await links.requestReset(body.email).catch((err: unknown) => console.error('password reset request failed', err));
    },
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/password-reset/lookup',
      summary: 'What a reset link opens (410 when expired, used or withdrawn)',
      access: 'public',
      body: linkTokenPayload,
    },
    ({ body }) => links.resetByToken(body.token),
  );
  endpoint(
    router,
    at,
    {
      method: 'post',
      path: '/password-reset/complete',
      summary: 'Set a new password from a reset link; every session of the person ends',
      access: 'public',
      body: completePasswordResetPayload,
    },
    async ({ body }) => {
      await links.completeReset(body.token, body.password);
      return undefined;
    },
  );
  return router;
}
