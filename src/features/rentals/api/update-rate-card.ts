import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { RateCardView } from '../../../../shared/billing/views';
import type { RateCardInput } from './create-rate-card';
import { rentalsKeys } from './keys';

export function updateRateCard({ id, ...input }: RateCardInput & { id: string }): Promise<RateCardView> {
  return apiClient.put<RateCardView>(`/rate-cards/${encodeURIComponent(id)}`, input);
}

export function useUpdateRateCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateRateCard,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: rentalsKeys.all }),
  });
}
