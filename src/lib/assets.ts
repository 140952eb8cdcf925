/** Asset types, statuses and payload shapes shared with the server (shared/assets/vocabulary.ts; payload types from shared/schemas/assets.ts). */
export {
  assetTypes,
  assetTypeTitles,
  assetStatuses,
  tipPositions,
  typesWithFirmware,
  assetSortFields,
} from '../../shared/assets/vocabulary';
export type {
  AssetType,
  AssetStatus,
  TipPosition,
  AssetView,
  KitView,
  KitReadiness,
} from '../../shared/schemas/assets';
