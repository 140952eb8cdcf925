import type { DataSource } from 'typeorm';

export type JobContext = { db: DataSource; now: Date };

/** A piece of scheduled work: a cron pattern (in `timeZone`) and a run that
 * returns a short summary for the run log. */
export type JobDefinition = {
  name: string;
  description: string;
  schedule: string;
  timeZone?: string;
  run: (ctx: JobContext) => Promise<Record<string, unknown>>;
};
