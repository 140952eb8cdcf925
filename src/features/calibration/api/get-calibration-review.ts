import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { CalibrationReview } from './types';

export function getCalibrationReview(signal?: AbortSignal): Promise<CalibrationReview> {
  return apiClient.get<CalibrationReview>('/calibration/review', { signal });
}

export const calibrationReviewQueryOptions = () =>
  queryOptions({ queryKey: calibrationKeys.review(), queryFn: ({ signal }) => getCalibrationReview(signal) });

export function useCalibrationReview() {
  return useQuery(calibrationReviewQueryOptions());
}

/** The same overdue and due-soon lists as downloads. */
export const calibrationReviewCsvUrl = () => apiUrl('/calibration/review.csv');
export const calibrationReviewPdfUrl = () => apiUrl('/calibration/review.pdf');
