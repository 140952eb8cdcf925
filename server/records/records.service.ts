import type { Writable } from 'node:stream';
import type { DataSource } from 'typeorm';
import { assetTypeTitles } from '../../shared/assets/vocabulary';
import type { AuditPackPreview, EquipmentRecordView, RecordPeriod } from '../../shared/records/views';
import type { AuditPackQuery } from '../../shared/schemas/records';
import { readInOrganization, type Actor } from '../db/transaction';
import { equipmentRecordPdf } from '../documents/equipment-record-pdf';
import { getAsset, getKit } from '../fleet';
import { formatOf, loadOrgContext } from '../organizations';
import { packItems, packPreview, writeAuditPack } from './audit-pack';
import { assembleRecords } from './record-assembly';

const openPeriod = (p: { from?: string; to?: string }): RecordPeriod => ({ from: p.from ?? null, to: p.to ?? null });

/** The equipment record of one item (JSON and PDF) and the owner's audit pack over a period. */
export class RecordsService {
  constructor(
    private readonly db: DataSource,
    private readonly publicUrl: string,
  ) {}

  private one(actor: Actor, id: string, period: { from?: string; to?: string }) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      await getAsset(tx, id);
      const ctx = await loadOrgContext(tx);
      const [record] = await assembleRecords(tx, ctx, [id], openPeriod(period), this.publicUrl);
      return { record, ctx };
    });
  }

  async record(actor: Actor, id: string, period: { from?: string; to?: string }): Promise<EquipmentRecordView> {
    return (await this.one(actor, id, period)).record.view;
  }

  /** The record as PDF, with each readable certificate annexed. */
  async recordPdf(actor: Actor, id: string, period: { from?: string; to?: string }) {
    const { record, ctx } = await this.one(actor, id, period);
    const pdf = await equipmentRecordPdf({
      ...record,
      format: formatOf(ctx),
      publicUrl: this.publicUrl,
      printedAt: new Date(),
      placement: { annex: true },
    });
    return { pdf, assetTag: record.view.asset.assetTag };
  }

  /** Counted before the pack is built, so the owner sees its size and the download shows progress against it. */
  preview(actor: Actor, query: AuditPackQuery): Promise<AuditPackPreview> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      return packPreview(tx, await packItems(tx, ctx, query), { from: query.from, to: query.to });
    });
  }

  /** Checks the choices and counts the items (a 4xx still goes out as JSON), then returns the writer of the ZIP. */
  prepareAuditPack(actor: Actor, query: AuditPackQuery) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const ids = await packItems(tx, ctx, query);
      const scopeText =
        query.scope === 'kit'
          ? `kit ${(await getKit(tx, query.kitId!)).name}`
          : query.scope === 'type'
            ? `every ${assetTypeTitles[query.type!].toLowerCase()}`
            : query.scope === 'flagged'
              ? 'items found out of tolerance or held in the period'
              : 'every item';
      const read = <T>(work: (scoped: typeof tx) => Promise<T>) => readInOrganization(this.db, actor.organizationId, work);
      return {
        items: ids.length,
        write: (out: Writable) => writeAuditPack(out, ids, query, { read, ctx, publicUrl: this.publicUrl, scopeText }),
      };
    });
  }
}
