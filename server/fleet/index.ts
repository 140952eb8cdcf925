/** Fleet's surface for other components: assets are read here and change status only through custody.ts. */
import { Asset } from './asset.entity';
import { CustodyEvent } from './custody-event.entity';
import { Kit } from './kit.entity';

export const fleetEntities = [Asset, Kit, CustodyEvent];
export { AssetBound } from './asset-bound';
export type { CustodyKind } from './custody-event.entity';
export { assetMoves, moveAssets, noteCustody, recordPastCustody, type CustodyDetails, type CustodyNote } from './custody';
export {
  assetsByIds,
  findAsset,
  getAsset,
  getAssets,
  getKit,
  kitMembers,
  lockAssets,
  markDamaged,
  updateCalibrationPlan,
  type AssetRecord,
  type CalibrationPlan,
  type KitRecord,
} from './asset-records';
export { assetIdsSelected, assetViewsByIds, custodyForRecord, inTagOrder, type AssetSelection, type CustodyEntry } from './record-entries';
export { fleetSnapshot, seedAssets, seedKits, type SeedAsset } from './fleet-seed';
