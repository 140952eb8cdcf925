import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPackPreview } from '../../../../shared/records/views';
import { apiClient } from '../../../lib/api-client';
import { recordsKeys, type AuditPackChoice } from './keys';

export const packQuery = (choice: AuditPackChoice) => ({ ...choice });

export function getAuditPackPreview(choice: AuditPackChoice, signal?: AbortSignal): Promise<AuditPackPreview> {
  return apiClient.get<AuditPackPreview>('/audit-pack/preview', { query: packQuery(choice), signal });
}

export const auditPackPreviewQueryOptions = (choice: AuditPackChoice) =>
  queryOptions({
    queryKey: recordsKeys.packPreview(choice),
    queryFn: ({ signal }) => getAuditPackPreview(choice, signal),
    placeholderData: keepPreviousData,
  });

/** Counted before building, so the owner sees the pack's size and the download's progress has a goal. */
export function useAuditPackPreview(choice: AuditPackChoice, enabled: boolean) {
  return useQuery({ ...auditPackPreviewQueryOptions(choice), enabled });
}
