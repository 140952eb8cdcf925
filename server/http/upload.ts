import express, { type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { AppError } from './errors';

/**
 * A request body that is not JSON. `endpoint()` reads it only after the
 * guards, so an anonymous or under-privileged upload is refused before a
 * byte of it is buffered.
 * - `files`: multipart; text fields land in `req.body` (parsed with the
 *   endpoint's `body` schema), files in `req.files` under that field name.
 * - `text`: the body itself as a string, when sent as one of these types.
 */
export type Upload = { files: string; maxFiles: number; maxBytes: number } | { text: string[]; maxBytes: number };

const MB = 1024 * 1024;
const megabytes = (bytes: number) => `${Math.round(bytes / MB)} MB`;

export function readUpload(upload: Upload): RequestHandler {
  if ('text' in upload) {
    const read = express.text({ type: upload.text, limit: upload.maxBytes });
    return (req, res, next) =>
      read(req, res, (err?: unknown) => {
        if (err) return next(err);
        if (typeof req.body !== 'string') return next(new AppError(415, 'unsupported_type', `Send the file itself with Content-Type: ${upload.text[0]}.`));
        next();
      });
  }
  const read = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: upload.maxBytes, files: upload.maxFiles, fields: 20, fieldSize: 64 * 1024 },
  }).array(upload.files, upload.maxFiles);
  return (req, res, next) => read(req, res, (err?: unknown) => next(err ? uploadError(err, upload) : undefined));
}

function uploadError(err: unknown, upload: Extract<Upload, { files: string }>): unknown {
  if (!(err instanceof Error)) return err;
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return new AppError(413, 'too_large', `Each file may be at most ${megabytes(upload.maxBytes)}.`);
    // multer reports one file too many in the field as an unexpected file.
    if (err.code === 'LIMIT_FILE_COUNT' || (err.code === 'LIMIT_UNEXPECTED_FILE' && err.field === upload.files)) {
      return new AppError(413, 'too_large', `Attach at most ${upload.maxFiles} file${upload.maxFiles === 1 ? '' : 's'}, in the "${upload.files}" field.`);
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE')
      return new AppError(400, 'invalid_input', `Files go in the "${upload.files}" field.`, { fields: { [err.field ?? '(body)']: 'is not a file field' } });
    return new AppError(413, 'too_large', `The form is larger than Nestkeeper accepts (${err.message.toLowerCase()}).`);
  }
  // busboy's words for a body that is not well-formed multipart.
  return new AppError(400, 'invalid_input', `The upload could not be read: ${err.message}.`, { fields: { '(body)': 'not a well-formed multipart form' } });
}

/** The upload as the OpenAPI document describes it. */
export function uploadRequestBody(upload: Upload, fields?: z.ZodType) {
  if ('text' in upload) return { required: true, content: Object.fromEntries(upload.text.map((type) => [type, { schema: { type: 'string' } }])) };
  const schema = (fields ? z.toJSONSchema(fields, { io: 'input', unrepresentable: 'any' }) : { type: 'object', properties: {} }) as {
    properties?: Record<string, unknown>;
  };
  const file = { type: 'string', format: 'binary', maxLength: upload.maxBytes };
  schema.properties = { ...schema.properties, [upload.files]: upload.maxFiles === 1 ? file : { type: 'array', items: file, maxItems: upload.maxFiles } };
  return { required: true, content: { 'multipart/form-data': { schema } } };
}
