import { In } from 'typeorm';
import type { AssetView } from '../../shared/assets/views';
import type { AssetType } from '../../shared/assets/vocabulary';
import type { RecordPeriod } from '../../shared/records/views';
import type { Scoped } from '../db/scoped';
import type { OrgContext } from '../organizations';
import { Asset } from './asset.entity';
import { toAssetView } from './asset-view';
import type { CustodyKind } from './custody-event.entity';

/** The items as the API shows them (with their kit), in the order of `ids`; ids the firm does not have are left out. */
export async function assetViewsByIds(tx: Scoped, ctx: OrgContext, ids: string[], publicUrl: string): Promise<AssetView[]> {
  if (!ids.length) return [];
  const rows = await tx.find(Asset, { where: { id: In(ids) }, relations: { kit: true } });
  const byId = new Map(rows.map((a) => [a.id, toAssetView(a, ctx, publicUrl)]));
  return ids.flatMap((id) => byId.get(id) ?? []);
}

/** Which items an audit pack covers: every item, a kit's members or one type; ordered by asset tag. */
export type AssetSelection = { kitId?: string; type?: AssetType };

export async function assetIdsSelected(tx: Scoped, selection: AssetSelection): Promise<string[]> {
  const rows = await tx.sql<{ id: string }>(
    `SELECT id FROM assets WHERE organization_id = $1 AND ($2::uuid IS NULL OR kit_id = $2::uuid) AND ($3::text IS NULL OR type = $3::text) ORDER BY asset_tag`,
    [selection.kitId ?? null, selection.type ?? null],
  );
  return rows.map((r) => r.id);
}

/** The given ids in asset-tag order (the pack's order). */
export async function inTagOrder(tx: Scoped, ids: string[]): Promise<string[]> {
  const rows = await tx.sql<{ id: string }>(`SELECT id FROM assets WHERE organization_id = $1 AND id = ANY($2::uuid[]) ORDER BY asset_tag`, [ids]);
  return rows.map((r) => r.id);
}

export type CustodyEntry = {
  assetId: string;
  at: Date;
  kind: CustodyKind;
  actorId: string | null;
  holder: string | null;
  location: string | null;
  bookingId: string | null;
  note: string | null;
};

/** The items' chain of custody in the period (the firm's calendar days), oldest first. */
export function custodyForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod, timeZone: string): Promise<CustodyEntry[]> {
  return tx.sql<CustodyEntry>(
    `SELECT c.asset_id AS "assetId", c.at, c.kind, c.actor_user_id AS "actorId", c.holder, c.location, c.booking_id AS "bookingId", c.note
       FROM custody_events c
      WHERE c.organization_id = $1 AND c.asset_id = ANY($2::uuid[])
        AND ($3::date IS NULL OR (c.at AT TIME ZONE $5)::date >= $3::date)
        AND ($4::date IS NULL OR (c.at AT TIME ZONE $5)::date <= $4::date)
      ORDER BY c.asset_id, c.at, c.id`,
    [assetIds, period.from, period.to, timeZone],
  );
}
