import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { EquipmentRecordView } from '../../../../shared/records/views';

export function getAssetRecord(id: string, signal?: AbortSignal): Promise<EquipmentRecordView> {
  return apiClient.get<EquipmentRecordView>(`/assets/${encodeURIComponent(id)}/record`, { signal });
}

/** The same record as a PDF (GET /api/assets/:id/record.pdf). */
export const assetRecordPdfUrl = (id: string) => apiUrl(`/assets/${encodeURIComponent(id)}/record.pdf`);

export const assetRecordQueryOptions = (id: string) =>
  queryOptions({
    queryKey: fleetKeys.record(id),
    queryFn: ({ signal }) => getAssetRecord(id, signal),
  });

export function useAssetRecord(id: string) {
  return useQuery(assetRecordQueryOptions(id));
}
