import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { checksKeys } from './keys';
import type { TipValidationStatus } from '../../../../shared/checks/views';

/** A tip's validation state per mounting position (validated only when the latest check there passed). */
export function getTipValidation(assetId: string, signal?: AbortSignal): Promise<TipValidationStatus> {
  return apiClient.get<TipValidationStatus>(`/assets/${encodeURIComponent(assetId)}/tip-validation`, { signal });
}

export const tipValidationQueryOptions = (assetId: string) =>
  queryOptions({
    queryKey: checksKeys.tipValidation(assetId),
    queryFn: ({ signal }) => getTipValidation(assetId, signal),
  });

export function useTipValidation(assetId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...tipValidationQueryOptions(assetId), enabled: (options.enabled ?? true) && !!assetId });
}
