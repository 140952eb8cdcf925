import type { DataSource } from 'typeorm';
import type { AssetView, ShippingSheetView } from '../../shared/assets/views';
import { shippingSheet } from '../../shared/batteries/shipping-class';
import type { AssetListQuery } from '../../shared/schemas/assets';
import { inOrganization, type Actor } from '../db/transaction';
import { assetLabelPdf, kitLabelSheetPdf } from '../documents/asset-label';
import { shippingSheetPdf } from '../documents/shipping-sheet-pdf';
import { documentFirm, loadOrgContext } from '../organizations';
import type { DocumentFirm } from '../documents/document-layout';
import { Asset } from './asset.entity';
import { assetsToCsv } from './asset-csv';
import { findAssets } from './asset-list';
import { toAssetView } from './asset-view';
import { Kit } from './kit.entity';

const EXPORT_LIMIT = 100_000;

/** Printable and downloadable views of the register: labels, sheets, CSV (the equipment record is records/). */
export class FleetDocumentsService {
  constructor(
    private readonly db: DataSource,
    private readonly publicUrl: string,
  ) {}

  private withAsset<T>(actor: Actor, id: string, work: (view: AssetView, firm: DocumentFirm) => Promise<T> | T) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const asset = await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } });
      return work(toAssetView(asset, ctx, this.publicUrl), documentFirm(ctx));
    });
  }

  label(actor: Actor, id: string) {
    return this.withAsset(actor, id, (view, firm) => assetLabelPdf(view, firm));
  }

  exportCsv(actor: Actor, filter: Omit<AssetListQuery, 'limit' | 'offset'>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const { assets } = await findAssets(tx, ctx, filter, { limit: EXPORT_LIMIT, offset: 0 });
      return assetsToCsv(assets.map((a) => toAssetView(a, ctx, this.publicUrl)));
    });
  }

  private withKit<T>(actor: Actor, id: string, work: (kit: Kit, members: AssetView[], firm: DocumentFirm) => Promise<T> | T) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const kit = await tx.get(Kit, { id }, 'That kit');
      const members = await tx.find(Asset, { where: { kitId: id }, order: { type: 'ASC', assetTag: 'ASC' } });
      return work(
        kit,
        members.map((m) => toAssetView(Object.assign(m, { kit }), ctx, this.publicUrl)),
        documentFirm(ctx),
      );
    });
  }

  kitLabels(actor: Actor, id: string) {
    return this.withKit(actor, id, (kit, members, firm) => kitLabelSheetPdf(kit.name, members, firm));
  }

  shippingSheet(actor: Actor, id: string): Promise<ShippingSheetView> {
    return this.withKit(actor, id, (kit, members) => ({ kit: { id: kit.id, name: kit.name }, ...batterySheet(members) }));
  }

  shippingSheetPdf(actor: Actor, id: string) {
    return this.withKit(actor, id, (kit, members, firm) => shippingSheetPdf(kit.name, firm, batterySheet(members)));
  }
}

function batterySheet(members: AssetView[]) {
  const batteries = members.filter((m) => m.type === 'battery');
  const sheet = shippingSheet(
    batteries.map((b) => ({
      assetTag: b.assetTag,
      nominalVoltageV: Number(b.specs.nominalVoltageV),
      ratedCapacityAh: Number(b.specs.ratedCapacityAh),
      damaged: b.specs.damaged === true,
    })),
  );
  return { ...sheet, lines: sheet.lines.map((l, i) => ({ assetId: batteries[i].id, ...l })) };
}
