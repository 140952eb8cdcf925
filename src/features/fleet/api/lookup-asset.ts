import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { fleetKeys } from './keys';
import type { AssetView } from '../../../../shared/assets/views';

/** Finds an asset by its asset tag, RFID tag or QR label payload; 404 when nothing matches. */
export function lookupAsset(code: string, signal?: AbortSignal): Promise<AssetView> {
  return apiClient.get<AssetView>('/assets/lookup', { query: { code }, signal });
}

export const lookupAssetQueryOptions = (code: string) =>
  queryOptions({
    queryKey: fleetKeys.lookup(code),
    queryFn: ({ signal }) => lookupAsset(code, signal),
    staleTime: 0,
  });

export function useLookupAsset(code: string | undefined) {
  return useQuery({ ...lookupAssetQueryOptions(code ?? ''), enabled: !!code });
}
