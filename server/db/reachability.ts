import type { DataSource } from 'typeorm';
import type { Logger } from '../http/logging';

/**
 * Whether PostgreSQL answers, as this instance last saw it. A failed request or routine makes it look at once (one
 * probe at a time however many ask); while the database is away it looks again every few seconds, so the API's
 * 503s, the paused routines and the outage banner all end by themselves when it is back.
 */
export class DatabaseWatch {
  private up = true;
  private probe: Promise<boolean> | null = null;
  private timer: NodeJS.Timeout | null = null;

  constructor(
    private readonly db: DataSource,
    private readonly log: Logger,
    private readonly lookEveryMs = 2_000,
  ) {}

  get reachable(): boolean {
    return this.up;
  }

  /** Ask PostgreSQL now (joining a probe already under way). */
  check(): Promise<boolean> {
    this.probe ??= this.db
      .query('SELECT 1')
      .then(
        () => true,
        () => false,
      )
      .then((answered) => {
        this.probe = null;
        this.record(answered);
        return answered;
      });
    return this.probe;
  }

  /** Something failed as if the database were away: find out. */
  suspect(): void {
    void this.check();
  }

  private record(answered: boolean) {
    if (answered === this.up) return;
    this.up = answered;
    if (answered) {
      this.log.info('database reachable again: API answers, routines resume');
      if (this.timer) clearInterval(this.timer);
      this.timer = null;
    } else {
      this.log.warn('database unreachable: API answers 503 with Retry-After, routines paused');
      this.timer = setInterval(() => void this.check(), this.lookEveryMs);
      this.timer.unref();
    }
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }
}
