import type { DataSource } from 'typeorm';

/** `manual` runs come from the owner's "run now" and may ignore time-of-day rules. */
export type JobContext = { db: DataSource; now: Date; trigger: 'schedule' | 'manual' };

/** A piece of scheduled work: a cron pattern (in `timeZone`) and a run that
 * returns a short summary for the run log. */
export type JobDefinition = {
  name: string;
  description: string;
  schedule: string;
  timeZone?: string;
  run: (ctx: JobContext) => Promise<Record<string, unknown>>;
};
