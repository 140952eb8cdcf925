import { IsNull, type DataSource } from 'typeorm';
import type { HoldReason, HoldView } from '../../shared/holds/views';
import type { Page } from '../../shared/lists/page';
import { type TipPosition } from '../../shared/schemas/assets';
import { aType } from '../../shared/holds/release-rule';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { ruleBroken } from '../http/errors';
import { calendarDayIn } from '../../shared/calibration/due-date';
import { getAsset, lockAssets, moveAssets, noteCustody, type AssetRecord } from '../fleet';
import { formatOf, loadOrgContext } from '../organizations';
import { Hold } from './hold.entity';
import { listReply } from '../http/list-reply';

/** Take an asset out of service inside the caller's transaction. A second
 * reason while already held is recorded on the audit trail, not as a new hold. */
export async function placeHold(
  tx: Scoped,
  actor: Actor,
  asset: Pick<AssetRecord, 'id'>,
  hold: { reason: HoldReason; summary: string; incidentId?: string; checkId?: string },
) {
  const current = await openHoldFor(tx, asset.id);
  if (current) {
    await recordAudit(tx, actor, 'asset.hold_reason_added', { type: 'asset', id: asset.id }, { holdId: current.id, ...hold });
    return current;
  }
  const created = await tx.insert(Hold, {
    assetId: asset.id,
    reason: hold.reason,
    summary: hold.summary,
    incidentId: hold.incidentId ?? null,
    checkId: hold.checkId ?? null,
    startedAt: new Date(),
    startedBy: actor.userId,
    releasedAt: null,
    releasedBy: null,
    releaseEvidence: null,
  });
  await moveAssets(tx, actor, [asset.id], 'held', { why: hold.summary, details: { holdId: created.id, reason: hold.reason, summary: hold.summary } });
  return created;
}

/** The asset's hold that is not released yet, if any (an asset has at most one). */
export function openHoldFor(tx: Scoped, assetId: string) {
  return tx.findOne(Hold, { assetId, releasedAt: IsNull() });
}

type Evidence = { kind: string; id: string; performedAt: string; position?: string | null };

/** End a hold on the given evidence, inside the caller's transaction. */
export async function releaseHold(tx: Scoped, actor: Actor, hold: Hold, evidence: Evidence[], note?: string) {
  hold.releasedAt = new Date();
  hold.releasedBy = actor.userId;
  hold.releaseEvidence = { evidence, note: note ?? null };
  await tx.save(Hold, hold);
  const [asset] = await lockAssets(tx, [hold.assetId]);
  if (asset.status === 'held') {
    await moveAssets(tx, actor, [asset.id], 'ready', { why: note ?? null, details: { holdId: hold.id, evidence } });
  } else {
    // Not on hold in the register any more (sent to the lab while held, say): the release is recorded, the status stays.
    await noteCustody(tx, actor, [asset.id], 'released', { why: note ?? null });
    await recordAudit(tx, actor, 'asset.released', { type: 'asset', id: asset.id }, { holdId: hold.id, evidence });
  }
}

export class HoldsService {
  constructor(private readonly db: DataSource) {}

  hold(actor: Actor, assetId: string, summary: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const asset = await getAsset(tx, assetId);
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired.`);
      return this.view(await placeHold(tx, actor, asset, { reason: 'manual', summary }));
    });
  }

  current(actor: Actor, assetId: string): Promise<Page<HoldView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await getAsset(tx, assetId);
      const holds = await tx.find(Hold, { where: { assetId }, order: { startedAt: 'DESC' }, take: 20 });
      return listReply(holds.map((h) => this.view(h)));
    });
  }

  /** Release only on evidence recorded after the hold began (DESIGN.md §3 "Hold"). */
  release(actor: Actor, assetId: string, note?: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const asset = await getAsset(tx, assetId);
      const hold = await openHoldFor(tx, assetId);
      if (!hold) throw ruleBroken('not_held', `${asset.assetTag} is not on hold.`);
      const ctx = await loadOrgContext(tx);
      const { evidence, missing } = await this.evidenceSince(tx, asset, hold.startedAt, ctx.timeZone);
      if (missing.length) {
        const since = formatOf(ctx).dateTime(hold.startedAt);
        throw ruleBroken('release_needs_evidence', `${asset.assetTag} stays on hold (held since ${since}): ${missing.join('; ')}.`, {
          missing,
          holdStartedAt: hold.startedAt.toISOString(),
        });
      }
      await releaseHold(tx, actor, hold, evidence, note);
      return this.view(hold);
    });
  }

  /**
   * What clears a hold: for a tip, a passing validation in every position it is
   * used in; for a tracker, a passing two-face or length check; for any item,
   * a calibration recorded after the hold began, dated on or after the firm's
   * calendar day the hold began on.
   */
  private async evidenceSince(tx: Scoped, asset: AssetRecord, since: Date, timeZone: string): Promise<{ evidence: Evidence[]; missing: string[] }> {
    const passing = await tx.sql<{ id: string; kind: string; position: string | null; performedAt: string }>(
      `SELECT id, kind, position, performed_at AS "performedAt" FROM field_checks
        WHERE organization_id = $1 AND asset_id = $2 AND decision = 'pass' AND performed_at >= $3 AND created_at > $3
        ORDER BY performed_at`,
      [asset.id, since],
    );
    const [calibration] = await tx.sql<{ id: string; performedOn: string }>(
      `SELECT id, to_char(performed_on, 'YYYY-MM-DD') AS "performedOn" FROM calibration_events
        WHERE organization_id = $1 AND asset_id = $2 AND as_left = 'in_tolerance' AND performed_on >= $3::date AND created_at > $4
        ORDER BY performed_on DESC LIMIT 1`,
      [asset.id, calendarDayIn(since, timeZone), since],
    );
    if (calibration) return { evidence: [{ kind: 'calibration', id: calibration.id, performedAt: calibration.performedOn }], missing: [] };
    if (asset.type === 'tip') {
      const positions = (asset.specs.positions as TipPosition[] | undefined) ?? ['vertical'];
      const found = positions.map((p) => passing.find((c) => c.kind === 'tip_validation' && c.position === p));
      const missing = positions.filter((_, i) => !found[i]).map((p) => `no passing ${p} tip validation since the hold began`);
      return { evidence: found.filter((f): f is (typeof passing)[number] => !!f), missing };
    }
    if (asset.type === 'tracker') {
      const check = passing.find((c) => c.kind === 'two_face' || c.kind === 'length_check');
      return check ? { evidence: [check], missing: [] } : { evidence: [], missing: ['no passing two-face or length check since the hold began'] };
    }
    return { evidence: [], missing: [`no field check applies to ${aType(asset.type)}: it needs a calibration recorded after the hold began`] };
  }

  private view(h: Hold): HoldView {
    return {
      id: h.id,
      assetId: h.assetId,
      reason: h.reason,
      summary: h.summary,
      incidentId: h.incidentId,
      checkId: h.checkId,
      startedAt: h.startedAt.toISOString(),
      releasedAt: h.releasedAt?.toISOString() ?? null,
      releaseEvidence: h.releaseEvidence,
    };
  }
}
