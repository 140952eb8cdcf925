import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactReviewView } from '../../../../shared/calibration/views';

/** 422 `review_incomplete` until every booking is assessed. */
export function closeImpactReview(reviewId: string): Promise<ImpactReviewView> {
  return apiClient.post<ImpactReviewView>(`/impact-reviews/${encodeURIComponent(reviewId)}/close`);
}

export function useCloseImpactReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: closeImpactReview,
    onSuccess: (review) => {
      queryClient.setQueryData(calibrationKeys.impact(review.assetId), review);
      return queryClient.invalidateQueries({ queryKey: calibrationKeys.all });
    },
  });
}
