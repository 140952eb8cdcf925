import { assetStatuses, assetTypes, type AssetStatus, type AssetType } from '../../../lib/assets';
import { calibrationStates, type CalibrationState } from '../../../lib/calibration';
import type { AssetFilter } from '../api/keys';

/** The fleet filter lives in the address (so Back returns to the same list, and links can share it). */
export function filterFromSearchParams(params: URLSearchParams): AssetFilter {
  const list = <T extends string>(name: string, allowed: readonly T[]) => {
    const values = (params.get(name) ?? '').split(',').filter((v): v is T => (allowed as readonly string[]).includes(v));
    return values.length ? values : undefined;
  };
  return {
    q: params.get('q') || undefined,
    type: list<AssetType>('type', assetTypes),
    status: list<AssetStatus>('status', assetStatuses),
    calibration: list<CalibrationState>('calibration', calibrationStates),
    kitId: params.get('kitId') || undefined,
  };
}

export function filterToSearchParams(filter: AssetFilter): URLSearchParams {
  const params = new URLSearchParams();
  if (filter.q) params.set('q', filter.q);
  if (filter.type?.length) params.set('type', filter.type.join(','));
  if (filter.status?.length) params.set('status', filter.status.join(','));
  if (filter.calibration?.length) params.set('calibration', filter.calibration.join(','));
  if (filter.kitId) params.set('kitId', filter.kitId);
  return params;
}
