import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { RateCardView } from '../../../../shared/billing/views';
import type { Page } from '../../../../shared/lists/page';
import { rentalsKeys } from './keys';

export function getRateCards(signal?: AbortSignal): Promise<Page<RateCardView>> {
  return apiClient.get<Page<RateCardView>>('/rate-cards', { signal });
}

export const rateCardsQueryOptions = () => queryOptions({ queryKey: rentalsKeys.rateCards(), queryFn: ({ signal }) => getRateCards(signal) });

export function useRateCards() {
  return useQuery(rateCardsQueryOptions());
}
