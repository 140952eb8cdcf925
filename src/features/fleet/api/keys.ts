import { fleetQueryRoot } from '../../../lib/asset-status';
import type { AssetFilter, AssetListParams } from './types';

export const fleetKeys = {
  all: fleetQueryRoot,
  lists: () => [...fleetKeys.all, 'list'] as const,
  list: (params: AssetListParams | AssetFilter) => [...fleetKeys.lists(), params] as const,
  one: (id: string) => [...fleetKeys.all, 'one', id] as const,
  history: (id: string) => [...fleetKeys.one(id), 'history'] as const,
  record: (id: string) => [...fleetKeys.one(id), 'record'] as const,
  lookup: (code: string) => [...fleetKeys.all, 'lookup', code] as const,
};
