import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { calibrationKeys } from './keys';
import type { CalibrationReviewView } from '../../../../shared/calibration/views';

export function getCalibrationReview(signal?: AbortSignal): Promise<CalibrationReviewView> {
  return apiClient.get<CalibrationReviewView>('/calibration/review', { signal });
}

export const calibrationReviewQueryOptions = () => queryOptions({ queryKey: calibrationKeys.review(), queryFn: ({ signal }) => getCalibrationReview(signal) });

export function useCalibrationReview() {
  return useQuery(calibrationReviewQueryOptions());
}

/** The same overdue and due-soon lists as downloads. */
export const calibrationReviewCsvUrl = () => apiUrl('/calibration/review.csv');
export const calibrationReviewPdfUrl = () => apiUrl('/calibration/review.pdf');
