import type { ErrorRequestHandler, RequestHandler } from 'express';
import { NotACalendarDate } from '../../shared/dates/calendar-date';
import { fromDatabaseError, RETRY_AFTER_SECONDS } from './database-errors';
import { AppError } from './errors';

export const unknownApiRoute: RequestHandler = (req, _res, next) =>
  next(new AppError(404, 'not_found', `There is no ${req.method} ${req.path} in the Nestkeeper API.`));

/** The one place errors become the API's JSON shape. Body-parser errors and
 * values the database refuses are the caller's fault (4xx); an unreachable
 * database is 503 with Retry-After; anything else is logged and answered 500
 * without a stack trace. Every error reply carries `ref`, the request id on the
 * log lines of that request, so a person's "error ref" finds them. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toAppError(err);
  if (!known) req.log.error({ err }, 'request failed');
  // Part of the reply is already on its way: all that is left is to cut it short.
  if (res.headersSent) return void res.destroy();
  // Refused before its body was read (an anonymous upload): close rather than read the rest.
  if (!req.complete) res.set('Connection', 'close');
  if (!known) {
    res.locals.errorCode = 'internal';
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side; nothing was changed.', ref: req.id } });
    return;
  }
  if (known.status === 503) res.set('Retry-After', String(RETRY_AFTER_SECONDS));
  res.locals.errorCode = known.code;
  res.status(known.status).json({
    error: { code: known.code, message: known.message, ...(known.details ? { details: known.details } : {}), ref: req.id },
  });
};

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof NotACalendarDate) return new AppError(400, 'invalid_input', err.message);
  const fromDatabase = fromDatabaseError(err);
  if (fromDatabase) return fromDatabase;
  const e = err as { type?: string; status?: number; code?: string; field?: string };
  if (e?.type === 'entity.parse.failed')
    return new AppError(400, 'invalid_input', 'The request body is not valid JSON.', { fields: { '(body)': 'not valid JSON' } });
  if (e?.type === 'entity.too.large') return new AppError(413, 'too_large', 'The request is larger than Nestkeeper accepts.');
  if (e?.type === 'charset.unsupported' || e?.type === 'encoding.unsupported')
    return new AppError(415, 'unsupported_type', 'That body encoding is not supported.');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) return new AppError(e.status, 'invalid_input', 'The request could not be read.');
  return null;
}
