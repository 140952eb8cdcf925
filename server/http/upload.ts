import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from './errors';

type UploadRule = {
  /** The multipart field the files come in. */
  field: string;
  maxFiles: number;
  maxBytes: number;
  /** Names one file in the 413 answer: "Each photo", "A certificate". */
  eachFile: string;
  /** The answer when more files, or files in another field, arrive. */
  wrongFiles: AppError;
};

/** Reads a multipart form into memory (`req.file` for one file, else `req.files`), and turns
 * multer's refusals into the API's errors: the one place they are worded. */
export function memoryUpload({ field, maxFiles, maxBytes, eachFile, wrongFiles }: UploadRule): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: maxFiles, fields: 20 } });
  const read = maxFiles === 1 ? upload.single(field) : upload.array(field, maxFiles);
  return (req, res, next) =>
    read(req, res, (err: unknown) => {
      if (!(err instanceof multer.MulterError)) return next(err);
      if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', `${eachFile} may be at most ${maxBytes / 1024 / 1024} MB.`));
      if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') return next(wrongFiles);
      if (err.code.startsWith('LIMIT_')) return next(new AppError(413, 'too_large', 'The form is larger than Nestkeeper accepts.'));
      next(new AppError(400, 'invalid_input', 'The form could not be read.'));
    });
}
