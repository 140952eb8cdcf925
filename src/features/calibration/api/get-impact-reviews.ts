import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Page } from '../../../../shared/lists/page';
import { calibrationKeys } from './keys';
import type { ImpactReviewView } from '../../../../shared/calibration/views';

export function getImpactReviews(state?: 'open' | 'closed', signal?: AbortSignal): Promise<Page<ImpactReviewView>> {
  return apiClient.get<Page<ImpactReviewView>>('/impact-reviews', { query: { state }, signal });
}

export const impactReviewsQueryOptions = (state?: 'open' | 'closed') =>
  queryOptions({ queryKey: calibrationKeys.impactReviews(state), queryFn: ({ signal }) => getImpactReviews(state, signal) });

export function useImpactReviews(state?: 'open' | 'closed', options: { enabled?: boolean } = {}) {
  return useQuery({ ...impactReviewsQueryOptions(state), enabled: options.enabled ?? true });
}
