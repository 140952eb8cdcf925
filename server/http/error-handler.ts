import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from './errors';

export const unknownApiRoute: RequestHandler = (req, _res, next) =>
  next(new AppError(404, 'not_found', `There is no ${req.method} ${req.path} in the Nestkeeper API.`));

/** The one place errors become the API's JSON shape. Body-parser errors are
 * the caller's fault (400/413/415); anything else is logged and answered 500
 * without a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  const known = toAppError(err);
  if (!known) {
    console.error(err);
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side; nothing was changed.' } });
    return;
  }
  res.status(known.status).json({
    error: { code: known.code, message: known.message, ...(known.details ? { details: known.details } : {}) },
  });
};

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; status?: number };
  if (e?.type === 'entity.parse.failed') return new AppError(400, 'invalid_input', 'The request body is not valid JSON.', { fields: { '(body)': 'not valid JSON' } });
  if (e?.type === 'entity.too.large') return new AppError(413, 'too_large', 'The request is larger than Nestkeeper accepts.');
  if (e?.type === 'charset.unsupported' || e?.type === 'encoding.unsupported') return new AppError(415, 'unsupported_type', 'That body encoding is not supported.');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) return new AppError(e.status, 'invalid_input', 'The request could not be read.');
  return null;
}
