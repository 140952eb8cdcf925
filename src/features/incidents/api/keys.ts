import type { IncidentListParams } from './types';

export const incidentsKeys = {
  all: ['incidents'] as const,
  lists: () => [...incidentsKeys.all, 'list'] as const,
  list: (params: IncidentListParams) => [...incidentsKeys.lists(), params] as const,
  one: (id: string) => [...incidentsKeys.all, 'one', id] as const,
};
