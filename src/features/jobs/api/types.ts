export type JobRunStatus = 'succeeded' | 'failed' | 'running';

export interface JobRun {
  id: string;
  startedAt: string;
  finishedAt: string | null;
  status: JobRunStatus;
  summary: string | null;
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
