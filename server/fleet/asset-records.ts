import { In } from 'typeorm';
import type { Scoped } from '../db/scoped';
import { notFound } from '../http/errors';
import { Asset } from './asset.entity';
import { Kit } from './kit.entity';

/** An asset as other components see it: read-only (its status moves through custody.ts). */
export type AssetRecord = Readonly<Omit<Asset, 'organization' | 'kit' | 'searchText'>>;
export type KitRecord = Readonly<Pick<Kit, 'id' | 'name' | 'notes'>>;

/** The asset, or the API's 404. */
export const getAsset = (tx: Scoped, id: string): Promise<AssetRecord> => tx.get(Asset, { id }, 'That asset');

export const findAsset = (tx: Scoped, id: string): Promise<AssetRecord | null> => tx.findOne(Asset, { id });

/** The assets among `ids` that exist; in packing-list order (type, then tag) when asked. */
export const assetsByIds = (tx: Scoped, ids: string[], opts: { packingOrder?: boolean } = {}): Promise<AssetRecord[]> =>
  ids.length
    ? tx.find(Asset, { where: { id: In([...new Set(ids)]) }, ...(opts.packingOrder ? { order: { type: 'ASC', assetTag: 'ASC' } as const } : {}) })
    : Promise.resolve([]);

/** The assets, row-locked until the caller's transaction ends; 404 when one is missing. */
/** Each of these assets, or 404 naming the first that the firm does not have. */
export const getAssets = (tx: Scoped, ids: string[]): Promise<AssetRecord[]> => tx.getEach(Asset, ids, 'Asset');

export async function lockAssets(tx: Scoped, ids: string[]): Promise<AssetRecord[]> {
  const unique = [...new Set(ids)];
  if (!unique.length) return [];
  const rows = await tx.find(Asset, { where: { id: In(unique) }, order: { id: 'ASC' }, lock: { mode: 'pessimistic_write' } });
  if (rows.length !== unique.length) throw notFound('That asset');
  return rows;
}

/** A kit's members. */
export const kitMembers = (tx: Scoped, kitId: string): Promise<AssetRecord[]> => tx.find(Asset, { where: { kitId } });

export const getKit = (tx: Scoped, id: string): Promise<KitRecord> => tx.get(Kit, { id }, 'That kit');

/** A knocked lithium battery is treated as damaged from now on (shown on its record and the shipping sheet). */
export async function markDamaged(tx: Scoped, asset: Pick<AssetRecord, 'id' | 'specs'>) {
  await tx.updateWhere(Asset, { id: asset.id }, { specs: { ...asset.specs, damaged: true } });
}

export type CalibrationPlan = Partial<
  Pick<Asset, 'calibrationRequired' | 'calibrationIntervalMonths' | 'calibrationProvider' | 'lastCalibratedOn' | 'dueOn' | 'notifiedCalibrationState'>
>;

/** The plan a certificate or an interval decision sets (calibration owns the rule, fleet the row). */
export async function updateCalibrationPlan(tx: Scoped, assetId: string, plan: CalibrationPlan) {
  await tx.updateWhere(Asset, { id: assetId }, plan);
}
