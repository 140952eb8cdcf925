import type { NextFunction, Request, Response, Router } from 'express';
import { z } from 'zod';
import type { Capability } from '../../shared/auth/roles';
import { notFound } from './errors';
import { identifyCaller, requireCapability, requireSignIn, type Actor } from './guards';
import { isUuid } from './ids';
import { parse } from './parse';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

export type EndpointSpec<B extends z.ZodType, Q extends z.ZodType> = {
  method: Method;
  path: string;
  summary: string;
  /** `public` needs no sign-in; `if-signed-in` is public but knows a signed-in caller; `signed-in` any role; else a capability. */
  access: 'public' | 'if-signed-in' | 'signed-in' | Capability;
  body?: B;
  query?: Q;
  status?: number;
};

type Input<B extends z.ZodType, Q extends z.ZodType> = {
  body: z.infer<B>;
  query: z.infer<Q>;
  params: Record<string, string>;
  /** Unset on `public` routes; on `if-signed-in` routes read `req.user`, which may be unset. */
  actor: Actor;
  req: Request;
  res: Response;
};

export type DocumentedEndpoint = { method: Method; path: string; summary: string; access: string; body?: z.ZodType; query?: z.ZodType };
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
  documentedEndpoints.push({ ...spec, path: mountedAt + (spec.path === '/' ? '' : spec.path) });
  const guards =
    spec.access === 'public'
      ? []
      : spec.access === 'if-signed-in'
        ? [identifyCaller]
        : spec.access === 'signed-in'
          ? [requireSignIn]
          : [requireSignIn, requireCapability(spec.access)];
  router[spec.method](spec.path, ...guards, async (req: Request, res: Response, next: NextFunction) => {
    try {
      assertIdParams(req.params as Record<string, string>);
      const body = (spec.body ? parse(spec.body, req.body) : req.body) as z.infer<B>;
      const query = (spec.query ? parse(spec.query, req.query) : req.query) as z.infer<Q>;
      const result = await handler({ body, query, params: req.params as Record<string, string>, actor: req.user as Actor, req, res });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    } catch (err) {
      next(err);
    }
  });
}

/** Record ids are UUIDs; anything else cannot name a record, so it is a 404 (not a database error). */
function assertIdParams(params: Record<string, string>) {
  for (const [name, value] of Object.entries(params)) {
    if ((name === 'id' || name.endsWith('Id')) && !isUuid(value)) throw notFound('That record');
  }
}

/** `limit` (default 50, max 500) and `offset`, per API.md "Lists". */
export const paging = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
