import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import { z } from 'zod';
import type { Capability } from '../../shared/auth/roles';
import { isStorableText, UNSTORABLE_TEXT } from '../../shared/schemas/common';
import { AppError, notFound } from './errors';
import { identifyCaller, requireAccountSignIn, requireCapability, requireSignIn, type Actor } from './guards';
import { isUuid } from './ids';
import { parse } from './parse';
import { readUpload, type Upload } from './upload';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

export type EndpointSpec<B extends z.ZodType, Q extends z.ZodType> = {
  method: Method;
  path: string;
  summary: string;
  /** `public` needs no sign-in; `if-signed-in` is public but knows a signed-in caller; `signed-in` any role; `account` any role, even
   * one who still owes the second step the firm requires (their own account and its setup); else a capability. */
  access: 'public' | 'if-signed-in' | 'signed-in' | 'account' | Capability;
  /** JSON body; with `upload` of files, the multipart form's text fields. */
  body?: B;
  query?: Q;
  /** A multipart or text body, read only once the guards have passed. */
  upload?: Upload;
  status?: number;
};

type Input<B extends z.ZodType, Q extends z.ZodType> = {
  body: z.infer<B>;
  query: z.infer<Q>;
  params: Record<string, string>;
  /** Unset on `public` routes; on `if-signed-in` routes read `req.user`, which may be unset. */
  /** The uploaded files (`upload.files`), in the order sent. */
  files: Express.Multer.File[];
  actor: Actor;
  req: Request;
  res: Response;
};

export type DocumentedEndpoint = { method: Method; path: string; summary: string; access: string; body?: z.ZodType; query?: z.ZodType; upload?: Upload };
export const documentedEndpoints: DocumentedEndpoint[] = [];

/**
 * Declares one API operation: guards, zod parsing, the call, the reply — and
 * its OpenAPI entry, so the served description cannot drift from the routes.
 * A handler returns the JSON body, `undefined` for 204, or writes `res` itself.
 */
export function endpoint<B extends z.ZodType = z.ZodUnknown, Q extends z.ZodType = z.ZodUnknown>(
  router: Router,
  mountedAt: string,
  spec: EndpointSpec<B, Q>,
  handler: (input: Input<B, Q>) => Promise<unknown> | unknown,
): void {
  const routePattern = mountedAt + (spec.path === '/' ? '' : spec.path);
  documentedEndpoints.push({ ...spec, path: routePattern });
  // The log line and the metrics name the route by its pattern, not the raw URL.
  const nameRoute: RequestHandler = (_req, res, next) => {
    res.locals.routePattern = routePattern;
    next();
  };
  const guards: RequestHandler[] =
    spec.access === 'public'
      ? []
      : spec.access === 'if-signed-in'
        ? [identifyCaller]
        : spec.access === 'signed-in'
          ? [requireSignIn]
          : spec.access === 'account'
            ? [requireAccountSignIn]
            : [requireSignIn, requireCapability(spec.access)];
  // Guards and ids first: nothing of an upload is read for a caller who may not make it.
  const upload = spec.upload ? [readUpload(spec.upload)] : [];
  router[spec.method](spec.path, nameRoute, ...guards, checkIdParams, ...upload, async (req: Request, res: Response, next: NextFunction) => {
    try {
      const body = (spec.body ? parse(spec.body, req.body) : req.body) as z.infer<B>;
      const query = (spec.query ? parse(spec.query, req.query) : req.query) as z.infer<Q>;
      // A text upload (CSV) is checked cell by cell by its own reader, which names row and column.
      refuseUnstorableText({ body: spec.upload && 'text' in spec.upload ? undefined : body, query });
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      const result = await handler({ body, query, params: req.params as Record<string, string>, files, actor: req.user as Actor, req, res });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    } catch (err) {
      next(err);
    }
  });
}

/**
 * Belt and braces behind the `text()` schema: whatever a schema lets through
 * (record keys, a field someone forgot) still cannot carry a NUL or a broken
 * surrogate into PostgreSQL or the audit trail. 400 naming each field.
 */
function refuseUnstorableText(input: { body: unknown; query: unknown }) {
  const fields: Record<string, string> = {};
  const visit = (value: unknown, path: string, depth: number) => {
    if (typeof value === 'string') {
      if (!isStorableText(value)) fields[path || '(body)'] = UNSTORABLE_TEXT;
    } else if (value && typeof value === 'object' && depth < 32) {
      for (const [key, inner] of Object.entries(value)) {
        const name = [...key].map((ch) => (isStorableText(ch) ? ch : '\uFFFD')).join('');
        const at = path ? `${path}.${name}` : name;
        if (!isStorableText(key)) fields[at] = UNSTORABLE_TEXT;
        else visit(inner, at, depth + 1);
      }
    }
  };
  visit(input.body, '', 0);
  visit(input.query, '', 0);
  if (Object.keys(fields).length) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields });
}

/** Record ids are UUIDs; anything else cannot name a record, so it is a 404 (not a database error). */
const checkIdParams: RequestHandler = (req, _res, next) => {
  const bad = Object.entries(req.params as Record<string, string>).some(([name, value]) => (name === 'id' || name.endsWith('Id')) && !isUuid(value));
  next(bad ? notFound('That record') : undefined);
};

/** `limit` (default 50, max 500) and `offset`, per API.md "Lists". */
export const paging = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
