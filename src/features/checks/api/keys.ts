import type { CheckKind } from '../../../lib/checks';

export interface CheckListParams {
  assetId?: string;
  kind?: CheckKind;
  limit: number;
  offset: number;
}

export const checksKeys = {
  all: ['checks'] as const,
  lists: () => [...checksKeys.all, 'list'] as const,
  list: (params: CheckListParams) => [...checksKeys.lists(), params] as const,
  one: (id: string) => [...checksKeys.all, 'one', id] as const,
  tipValidation: (assetId: string) => [...checksKeys.all, 'tip-validation', assetId] as const,
  toDo: () => [...checksKeys.all, 'to-do'] as const,
  tipForecast: (assetId: string) => [...checksKeys.all, 'tip-forecast', assetId] as const,
  forecastsSoon: () => [...checksKeys.all, 'forecasts-soon'] as const,
};
