/** What the routines API answers. Plain types, no zod: the browser imports them as types only. */

export type RoutineRunStatus = 'succeeded' | 'failed' | 'running';

export type RoutineRunView = {
  id: string;
  trigger: 'schedule' | 'manual';
  /** A scheduled run covers every firm (its counts are not shown); "run now" covers your firm. */
  scope: 'every firm' | 'your firm';
  scheduledFor: string | null;
  startedAt: string;
  finishedAt: string | null;
  status: RoutineRunStatus;
  /** What the run did, as counts by name (e.g. `{ sent: 3, deferred: 0 }`). */
  summary: Record<string, unknown> | null;
  error: string | null;
};

export type RoutineView = { name: string; description: string; schedule: string; lastRun: RoutineRunView | null };

/** `GET /api/admin/routines`. */
export type RoutinesView = { items: RoutineView[] };

/** `POST /api/admin/routines/:name/run`. */
export type RoutineRunReply = { run: RoutineRunView };
