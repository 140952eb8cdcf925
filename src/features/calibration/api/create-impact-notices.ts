import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactNoticesView, NoticeGroup } from '../../../../shared/calibration/views';

/** A notice as the person edited it, matched to its draft by address and group. */
export type EditedNotice = { to: string; group: NoticeGroup; subject: string; text: string };

/** `send: false` drafts one notice per customer; `send: true` queues them in the outbox, with the words as edited. */
export function createImpactNotices(reviewId: string, send: boolean, notices?: EditedNotice[]): Promise<ImpactNoticesView> {
  return apiClient.post<ImpactNoticesView>(`/impact-reviews/${encodeURIComponent(reviewId)}/notices`, { send, ...(notices ? { notices } : {}) });
}

export function useCreateImpactNotices(assetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reviewId, send, notices }: { reviewId: string; send: boolean; notices?: EditedNotice[] }) => createImpactNotices(reviewId, send, notices),
    // Sending stamps each booking's notice and its outbox message.
    onSuccess: (result) => (result.sent ? queryClient.invalidateQueries({ queryKey: calibrationKeys.impact(assetId) }) : undefined),
  });
}
