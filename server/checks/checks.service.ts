import type { DataSource } from 'typeorm';
import { decide } from '../../shared/checks/decision';
import { lengthCheck } from '../../shared/checks/length-check';
import { tipValidation } from '../../shared/checks/tip-validation';
import { toleranceUm } from '../../shared/checks/tolerance';
import { twoFaceErrorUm } from '../../shared/checks/two-face';
import { expandedUncertainty } from '../../shared/checks/uncertainty';
import { assetTypeTitles, type AssetType, type TipPosition } from '../../shared/schemas/assets';
import { checkKindTitles, checkSubjectType, type CheckPayload } from '../../shared/schemas/checks';
import type { CheckToDo, CheckView, TipForecastsView, TipValidationStatus } from '../../shared/checks/views';
import type { FieldCopyView } from '../../shared/field/views';
import type { Page } from '../../shared/lists/page';
import { recordAudit } from '../audit/audit.service';
import { claimClientRecordId } from '../db/client-records';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { listReply } from '../http/list-reply';
import { findAsset, getAsset, type AssetRecord } from '../fleet';
import { AppError, ruleBroken } from '../http/errors';
import { placeHold } from '../holds/holds.service';
import { openImpactReview } from '../calibration/impact.service';
import { calendarDayIn } from '../../shared/calibration/due-date';
import { enqueueMail, staffAddresses } from '../notifications';
import { failedCheckMail } from './check-mail';
import { loadOrgContext } from '../organizations';
import { FieldCheck } from './field-check.entity';
import { tipForecasts } from './tip-forecasts';
import { addDays } from '../../shared/calibration/due-date';

/** A record that waited on a phone for a while: worth saying when the work was done. */
const arrivedLate = (doneAt: Date, arrivedAt: Date) => arrivedAt.getTime() - doneAt.getTime() > 10 * 60_000;

const badField = (field: string, message: string) => new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { [field]: message } });

async function assetOfType(tx: Scoped, id: string, type: AssetType, field: string) {
  const asset = await getAsset(tx, id);
  if (asset.type !== type) throw badField(field, `is a ${assetTypeTitles[asset.type].toLowerCase()}, not a ${assetTypeTitles[type].toLowerCase()}`);
  if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired.`);
  return asset;
}

/** The computation for each kind: results to store, the number the decision judges, and inputs worth keeping. */
async function compute(tx: Scoped, input: CheckPayload, subject: AssetRecord) {
  switch (input.kind) {
    case 'tip_validation': {
      const positions = (subject.specs.positions as TipPosition[] | undefined) ?? [];
      if (!positions.includes(input.position))
        throw badField(
          'position',
          `${subject.assetTag} is not used in the ${input.position} position (it is used: ${positions.join(', ') || 'none recorded'})`,
        );
      if (input.probeId) await assetOfType(tx, input.probeId, 'probe', 'probeId');
      const result = tipValidation(input.reference, input.readings);
      return { result, judged: result.maxDeviationUm, related: input.probeId ?? null, inputs: { reference: input.reference, readings: input.readings } };
    }
    case 'two_face': {
      const errorUm = twoFaceErrorUm(input.front, input.back);
      return { result: { errorUm }, judged: errorUm, related: null, inputs: { front: input.front, back: input.back } };
    }
    case 'length_check': {
      const bar = await assetOfType(tx, input.scaleBarId, 'scale_bar', 'scaleBarId');
      const certifiedLengthMm = Number(bar.specs.certifiedLengthMm);
      const expansionPpmPerK = Number(bar.specs.expansionPpmPerK);
      const r = lengthCheck(input.endA, input.endB, certifiedLengthMm, expansionPpmPerK, input.temperatureC);
      return {
        result: { measuredMm: r.measuredMm, expectedMm: r.expectedMm, errorUm: r.errorUm },
        judged: r.errorUm,
        related: bar.id,
        inputs: {
          endA: input.endA,
          endB: input.endB,
          temperatureC: input.temperatureC,
          scaleBar: { assetTag: bar.assetTag, certifiedLengthMm, expansionPpmPerK },
        },
      };
    }
  }
}

// `kind`, `position`, `inputs` and `result` were stored together by `record`, computed for that kind.
export const checkView = (c: FieldCheck): CheckView =>
  ({
    id: c.id,
    kind: c.kind,
    assetId: c.assetId,
    relatedAssetId: c.relatedAssetId,
    position: c.position,
    inputs: c.inputs,
    result: {
      ...c.result,
      toleranceUm: c.toleranceUm,
      guardBandUm: c.guardBandUm,
      expandedUncertaintyUm: c.expandedUncertaintyUm,
      decisionRule: c.decisionRule,
      decision: c.decision,
    },
    performedAt: c.performedAt.toISOString(),
    recordedAt: c.createdAt.toISOString(),
    performedBy: c.performedBy,
    note: c.note,
  }) as CheckView;

export class ChecksService {
  constructor(private readonly db: DataSource) {}

  /** `replayed`: the phone sent a check this firm already holds under its id; the stored check is the answer, nothing is recorded again. */
  record(actor: Actor, input: CheckPayload): Promise<{ check: CheckView; replayed: boolean }> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (input.id) {
        await claimClientRecordId(tx, 'field_checks', input.id);
        const stored = await tx.findOne(FieldCheck, { id: input.id });
        if (stored) return { check: checkView(stored), replayed: true };
      }
      const ctx = await loadOrgContext(tx);
      const subject = await assetOfType(tx, input.assetId, checkSubjectType[input.kind], 'assetId');
      const { result, judged, related, inputs } = await compute(tx, input, subject);

      const tolerance = input.toleranceUm
        ? { kind: 'fixed' as const, um: input.toleranceUm }
        : (subject.toleranceOverrides?.[input.kind] ?? ctx.tolerances[input.kind]);
      if (tolerance.kind === 'range' && input.distanceM == null)
        throw badField('distanceM', 'is needed: the tolerance for this check depends on the distance from the tracker');
      const limitUm = toleranceUm(tolerance, input.distanceM);
      const uUm = input.uncertaintyUm ?? (input.uncertaintyComponentsUm?.length ? expandedUncertainty(input.uncertaintyComponentsUm) : 0);
      const decided = decide(judged, limitUm, ctx.decisionRule, uUm);
      const { decision } = decided;

      const check = await tx.insert(FieldCheck, {
        ...(input.id ? { id: input.id } : {}),
        kind: input.kind,
        assetId: subject.id,
        relatedAssetId: related,
        position: input.kind === 'tip_validation' ? input.position : null,
        inputs: { ...inputs, distanceM: input.distanceM ?? null, tolerance, uncertaintyComponentsUm: input.uncertaintyComponentsUm ?? null },
        result,
        toleranceUm: decided.toleranceUm,
        expandedUncertaintyUm: decided.expandedUncertaintyUm,
        guardBandUm: decided.guardBandUm,
        decisionRule: ctx.decisionRule,
        decision,
        performedAt: input.performedAt ? new Date(input.performedAt) : new Date(),
        performedBy: actor.userId,
        note: input.note ?? null,
      });
      await recordAudit(
        tx,
        actor,
        'check.recorded',
        { type: 'asset', id: subject.id },
        { checkId: check.id, kind: check.kind, decision, position: check.position },
      );
      if (decision === 'fail') {
        const what = `${checkKindTitles[input.kind]}${check.position ? ` (${check.position})` : ''} failed: ${decided.resultUm.toFixed(1)} µm against ${decided.acceptanceLimitUm.toFixed(1)} µm${decided.guardBandUm > 0 ? ` (tolerance ${decided.toleranceUm.toFixed(1)} µm less a guard band of ${decided.guardBandUm.toFixed(1)} µm)` : ''}`;
        await placeHold(tx, actor, subject, { reason: 'failed_check', summary: what, checkId: check.id });
        await openImpactReview(tx, actor, subject, { trigger: 'check', triggerId: check.id, foundOn: calendarDayIn(check.performedAt, ctx.timeZone) });
        await enqueueMail(tx, await staffAddresses(tx, ['owner', 'manager']), failedCheckMail, {
          asset: subject,
          kind: checkKindTitles[input.kind].toLowerCase(),
          what,
          performedAt: check.performedAt,
          arrivedAt: arrivedLate(check.performedAt, check.createdAt) ? check.createdAt : null,
        });
      }
      return { check: checkView(check), replayed: false };
    });
  }

  list(actor: Actor, query: { assetId?: string; kind?: CheckPayload['kind']; limit: number; offset: number }): Promise<Page<CheckView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [rows, total] = await tx.findAndCount(FieldCheck, {
        where: { ...(query.assetId ? { assetId: query.assetId } : {}), ...(query.kind ? { kind: query.kind } : {}) },
        order: { performedAt: 'DESC' },
        take: query.limit,
        skip: query.offset,
      });
      return { items: rows.map(checkView), total };
    });
  }

  /**
   * The technician's to-do: every mounting position of every tip in the kit
   * they carry now or take next (taken by them, or on jobs they lead) without a
   * passing latest validation — what the booking rules would refuse — and
   * every passing one forecast to reach its limit within the due-soon window (advice: it blocks nothing).
   */
  toDo(actor: Actor): Promise<Page<CheckToDo>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const rows = await tx.sql<Omit<CheckToDo, 'reason' | 'forecastOn'>>(
        `SELECT a.id AS "assetId", a.asset_tag AS "assetTag", pos.position, last.decision AS "lastDecision", last.performed_at AS "lastCheckedAt",
                  b.id AS "bookingId", to_char(b.starts_on, 'YYYY-MM-DD') AS "startsOn", b.state AS "bookingState"
             FROM bookings b LEFT JOIN jobs j ON j.id = b.job_id
             JOIN booking_items bi ON bi.booking_id = b.id
             JOIN assets a ON a.id = bi.asset_id AND a.type = 'tip'
             CROSS JOIN LATERAL jsonb_array_elements_text(coalesce(a.specs->'positions', '[]'::jsonb)) AS pos(position)
             LEFT JOIN LATERAL (SELECT fc.decision, fc.performed_at FROM field_checks fc
                                 WHERE fc.organization_id = a.organization_id AND fc.asset_id = a.id AND fc.kind = 'tip_validation' AND fc.position = pos.position
                                 ORDER BY fc.performed_at DESC, fc.created_at DESC LIMIT 1) last ON true
            WHERE b.organization_id = $1 AND (b.taken_by_user_id = $2 OR j.lead_technician_id = $2)
              AND (b.state = 'out' OR (b.state = 'reserved' AND b.ends_on >= $3::date))
            ORDER BY b.starts_on, a.asset_tag, pos.position`,
        [actor.userId, ctx.today],
      );
      const passed = rows.filter((r) => r.lastDecision === 'pass');
      const soon = (await tipForecasts(tx, ctx, [...new Set(passed.map((r) => r.assetId))])).filter((f) => f.failsSoon);
      return listReply(
        rows.flatMap((r): CheckToDo[] => {
          if (r.lastDecision !== 'pass') return [{ ...r, reason: 'not_validated', forecastOn: null }];
          const f = soon.find((s) => s.assetId === r.assetId && s.position === r.position);
          return f ? [{ ...r, reason: 'forecast', forecastOn: f.forecast.state === 'forecast' ? f.forecast.reachesOn : null }] : [];
        }),
      );
    });
  }

  /** Drift forecasts of one tip, per mounting position. */
  tipForecast(actor: Actor, assetId: string): Promise<TipForecastsView> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      await getAsset(tx, assetId);
      const items = await tipForecasts(tx, ctx, [assetId]);
      return { items, total: items.length, dueSoonDays: ctx.dueSoonDays, until: addDays(ctx.today, ctx.dueSoonDays) };
    });
  }

  /** Tips forecast to reach their limit within the due-soon window, or already past it (the owner's review and home). */
  forecastsSoon(actor: Actor): Promise<TipForecastsView> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const items = (await tipForecasts(tx, ctx)).filter((f) => f.failsSoon);
      return { items, total: items.length, dueSoonDays: ctx.dueSoonDays, until: addDays(ctx.today, ctx.dueSoonDays) };
    });
  }

  /** What a phone needs to judge checks without signal: each tip position's latest validation and the firm's tolerances and decision rule. */
  fieldFacts(actor: Actor, tipIds: string[]): Promise<Pick<FieldCopyView, 'tipValidations' | 'checkRules'>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const { decisionRule, tolerances } = await loadOrgContext(tx);
      const tipValidations = await tx.sql<FieldCopyView['tipValidations'][number]>(
        `SELECT DISTINCT ON (asset_id, position) asset_id AS "assetId", position, id AS "checkId", decision, performed_at AS "performedAt",
                (result->>'maxDeviationUm')::float8 AS "maxDeviationUm", tolerance_um AS "toleranceUm"
           FROM field_checks WHERE organization_id = $1 AND asset_id = ANY($2::uuid[]) AND kind = 'tip_validation'
          ORDER BY asset_id, position, performed_at DESC, created_at DESC`,
        [tipIds],
      );
      return {
        tipValidations: tipValidations.map((v) => ({ ...v, performedAt: new Date(v.performedAt).toISOString() })),
        checkRules: { decisionRule, tolerances },
      };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => checkView(await tx.get(FieldCheck, { id }, 'That check')));
  }

  /** Per mounting position: validated only when the latest validation in that position passed. */
  tipStatus(actor: Actor, assetId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => tipValidationStatus(tx, await getAsset(tx, assetId)));
  }
}

export async function tipValidationStatus(tx: Scoped, tip: AssetRecord): Promise<TipValidationStatus> {
  const positions = (tip.specs.positions as TipPosition[] | undefined) ?? [];
  const latest = await tx.sql<{ position: string; decision: string; performedAt: Date; id: string }>(
    `SELECT DISTINCT ON (position) position, decision, performed_at AS "performedAt", id FROM field_checks
      WHERE organization_id = $1 AND asset_id = $2 AND kind = 'tip_validation' ORDER BY position, performed_at DESC, created_at DESC`,
    [tip.id],
  );
  return {
    positions: positions.map((position) => {
      const last = latest.find((l) => l.position === position);
      return {
        position,
        state: !last ? 'not_validated' : last.decision === 'pass' ? 'validated' : 'failed',
        lastCheckId: last?.id ?? null,
        lastPerformedAt: last?.performedAt.toISOString() ?? null,
      };
    }),
  };
}
