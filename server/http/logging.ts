import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, RequestHandler } from 'express';
import { pino, type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export type { Logger } from 'pino';

/** Keys whose values never reach a log line, at the top and one or two levels down (pino's `redact`). */
const SECRET_KEYS = [
  'password',
  'currentPassword',
  'newPassword',
  'token',
  'secret',
  'authorization',
  'cookie',
  'set-cookie',
  'apiKey',
  'card',
  'cardNumber',
  'cvc',
  'totp',
  'otp',
];
const REDACT_PATHS = [
  ...SECRET_KEYS.flatMap((k) => (/^\w+$/.test(k) ? [k, `*.${k}`, `*.*.${k}`] : [`*["${k}"]`, `*.*["${k}"]`])),
  // TypeORM's QueryFailedError carries the statement's parameters: hashes, tokens, whatever was being written.
  'err.parameters',
  'err.driverError.parameters',
];

export type LogOptions = { level: string; format: 'json' | 'pretty' };

/** The server's one logger: JSON lines (an operator's tools read them), or pino-pretty's readable lines for `npm start`. */
export function createLogger(options: LogOptions, destination?: DestinationStream): Logger {
  const settings = { level: options.level, base: { pid: process.pid }, redact: { paths: REDACT_PATHS, censor: '[redacted]' } };
  if (destination) return pino(settings, destination);
  if (options.format === 'pretty') {
    // One line per request at the terminal: the message, its time and its ref; other fields as pino-pretty shows them.
    const messageFormat = '{msg}{if ms} · {ms} ms{end}{if requestId} · ref {requestId}{end}';
    return pino({
      ...settings,
      transport: { target: 'pino-pretty', options: { translateTime: 'SYS:HH:MM:ss', ignore: 'pid,hostname,req,res,ms,requestId', messageFormat } },
    });
  }
  return pino(settings);
}

/** A request id from the proxy in front is taken as is only when that proxy is trusted (TRUST_PROXY) and the id looks like one. */
const PROXY_ID = /^[\w.:-]{8,128}$/;

function requestId(req: IncomingMessage, res: ServerResponse): string {
  const r = req as Request;
  const fromProxy = r.headers['x-request-id'];
  const trusted = typeof fromProxy === 'string' && PROXY_ID.test(fromProxy) && trustsPeer(r);
  const id = trusted ? fromProxy : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/** Express' own `trust proxy` decision for the socket's peer (hop 0). */
function trustsPeer(req: Request): boolean {
  const trust = req.app?.get('trust proxy fn') as ((addr: string, hop: number) => boolean) | undefined;
  return !!trust && trust(req.socket.remoteAddress ?? '', 0);
}

/** The query string as an object, so `redact` can hide its secrets (a calendar feed's token). */
function queryOf(url: string): Record<string, string> {
  const at = url.indexOf('?');
  return at < 0 ? {} : Object.fromEntries(new URLSearchParams(url.slice(at + 1)));
}

/**
 * pino-http: one line per finished request (method, path, route pattern, status, time) and `req.log`, whose lines all
 * carry `requestId`. No headers or bodies are logged; what could still hold a secret is redacted by key.
 */
export function requestLogging(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    genReqId: requestId,
    quietReqLogger: true,
    // The client's hashed bundles are many and say nothing; /metrics still counts them.
    autoLogging: { ignore: (req) => (req.url ?? '').startsWith('/assets/') },
    customAttributeKeys: { reqId: 'requestId', responseTime: 'ms' },
    // The database being away is the operator's one warning from the watch, not an error per request.
    customLogLevel: (_req, res, err) => (err || (res.statusCode >= 500 && res.statusCode !== 503) ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: (req, res) => `${req.method} ${(req as Request).originalUrl?.split('?')[0] ?? req.url} ${res.statusCode}`,
    customErrorMessage: (req, res) => `${req.method} ${(req as Request).originalUrl?.split('?')[0] ?? req.url} ${res.statusCode}`,
    serializers: {
      req: (req: { method: string; url: string; raw?: Request }) => {
        const url = req.raw?.originalUrl ?? req.url;
        return { method: req.method, path: url.split('?')[0], query: queryOf(url), remoteAddress: req.raw?.ip };
      },
      res: (res: { statusCode: number; raw?: ServerResponse & { locals?: { routePattern?: string } } }) => ({
        statusCode: res.statusCode,
        route: res.raw?.locals?.routePattern,
      }),
    },
  }) as unknown as RequestHandler;
}
