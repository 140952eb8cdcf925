import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactAssessment, ImpactReviewView } from '../../../../shared/calibration/views';

export interface AssessImpactBookingInput {
  reviewId: string;
  bookingId: string;
  assessment: ImpactAssessment;
  note?: string;
}

export function assessImpactBooking({ reviewId, bookingId, assessment, note }: AssessImpactBookingInput): Promise<ImpactReviewView> {
  return apiClient.put<ImpactReviewView>(`/impact-reviews/${encodeURIComponent(reviewId)}/bookings/${encodeURIComponent(bookingId)}`, {
    assessment,
    ...(note ? { note } : {}),
  });
}

/** Answers with the whole review, which replaces the item's cached one. */
export function useAssessImpactBooking() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: assessImpactBooking,
    onSuccess: (review) => {
      queryClient.setQueryData(calibrationKeys.impact(review.assetId), review);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: calibrationKeys.review() }),
        queryClient.invalidateQueries({ queryKey: calibrationKeys.impactReviewLists() }),
      ]);
    },
  });
}
