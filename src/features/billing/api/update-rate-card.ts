import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { billingKeys } from './keys';
import type { RateCard, RateCardInput } from './types';

export function updateRateCard({ id, ...input }: RateCardInput & { id: string }): Promise<RateCard> {
  return apiClient.put<RateCard>(`/rate-cards/${encodeURIComponent(id)}`, input);
}

export function useUpdateRateCard() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateRateCard,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: billingKeys.all }),
  });
}
