import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { ImpactReview } from './types';

export function getImpactReviews(state?: 'open' | 'closed', signal?: AbortSignal): Promise<{ items: ImpactReview[] }> {
  return apiClient.get<{ items: ImpactReview[] }>('/impact-reviews', { query: { state }, signal });
}

export const impactReviewsQueryOptions = (state?: 'open' | 'closed') =>
  queryOptions({ queryKey: calibrationKeys.impactReviews(state), queryFn: ({ signal }) => getImpactReviews(state, signal) });

export function useImpactReviews(state?: 'open' | 'closed', options: { enabled?: boolean } = {}) {
  return useQuery({ ...impactReviewsQueryOptions(state), enabled: options.enabled ?? true });
}
