import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactReviewView } from '../../../../shared/calibration/views';

/** Accept the suggested triage for every booking not yet assessed; the numbers and rule are kept with each. */
export function acceptImpactSuggestions(reviewId: string): Promise<ImpactReviewView> {
  return apiClient.post<ImpactReviewView>(`/impact-reviews/${encodeURIComponent(reviewId)}/accept-suggestions`, {});
}

export function useAcceptImpactSuggestions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptImpactSuggestions,
    onSuccess: (review) => {
      queryClient.setQueryData(calibrationKeys.impact(review.assetId), review);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: calibrationKeys.review() }),
        queryClient.invalidateQueries({ queryKey: calibrationKeys.impactReviewLists() }),
      ]);
    },
  });
}
