import type { AssetType } from '../../../../shared/assets/vocabulary';

export { holdReasonWords, releaseRule, tipPositionsOf } from '../../../../shared/holds/release-rule';

/** What the hold screens need of the item: its rule of release depends on its type (and a tip's positions). */
export type HeldAsset = { id: string; assetTag: string; type: AssetType; specs: { positions?: unknown } };
