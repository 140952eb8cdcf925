import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactNoticesView } from '../../../../shared/calibration/views';

/** `send: false` drafts one notice per customer; `send: true` queues the same notices in the outbox. */
export function createImpactNotices(reviewId: string, send: boolean): Promise<ImpactNoticesView> {
  return apiClient.post<ImpactNoticesView>(`/impact-reviews/${encodeURIComponent(reviewId)}/notices`, { send });
}

export function useCreateImpactNotices(assetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, send }: { reviewId: string; send: boolean }) => createImpactNotices(reviewId, send),
    // Sending stamps each booking's "notice queued" time.
    onSuccess: (result) => (result.sent ? queryClient.invalidateQueries({ queryKey: calibrationKeys.impact(assetId) }) : undefined),
  });
}
