import { In, type DataSource } from 'typeorm';
import type { AssetImportResult, ImportProblem } from '../../shared/assets/views';
import { dueOnForPlan } from '../../shared/calibration/due-date';
import { specsByType } from '../../shared/schemas/assets';
import { recordAudit, recordAudits } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { Asset } from './asset.entity';
import { parseAssetCsv } from './asset-csv';
import { noteCustody } from './custody';
import { Kit } from './kit.entity';

const MAX_ERRORS_SHOWN = 500;

/**
 * Import assets from CSV. `preview` checks everything and writes nothing;
 * `commit` writes all rows in one transaction, or nothing at all when any
 * row is wrong.
 */
export async function importAssetsCsv(db: DataSource, actor: Actor, text: string, mode: 'preview' | 'commit'): Promise<AssetImportResult> {
  const { rows, errors, rowCount } = parseAssetCsv(text);
  return inOrganization(db, actor.organizationId, async (tx) => {
    const ctx = await loadOrgContext(tx);
    const clashes: ImportProblem[] = [];
    const firstRowWith = new Map<string, number>();
    for (const { row, payload } of rows) {
      for (const [column, value] of [
        ['assetTag', payload.assetTag],
        ['rfidTag', payload.rfidTag],
      ] as const) {
        if (!value) continue;
        const key = `${column}:${value}`;
        const earlier = firstRowWith.get(key);
        if (earlier) clashes.push({ row, column, message: `${value} is also on row ${earlier} of this file` });
        else firstRowWith.set(key, row);
      }
    }
    const tags = rows.map((r) => r.payload.assetTag);
    const rfids = rows.map((r) => r.payload.rfidTag).filter((t): t is string => !!t);
    const taken = tags.length
      ? await tx.sql<{ asset_tag: string; rfid_tag: string | null }>(
          `SELECT asset_tag, rfid_tag FROM assets WHERE organization_id = $1 AND (asset_tag = ANY($2) OR rfid_tag = ANY($3))`,
          [tags, rfids],
        )
      : [];
    const takenTags = new Set(taken.map((t) => t.asset_tag));
    const takenRfids = new Set(taken.map((t) => t.rfid_tag));
    for (const { row, payload } of rows) {
      if (takenTags.has(payload.assetTag)) clashes.push({ row, column: 'assetTag', message: `${payload.assetTag} is already in your fleet` });
      if (payload.rfidTag && takenRfids.has(payload.rfidTag))
        clashes.push({ row, column: 'rfidTag', message: `${payload.rfidTag} is already on an asset in your fleet` });
    }
    const allErrors = [...errors, ...clashes].sort((a, b) => a.row - b.row);
    const preview = rows.slice(0, 20).map(({ row, kit, payload }) => ({
      row,
      kit,
      type: payload.type,
      assetTag: payload.assetTag,
      serialNumber: payload.serialNumber,
      manufacturer: payload.manufacturer,
      model: payload.model,
    }));
    const summary = {
      mode,
      rowCount,
      valid: allErrors.length === 0,
      errors: allErrors.slice(0, MAX_ERRORS_SHOWN),
      errorCount: allErrors.length,
      preview,
      created: 0,
    };
    if (mode === 'preview') return summary;
    if (allErrors.length) {
      throw ruleBroken('import_invalid', `Nothing was imported: ${allErrors.length} problem(s) in the file.`, {
        errors: summary.errors,
        errorCount: allErrors.length,
      });
    }

    const kitNames = [...new Set(rows.map((r) => r.kit).filter((k): k is string => !!k))];
    const kits = kitNames.length ? await tx.find(Kit, { where: { name: In(kitNames) } }) : [];
    for (const name of kitNames.filter((n) => !kits.some((k) => k.name === n))) kits.push(await tx.insert(Kit, { name, notes: null }));
    const kitId = (name: string | null) => (name ? kits.find((k) => k.name === name)!.id : null);

    const ids = await tx.insertMany(
      Asset,
      rows.map(({ kit, payload: p }) => {
        const plan = p.calibration ?? { required: false };
        return {
          type: p.type,
          assetTag: p.assetTag,
          serialNumber: p.serialNumber,
          manufacturer: p.manufacturer ?? null,
          model: p.model ?? null,
          firmwareVersion: p.firmwareVersion ?? null,
          rfidTag: p.rfidTag || null,
          location: p.location ?? null,
          replacementValueMinor: p.replacementValueMinor ?? null,
          notes: p.notes ?? null,
          status: 'ready' as const,
          specs: specsByType[p.type].parse(p.specs ?? {}),
          kitId: kitId(kit),
          calibrationRequired: plan.required,
          calibrationIntervalMonths: plan.intervalMonths ?? null,
          calibrationProvider: plan.provider ?? null,
          lastCalibratedOn: plan.lastCalibratedOn ?? null,
          dueOn: dueOnForPlan({ required: plan.required, intervalMonths: plan.intervalMonths ?? null, lastCalibratedOn: plan.lastCalibratedOn ?? null }),
        };
      }),
    );
    await noteCustody(tx, actor, ids, 'registered', { counterpart: ctx.name, why: 'Imported from CSV' });
    await recordAudits(
      tx,
      actor,
      ids.map((id, i) => ({ action: 'asset.created', subject: { type: 'asset', id }, details: { assetTag: rows[i].payload.assetTag, via: 'csv_import' } })),
    );
    await recordAudit(tx, actor, 'assets.imported', { type: 'organization', id: actor.organizationId }, { count: ids.length, kitsCreated: kitNames.length });
    return { ...summary, created: ids.length };
  });
}
