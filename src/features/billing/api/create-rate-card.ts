import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { RateCard, RateCardInput } from './types';

export function createRateCard(input: RateCardInput): Promise<RateCard> {
  return apiClient.post<RateCard>('/rate-cards', input);
}

export function useCreateRateCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRateCard,
    // A new card can price what had no rate: rate cards and quotes refresh.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: billingKeys.all }),
  });
}
