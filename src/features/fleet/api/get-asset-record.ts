import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { fleetKeys, type RecordPeriodChoice } from './keys';
import type { EquipmentRecordView } from '../../../../shared/records/views';

/** Only the ends that are set go out: an open end means from the first record, or up to today. */
const periodQuery = (period: RecordPeriodChoice) => ({ ...(period.from ? { from: period.from } : {}), ...(period.to ? { to: period.to } : {}) });

export function getAssetRecord(id: string, period: RecordPeriodChoice, signal?: AbortSignal): Promise<EquipmentRecordView> {
  return apiClient.get<EquipmentRecordView>(`/assets/${encodeURIComponent(id)}/record`, { query: periodQuery(period), signal });
}

/** The same record as a PDF (GET /api/assets/:id/record.pdf), for the same period. */
export const assetRecordPdfUrl = (id: string, period: RecordPeriodChoice = {}) => apiUrl(`/assets/${encodeURIComponent(id)}/record.pdf`, periodQuery(period));

export const assetRecordQueryOptions = (id: string, period: RecordPeriodChoice = {}) =>
  queryOptions({
    queryKey: fleetKeys.record(id, period),
    queryFn: ({ signal }) => getAssetRecord(id, period, signal),
    // A new period keeps the last record (and the picker) on screen until the new one arrives.
    placeholderData: keepPreviousData,
  });

export function useAssetRecord(id: string, period: RecordPeriodChoice = {}) {
  return useQuery(assetRecordQueryOptions(id, period));
}
