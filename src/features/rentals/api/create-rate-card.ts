import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { RateCardView } from '../../../../shared/billing/views';
import { rentalsKeys } from './keys';

/** What the rate card form sends (POST and PUT /api/rate-cards). */
export type RateCardInput = Omit<RateCardView, 'id'>;

export function createRateCard(input: RateCardInput): Promise<RateCardView> {
  return apiClient.post<RateCardView>('/rate-cards', input);
}

export function useCreateRateCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRateCard,
    // A new card can price what had no rate: rate cards and quotes refresh.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: rentalsKeys.all }),
  });
}
