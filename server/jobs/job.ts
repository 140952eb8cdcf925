import type { DataSource } from 'typeorm';

/**
 * `manual` runs come from an owner's "run now" and may ignore time-of-day rules;
 * they carry that owner's `organizationId` and do only that firm's work.
 * Scheduled runs cover every firm (`organizationId` null).
 */
export type JobContext = { db: DataSource; now: Date; trigger: 'schedule' | 'manual'; organizationId: string | null };

/** A piece of scheduled work: a cron pattern (in `timeZone`) and a run that
 * returns a short summary for the run log. */
export type JobDefinition = {
  name: string;
  description: string;
  schedule: string;
  timeZone?: string;
  run: (ctx: JobContext) => Promise<Record<string, unknown>>;
};
