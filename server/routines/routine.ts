import type { DataSource } from 'typeorm';
import type { Logger } from '../http/logging';

/**
 * `manual` runs come from an owner's "run now" and may ignore time-of-day rules;
 * they carry that owner's `organizationId` and do only that firm's work.
 * Scheduled runs cover every firm (`organizationId` null).
 */
export type RoutineContext = { db: DataSource; now: Date; trigger: 'schedule' | 'manual'; organizationId: string | null; log?: Logger };

/** Work the server does on its own, on a cron pattern (in `timeZone`); a run
 * returns a short summary for the run log. */
export type Routine = {
  name: string;
  description: string;
  schedule: string;
  timeZone?: string;
  run: (ctx: RoutineContext) => Promise<Record<string, unknown>>;
};
