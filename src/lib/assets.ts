/** Asset types and statuses as the server has them (shared/assets/vocabulary.ts). */
export { assetTypes, assetTypeTitles, assetStatuses, tipPositions, typesWithFirmware, assetSortFields } from '../../shared/assets/vocabulary';
export type { AssetType, AssetStatus, TipPosition } from '../../shared/assets/vocabulary';
