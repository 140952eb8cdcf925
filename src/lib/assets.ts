/** Asset types and statuses (shared/assets/vocabulary.ts) and the asset and kit views (shared/assets/views.ts), as the server has them. */
export {
  assetTypes,
  assetTypeTitles,
  assetStatuses,
  tipPositions,
  typesWithFirmware,
  assetSortFields,
} from '../../shared/assets/vocabulary';
export type { AssetType, AssetStatus, TipPosition } from '../../shared/assets/vocabulary';
export type { AssetView, KitView, KitReadiness } from '../../shared/assets/views';
