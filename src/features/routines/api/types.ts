export type JobRunStatus = 'succeeded' | 'failed' | 'running';

export interface JobRun {
  id: string;
  /** A scheduled run covers every firm (its counts are not shown); "run now" covers your firm. */
  scope: 'every firm' | 'your firm';
  startedAt: string;
  finishedAt: string | null;
  status: JobRunStatus;
  /** What the run did, as counts by name (e.g. `{ sent: 3, deferred: 0 }`). */
  summary: Record<string, string | number | boolean | null> | null;
  error: string | null;
}

export interface ScheduledJob {
  name: string;
  schedule: string;
  description: string;
  lastRun: JobRun | null;
}

export interface JobList {
  items: ScheduledJob[];
}
