import { timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from '../http/errors';
import { CSRF_COOKIE, SESSION_COOKIE } from './tokens';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Double-submit check for requests that ride on the session cookie: the
 * client echoes the readable `nk_csrf` cookie in `X-CSRF-Token`, which a
 * foreign site cannot read. Bearer-token callers carry no ambient credential
 * and are not checked.
 */
export const csrfGuard: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method) || req.headers.authorization || !req.cookies?.[SESSION_COOKIE]) return next();
  const cookie = String(req.cookies?.[CSRF_COOKIE] ?? '');
  const header = String(req.get('x-csrf-token') ?? '');
  const ok = cookie.length > 0 && cookie.length === header.length && timingSafeEqual(Buffer.from(cookie), Buffer.from(header));
  next(ok ? undefined : new AppError(403, 'forbidden', 'This request did not come from a Nestkeeper page; reload and try again.'));
};
