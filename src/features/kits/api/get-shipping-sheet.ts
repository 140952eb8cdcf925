import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient, apiUrl } from '../../../lib/api-client';
import { kitsKeys } from './keys';
import type { ShippingSheetView } from '../../../../shared/assets/views';

export function getShippingSheet(id: string, signal?: AbortSignal): Promise<ShippingSheetView> {
  return apiClient.get<ShippingSheetView>(`/kits/${encodeURIComponent(id)}/shipping-sheet`, { signal });
}

export const shippingSheetPdfUrl = (id: string) => apiUrl(`/kits/${encodeURIComponent(id)}/shipping-sheet.pdf`);

export const shippingSheetQueryOptions = (id: string) =>
  queryOptions({
    queryKey: kitsKeys.shippingSheet(id),
    queryFn: ({ signal }) => getShippingSheet(id, signal),
  });

export function useShippingSheet(id: string) {
  return useQuery(shippingSheetQueryOptions(id));
}
