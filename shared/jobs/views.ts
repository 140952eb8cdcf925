/** What the scheduled-jobs API answers. Plain types, no zod: the browser imports them as types only. */

export type JobRunStatus = 'succeeded' | 'failed' | 'running';

export type JobRunView = {
  id: string;
  trigger: 'schedule' | 'manual';
  /** A scheduled run covers every firm (its counts are not shown); "run now" covers your firm. */
  scope: 'every firm' | 'your firm';
  scheduledFor: string | null;
  startedAt: string;
  finishedAt: string | null;
  status: JobRunStatus;
  /** What the run did, as counts by name (e.g. `{ sent: 3, deferred: 0 }`). */
  summary: Record<string, unknown> | null;
  error: string | null;
};

export type ScheduledJobView = { name: string; description: string; schedule: string; lastRun: JobRunView | null };

/** `GET /api/admin/jobs`. */
export type ScheduledJobsView = { items: ScheduledJobView[] };

/** `POST /api/admin/jobs/:name/run`. */
export type JobRunReply = { run: JobRunView };
