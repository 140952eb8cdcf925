/** Customer site jobs (GET/POST/PUT /api/jobs). Not the server's scheduled jobs, which live in features/jobs. */
export const siteJobsKeys = {
  all: ['site-jobs'] as const,
  list: (page: { limit: number; offset: number }) => [...siteJobsKeys.all, 'list', page] as const,
  one: (id: string) => [...siteJobsKeys.all, 'one', id] as const,
};
