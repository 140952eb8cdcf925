/** Customer site jobs (GET/POST/PUT /api/jobs). Not the server's routines (scheduled work), which live in features/routines. */
export const siteJobsKeys = {
  all: ['site-jobs'] as const,
  list: (page: { limit: number; offset: number }) => [...siteJobsKeys.all, 'list', page] as const,
  one: (id: string) => [...siteJobsKeys.all, 'one', id] as const,
};
