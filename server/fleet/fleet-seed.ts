import type { Scoped } from '../db/scoped';
import type { AssetRecord, KitRecord } from './asset-records';
import { Asset } from './asset.entity';
import { Kit } from './kit.entity';

/** An asset row as a seed writes it (demo and benchmark firms). */
export type SeedAsset = Partial<Omit<AssetRecord, 'id' | 'organizationId' | 'createdAt' | 'updatedAt'>> &
  Pick<AssetRecord, 'type' | 'assetTag' | 'serialNumber'>;

/** Seeds only: kits by name; returns their ids in order. */
export async function seedKits(tx: Scoped, kits: { name: string; notes: string | null }[]): Promise<string[]> {
  return tx.insertMany(Kit, kits);
}

/** Seeds only: assets written as they stand (the benchmark firm starts with some out, held or at the lab;
 * the demo firm's items start ready and then move through custody.ts). Returns their ids in order. */
export async function seedAssets(tx: Scoped, rows: SeedAsset[], chunk?: number): Promise<string[]> {
  return tx.insertMany(Asset, rows, chunk);
}

/** Seeds only: the whole register, assets by tag and kits by name. */
export async function fleetSnapshot(tx: Scoped): Promise<{ assets: AssetRecord[]; kits: KitRecord[] }> {
  return { assets: await tx.find(Asset, { order: { assetTag: 'ASC' } }), kits: await tx.find(Kit, { order: { name: 'ASC' } }) };
}
