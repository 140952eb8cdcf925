import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { DataSource } from 'typeorm';

/**
 * express-rate-limit's counters kept in PostgreSQL (`login_attempts`), so the
 * sign-in limit holds across every instance behind the load balancer instead
 * of multiplying with them. One statement per hit: a window that has passed
 * starts again at 1.
 */
export class PgRateLimitStore implements Store {
  private windowMs = 60_000;
  readonly localKeys = false;
  /** One prefix per limit (`login:`, `reset-email:` …), so limits sharing the table never share counters. */
  constructor(
    private readonly db: DataSource,
    readonly prefix = 'login:',
  ) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const [row] = await this.db.query(
      `INSERT INTO login_attempts (key, hits, resets_at) VALUES ($1, 1, now() + $2 * interval '1 millisecond')
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN login_attempts.resets_at <= now() THEN 1 ELSE login_attempts.hits + 1 END,
         resets_at = CASE WHEN login_attempts.resets_at <= now() THEN EXCLUDED.resets_at ELSE login_attempts.resets_at END
       RETURNING hits, resets_at`,
      [this.prefix + key, this.windowMs],
    );
    // A new window is the moment to forget counters whose windows ended long ago (indexed, usually nothing).
    if (row.hits === 1) await this.db.query(`DELETE FROM login_attempts WHERE resets_at < now() - interval '1 day'`);
    return { totalHits: row.hits, resetTime: new Date(row.resets_at) };
  }

  async decrement(key: string) {
    await this.db.query(`UPDATE login_attempts SET hits = greatest(hits - 1, 0) WHERE key = $1`, [this.prefix + key]);
  }

  async resetKey(key: string) {
    await this.db.query(`DELETE FROM login_attempts WHERE key = $1`, [this.prefix + key]);
  }
}
