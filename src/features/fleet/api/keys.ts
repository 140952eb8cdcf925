import { fleetQueryRoot } from '../../../lib/asset-status';
import type { AssetStatus, AssetType } from '../../../lib/assets';
import type { CalibrationState } from '../../../lib/calibration';

/** The fleet list's filters (the filter bar; also the CSV export's). */
export interface AssetFilter {
  q?: string;
  type?: AssetType[];
  status?: AssetStatus[];
  calibration?: CalibrationState[];
  /** A kit's id, or `none` for assets in no kit. */
  kitId?: string;
}

export interface AssetListParams extends AssetFilter {
  /** A sort field, `-` first for descending (e.g. `-dueOn`). */
  sort?: string;
  limit: number;
  offset: number;
}

/** The equipment record's period, both days included; an end left out is open (all time when both are). */
export interface RecordPeriodChoice {
  from?: string;
  to?: string;
}

export const fleetKeys = {
  all: fleetQueryRoot,
  lists: () => [...fleetKeys.all, 'list'] as const,
  list: (params: AssetListParams | AssetFilter) => [...fleetKeys.lists(), params] as const,
  one: (id: string) => [...fleetKeys.all, 'one', id] as const,
  history: (id: string) => [...fleetKeys.one(id), 'history'] as const,
  record: (id: string, period: RecordPeriodChoice = {}) => [...fleetKeys.one(id), 'record', period] as const,
  lookup: (code: string) => [...fleetKeys.all, 'lookup', code] as const,
};
