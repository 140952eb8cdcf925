// Transitional, for server/billing/deposit-renewals.job.ts only (another change owns billing): once it imports
// `Routine` from '../routines', delete this folder.
export type { Routine as JobDefinition } from '../routines';
