import { timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { collectDefaultMetrics, Counter, Gauge, Histogram, Registry } from 'prom-client';
import { AppError } from './errors';

/** One reading of a gauge: a value, with labels when the gauge has them. */
export type Reading = { value: number; labels?: Record<string, string> };

/**
 * This instance's Prometheus metrics (its own registry, so two apps in one process never share counters):
 * requests and their latency per route pattern (`endpoint()` names it; raw URLs would be unbounded), error replies
 * by code, and gauges other parts of the server read on each scrape.
 */
export class Metrics {
  readonly registry = new Registry();
  private readonly requests = new Counter({
    name: 'nestkeeper_http_requests_total',
    help: 'HTTP requests answered, by method, route pattern and status',
    labelNames: ['method', 'route', 'status'],
    registers: [this.registry],
  });
  private readonly latency = new Histogram({
    name: 'nestkeeper_http_request_duration_seconds',
    help: 'Time from request to the end of the reply, by method and route pattern',
    labelNames: ['method', 'route'],
    buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
    registers: [this.registry],
  });
  private readonly errors = new Counter({
    name: 'nestkeeper_http_errors_total',
    help: "Error replies, by route pattern and the API's error code",
    labelNames: ['route', 'code'],
    registers: [this.registry],
  });

  constructor() {
    collectDefaultMetrics({ register: this.registry, prefix: 'nestkeeper_' });
  }

  /** Counts every request when its reply has gone out. */
  readonly observeRequests: RequestHandler = (req, res, next) => {
    const stop = this.latency.startTimer();
    res.once('finish', () => {
      const route = (res.locals.routePattern as string | undefined) ?? (req.originalUrl.startsWith('/api/') ? '(other api)' : '(client)');
      const method = req.method;
      stop({ method, route });
      this.requests.inc({ method, route, status: String(res.statusCode) });
      if (res.locals.errorCode) this.errors.inc({ route, code: String(res.locals.errorCode) });
    });
    next();
  };

  /** A gauge read at each scrape; a reading that fails (the database away) leaves the gauge without a value. */
  gauge(name: string, help: string, read: () => Promise<Reading[]> | Reading[], labelNames: string[] = []): void {
    new Gauge({
      name,
      help,
      labelNames,
      registers: [this.registry],
      async collect() {
        this.reset();
        const readings = await Promise.resolve()
          .then(read)
          .catch(() => []);
        for (const r of readings) r.labels ? this.set(r.labels, r.value) : this.set(r.value);
      },
    });
  }

  counter(name: string, help: string, labelNames: string[]): Counter {
    return new Counter({ name, help, labelNames, registers: [this.registry] });
  }

  /** The Prometheus text exposition. */
  readonly serve: RequestHandler = async (_req, res, next) => {
    try {
      res.set('Content-Type', this.registry.contentType).send(await this.registry.metrics());
    } catch (err) {
      next(err);
    }
  };
}

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/**
 * `/metrics` is for the operator's scraper: a bearer token (METRICS_TOKEN, made per installation), or a caller on
 * this machine that came straight to the socket (not relayed by a proxy, which would make every caller look local).
 */
export function metricsAccess(token: string | undefined): RequestHandler {
  return (req, _res, next) => {
    const given = /^Bearer (.+)$/.exec(req.headers.authorization ?? '')?.[1];
    if (given !== undefined && token && sameSecret(given, token)) return next();
    const direct = LOOPBACK.has(req.socket.remoteAddress ?? '') && !req.headers['x-forwarded-for'];
    if (given === undefined && direct) return next();
    next(new AppError(given === undefined ? 401 : 403, given === undefined ? 'unauthenticated' : 'forbidden', 'The metrics need the metrics token.'));
  };
}

function sameSecret(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}
