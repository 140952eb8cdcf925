import type { RequestHandler } from 'express';
import { AppError } from './errors';

/**
 * Runs a multer middleware and words its refusals the route's way: a file over
 * the size limit is 413 `too_large` with `tooLarge`; too many files, or a file
 * in another field, is `wrongFiles`. Any other error goes on to the error handler.
 */
export const receiveFiles =
  (upload: RequestHandler, refusals: { tooLarge: string; wrongFiles: AppError }): RequestHandler =>
  (req, res, next) =>
    upload(req, res, (err: unknown) => {
      const code = (err as { code?: string } | undefined)?.code;
      if (code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', refusals.tooLarge));
      if (code === 'LIMIT_FILE_COUNT' || code === 'LIMIT_UNEXPECTED_FILE') return next(refusals.wrongFiles);
      next(err);
    });
