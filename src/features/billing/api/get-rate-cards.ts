import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { Page, RateCard } from './types';

export function getRateCards(signal?: AbortSignal): Promise<Page<RateCard>> {
  return apiClient.get<Page<RateCard>>('/rate-cards', { signal });
}

export const rateCardsQueryOptions = () => queryOptions({ queryKey: billingKeys.rateCards(), queryFn: ({ signal }) => getRateCards(signal) });

export function useRateCards() {
  return useQuery(rateCardsQueryOptions());
}
