import type { LabTripState } from '../../../../shared/calibration/views';

export const calibrationKeys = {
  all: ['calibration'] as const,
  review: () => [...calibrationKeys.all, 'review'] as const,
  events: (assetId: string) => [...calibrationKeys.all, 'events', assetId] as const,
  windows: (assetId: string) => [...calibrationKeys.all, 'windows', assetId] as const,
  tripWindows: (assetIds: string[]) => [...calibrationKeys.all, 'trip-windows', [...assetIds].sort().join(',')] as const,
  trips: (state?: LabTripState) => [...calibrationKeys.all, 'trips', state ?? 'all'] as const,
  impact: (assetId: string) => [...calibrationKeys.all, 'impact', assetId] as const,
  impactReviewLists: () => [...calibrationKeys.all, 'impact-reviews'] as const,
  impactReviews: (state?: 'open' | 'closed') => [...calibrationKeys.impactReviewLists(), state ?? 'all'] as const,
};
