import { randomBytes } from 'node:crypto';

export type StoredResponse = { status: number; body: unknown };

export type IdempotencyEntry = {
  fingerprint: string;
  createdAt: number;
  /** Undefined while the first request is still running. */
  response?: StoredResponse;
};

export type PaymentFakeSettings = {
  /** When set, only this exact key is accepted; otherwise any `sk_test_` key. */
  apiKey?: string;
  webhookUrl?: string;
  webhookSecret?: string;
  /** Waits before each re-delivery of a webhook that was not answered 2xx
   * (one entry per retry). Defaults to a few seconds, growing. */
  webhookRetryDelaysMs?: number[];
};

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

export function randomToken(length: number): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return out;
}

/** All state of one payment-fake instance, in memory. Each resource module keeps
 * its objects in its own table (`store.table<Customer>('customers')`), so adding a
 * resource never touches this file. */
export class PaymentStore {
  private readonly tables = new Map<string, Map<string, unknown>>();
  readonly idempotency = new Map<string, IdempotencyEntry>();
  /** Added to the base clock by `advanceClock` (POST /__fake/clock). */
  private clockOffsetMs = 0;
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly aborts = new Set<AbortController>();
  private disposed = false;

  constructor(
    readonly settings: PaymentFakeSettings = {},
    /** Injectable base clock (ms since epoch) so tests can move time. */
    private readonly baseClock: () => number = Date.now,
  ) {}

  /** The fake's "now" in ms: the base clock plus any advance a test asked for. */
  readonly clock = (): number => this.baseClock() + this.clockOffsetMs;

  /** Moves the fake's clock forward (never back). */
  advanceClock(seconds: number): void {
    if (!(seconds >= 0)) throw new RangeError('The payment fake clock only moves forward.');
    this.clockOffsetMs += seconds * 1000;
  }

  /** A timer that `dispose()` clears (webhook retries, hung fault responses). */
  schedule(fn: () => void, ms: number): NodeJS.Timeout | undefined {
    if (this.disposed) return undefined;
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      fn();
    }, ms);
    timer.unref();
    this.timers.add(timer);
    return timer;
  }

  cancelScheduled(timer: NodeJS.Timeout | undefined): void {
    if (!timer) return;
    clearTimeout(timer);
    this.timers.delete(timer);
  }

  /** An abort signal for outgoing work (webhook POSTs) that `dispose()` aborts. */
  abortController(): AbortController {
    const controller = new AbortController();
    if (this.disposed) controller.abort();
    else this.aborts.add(controller);
    return controller;
  }

  releaseAbortController(controller: AbortController): void {
    this.aborts.delete(controller);
  }

  get isDisposed(): boolean {
    return this.disposed;
  }

  /** Stops all pending timers and outgoing requests (on close). */
  dispose(): void {
    this.disposed = true;
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    for (const a of this.aborts) a.abort();
    this.aborts.clear();
  }

  table<T>(name: string): Map<string, T> {
    let table = this.tables.get(name);
    if (!table) {
      table = new Map();
      this.tables.set(name, table);
    }
    return table as Map<string, T>;
  }

  /** Provider-style id: `cus_` + 24 base62 characters. */
  newId(prefix: string): string {
    return `${prefix}_${randomToken(24)}`;
  }

  /** Unix seconds, the provider's `created` unit. */
  nowSeconds(): number {
    return Math.floor(this.clock() / 1000);
  }

  reset(): void {
    this.tables.clear();
    this.idempotency.clear();
    this.clockOffsetMs = 0;
  }
}
