/** Scheduled work's surface: the shape of a job other components define. */
export type { JobContext, JobDefinition } from './job';
