import { incidentsQueryRoot } from '../../../lib/asset-status';
import type { IncidentState } from '../../../../shared/incidents/vocabulary';

export interface IncidentListParams {
  assetId?: string;
  state?: IncidentState[];
  limit: number;
  offset: number;
}

export const incidentsKeys = {
  all: incidentsQueryRoot,
  lists: () => [...incidentsKeys.all, 'list'] as const,
  list: (params: IncidentListParams) => [...incidentsKeys.lists(), params] as const,
  one: (id: string) => [...incidentsKeys.all, 'one', id] as const,
};
