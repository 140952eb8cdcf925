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

  constructor(
    readonly settings: PaymentFakeSettings = {},
    /** Injectable clock (ms since epoch) so tests can move time. */
    readonly clock: () => number = Date.now,
  ) {}

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
  }
}
