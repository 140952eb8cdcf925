import { In, type DataSource } from 'typeorm';
import type { AssetHistoryEntry, AssetView } from '../../shared/assets/views';
import { dueOnForPlan } from '../../shared/calibration/due-date';
import { specsByType, typesWithFirmware, type AssetListQuery, type CreateAssetPayload, type UpdateAssetPayload } from '../../shared/schemas/assets';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { AppError, conflict, ruleBroken } from '../http/errors';
import { isUuid } from '../http/ids';
import { loadOrgContext } from '../organizations';
import { Asset } from './asset.entity';
import { findAssets, nearMisses } from './asset-list';
import { searchKey } from '../../shared/assets/search-key';
import { historyLine, repeatsCustody } from '../../shared/assets/record-words';
import { toAssetView } from './asset-view';
import { moveAssets, noteCustody } from './custody';
import { listReply } from '../http/list-reply';
import type { Page } from '../../shared/lists/page';

const isUniqueViolation = (err: unknown) => (err as { code?: string })?.code === '23505';

/** Fields the person edits directly (the rest are derived or belong to other flows). */
const editableFields = [
  'assetTag',
  'serialNumber',
  'manufacturer',
  'model',
  'firmwareVersion',
  'rfidTag',
  'location',
  'replacementValueMinor',
  'notes',
] as const;

export class AssetsService {
  constructor(
    private readonly db: DataSource,
    private readonly publicUrl: string,
  ) {}

  list(actor: Actor, query: AssetListQuery): Promise<Page<AssetView>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const { assets, total } = await findAssets(tx, ctx, query, query);
      return { items: assets.map((a) => toAssetView(a, ctx, this.publicUrl)), total };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      return toAssetView(await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } }), ctx, this.publicUrl);
    });
  }

  /** Several assets as the API shows them, by asset tag (unknown or another firm's ids are left out). */
  views(actor: Actor, ids: string[]): Promise<AssetView[]> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      if (!ids.length) return [];
      const ctx = await loadOrgContext(tx);
      const rows = await tx.find(Asset, { where: { id: In(ids) }, relations: { kit: true }, order: { assetTag: 'ASC' } });
      return rows.map((a) => toAssetView(a, ctx, this.publicUrl));
    });
  }

  /** Asset tag, RFID tag, or a QR label's payload (which ends in the asset's id). */
  lookup(actor: Actor, code: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const trimmed = code.trim();
      const tail = trimmed.slice(-36);
      const id = isUuid(tail) ? tail : undefined;
      const qb = () => tx.select(Asset, 'a').leftJoinAndSelect('a.kit', 'k');
      const key = searchKey(trimmed);
      const asset = id
        ? await qb().andWhere('a.id = :id', { id }).getOne()
        : ((await qb()
            .andWhere('(upper(a.asset_tag) = upper(:code) OR upper(a.rfid_tag) = upper(:code))', { code: trimmed })
            .orderBy('a.asset_tag = :code', 'DESC')
            .getOne()) ?? (key ? await this.forgivingMatch(tx, key) : null));
      if (!asset) {
        const suggestions = key ? await nearMisses(tx, key) : [];
        throw new AppError(
          404,
          'not_found',
          `Nothing in your fleet matches "${trimmed}".${suggestions.length ? ` Did you mean ${suggestions.map((s) => s.assetTag).join(', ')}?` : ''}`,
          { suggestions },
        );
      }
      return toAssetView(asset, ctx, this.publicUrl);
    });
  }

  /**
   * A tag or RFID tag typed loosely: the one asset whose tag or RFID tag has the same forgiving form, else the one
   * RFID tag ending in it (four characters or more). Several candidates are no answer: the near misses list them.
   */
  private async forgivingMatch(tx: Scoped, key: string) {
    const ids = await tx.sql<{ id: string }>(
      `SELECT id FROM assets WHERE organization_id = $1 AND search_key LIKE $2 AND (nk_search_key(asset_tag) = $3 OR nk_search_key(rfid_tag) = $3) LIMIT 2`,
      [`%${key}%`, key],
    );
    const tail =
      ids.length || key.length < 4
        ? []
        : await tx.sql<{ id: string }>(
            `SELECT id FROM assets WHERE organization_id = $1 AND rfid_tag IS NOT NULL AND search_key LIKE $2 AND nk_search_key(rfid_tag) LIKE $2 LIMIT 2`,
            [`%${key}`],
          );
    const found = ids.length ? ids : tail;
    return found.length === 1 ? tx.select(Asset, 'a').leftJoinAndSelect('a.kit', 'k').andWhere('a.id = :id', { id: found[0].id }).getOne() : null;
  }

  /** Suggestions for a search that found nothing: the nearest tags, serials and RFID tags by trigram similarity (pg_trgm). */
  suggest(actor: Actor, q: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => listReply(await nearMisses(tx, searchKey(q))));
  }

  create(actor: Actor, input: CreateAssetPayload) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      await this.assertIdentityFree(tx, input.assetTag, input.rfidTag ?? null);
      const plan = input.calibration ?? { required: false };
      const asset = await this.saving(() =>
        tx.insert(Asset, {
          type: input.type,
          assetTag: input.assetTag,
          serialNumber: input.serialNumber,
          manufacturer: input.manufacturer ?? null,
          model: input.model ?? null,
          firmwareVersion: input.firmwareVersion ?? null,
          rfidTag: input.rfidTag || null,
          location: input.location ?? null,
          replacementValueMinor: input.replacementValueMinor ?? null,
          notes: input.notes ?? null,
          toleranceOverrides: input.toleranceOverrides ?? null,
          specs: specsByType[input.type].parse(input.specs ?? {}),
          calibrationRequired: plan.required,
          calibrationIntervalMonths: plan.intervalMonths ?? null,
          calibrationProvider: plan.provider ?? null,
          lastCalibratedOn: plan.lastCalibratedOn ?? null,
          dueOn: dueOnForPlan({ required: plan.required, intervalMonths: plan.intervalMonths ?? null, lastCalibratedOn: plan.lastCalibratedOn ?? null }),
        }),
      );
      await noteCustody(tx, actor, [asset.id], 'registered', { counterpart: ctx.name });
      await recordAudit(tx, actor, 'asset.created', { type: 'asset', id: asset.id }, { assetTag: asset.assetTag, type: asset.type });
      return toAssetView(asset, ctx, this.publicUrl);
    });
  }

  update(actor: Actor, id: string, patch: UpdateAssetPayload) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const asset = await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } });
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired; its record can no longer be changed.`);
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      const change = <K extends keyof Asset>(key: K, value: Asset[K]) => {
        if (JSON.stringify(asset[key]) === JSON.stringify(value)) return;
        changes[key] = { from: asset[key], to: value };
        asset[key] = value;
      };
      for (const field of editableFields) if (patch[field] !== undefined) change(field, (patch[field] === '' ? null : patch[field]) as never);
      if (patch.specs !== undefined) change('specs', this.validSpecs(asset, patch.specs));
      if (patch.toleranceOverrides !== undefined) change('toleranceOverrides', patch.toleranceOverrides);
      this.assertTypeRules(asset);
      if (patch.calibration) {
        const plan = patch.calibration;
        change('calibrationRequired', plan.required);
        if (plan.intervalMonths !== undefined) change('calibrationIntervalMonths', plan.intervalMonths);
        if (plan.provider !== undefined) change('calibrationProvider', plan.provider);
        if (plan.lastCalibratedOn !== undefined) change('lastCalibratedOn', plan.lastCalibratedOn);
        change(
          'dueOn',
          dueOnForPlan({ required: asset.calibrationRequired, intervalMonths: asset.calibrationIntervalMonths, lastCalibratedOn: asset.lastCalibratedOn }),
        );
      }
      if (changes.assetTag || changes.rfidTag)
        await this.assertIdentityFree(tx, changes.assetTag ? asset.assetTag : null, changes.rfidTag ? asset.rfidTag : null, asset.id);
      if (Object.keys(changes).length === 0) return toAssetView(asset, ctx, this.publicUrl);
      // Only the changed fields: the status is custody.ts's to write, even if it moved meanwhile.
      await this.saving(() => tx.updateWhere(Asset, { id }, Object.fromEntries(Object.keys(changes).map((k) => [k, asset[k as keyof Asset]]))));
      const saved = await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } });
      if (changes.location) await noteCustody(tx, actor, [id], 'moved');
      await recordAudit(tx, actor, 'asset.updated', { type: 'asset', id }, { changes });
      return toAssetView(saved, ctx, this.publicUrl);
    });
  }

  retire(actor: Actor, id: string, reason: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const asset = await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } });
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is already retired.`);
      const formerKit = asset.kit?.name ?? null;
      // An item that is out cannot be retired (custody.ts): it comes back in first.
      await moveAssets(tx, actor, [id], 'retired', { why: reason, details: { reason, formerKit } });
      await tx.updateWhere(Asset, { id }, { retiredAt: new Date(), retiredReason: reason, kitId: null });
      return toAssetView(await tx.get(Asset, { id }, 'That asset', { relations: { kit: true } }), ctx, this.publicUrl);
    });
  }

  /** Audit trail and chain of custody together, newest first. */
  history(actor: Actor, id: string): Promise<Page<AssetHistoryEntry>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await tx.get(Asset, { id }, 'That asset');
      const rows = await tx.sql<{ at: Date; source: AssetHistoryEntry['source']; action: string; actorName: string | null; details: Record<string, unknown> }>(
        `SELECT e.at, 'audit' AS source, e.action, u.name AS "actorName", e.details
           FROM audit_events e LEFT JOIN users u ON u.id = e.actor_user_id
          WHERE e.organization_id = $1 AND e.subject_type = 'asset' AND e.subject_id = $2
         UNION ALL
         SELECT c.at, 'custody', c.kind, u.name, jsonb_strip_nulls(jsonb_build_object('holder', c.holder, 'location', c.location, 'bookingId', c.booking_id, 'note', c.note))
           FROM custody_events c LEFT JOIN users u ON u.id = c.actor_user_id
          WHERE c.organization_id = $1 AND c.asset_id = $2::uuid
         ORDER BY at DESC LIMIT 500`,
        [id],
      );
      // Each event once: an audit line that repeats a custody event (a status move, the registration) is left out.
      const entries = rows.filter((r) => !(r.source === 'audit' && repeatsCustody(r.action)));
      return listReply(entries.map((r) => ({ ...r, at: r.at.toISOString(), summary: historyLine(r.source, r.action, r.details) })));
    });
  }

  private validSpecs(asset: Asset, specs: Record<string, unknown>) {
    const parsed = specsByType[asset.type].safeParse(specs);
    if (parsed.success) return parsed.data;
    const fields = Object.fromEntries(parsed.error.issues.map((i) => [['specs', ...i.path].join('.'), i.message]));
    throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields });
  }

  private assertTypeRules(asset: Asset) {
    const fields: Record<string, string> = {};
    if (asset.rfidTag && asset.type !== 'tip') fields.rfidTag = 'is only for probe tips';
    if (asset.firmwareVersion && !typesWithFirmware.includes(asset.type)) fields.firmwareVersion = 'is only for trackers, controllers and probes';
    if (Object.keys(fields).length) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields });
  }

  /** 409 naming the clash; the unique indexes catch a race between two requests. */
  private async assertIdentityFree(tx: Scoped, assetTag: string | null, rfidTag: string | null, exceptId?: string) {
    const clash = async (column: string, value: string) =>
      (await tx
        .select(Asset, 'a')
        .andWhere(`a.${column} = :value`, { value })
        .andWhere(exceptId ? 'a.id <> :exceptId' : 'TRUE', { exceptId })
        .getOne()) ?? null;
    const fields: Record<string, string> = {};
    const messages: string[] = [];
    if (assetTag) {
      const other = await clash('asset_tag', assetTag);
      if (other) {
        fields.assetTag = `is already used by ${other.assetTag} (${other.type})`;
        messages.push(`Asset tag ${assetTag} is already in use.`);
      }
    }
    if (rfidTag) {
      const other = await clash('rfid_tag', rfidTag);
      if (other) {
        fields.rfidTag = `is already on ${other.assetTag}`;
        messages.push(`RFID tag ${rfidTag} is already on ${other.assetTag}.`);
      }
    }
    if (messages.length) throw conflict(messages.join(' '), { fields });
  }

  private async saving<T>(work: () => Promise<T>): Promise<T> {
    try {
      return await work();
    } catch (err) {
      if (isUniqueViolation(err)) throw conflict('Another asset took that asset tag or RFID tag a moment ago.');
      throw err;
    }
  }
}
