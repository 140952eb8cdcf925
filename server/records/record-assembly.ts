import type { AssetView } from '../../shared/assets/views';
import type { AsFound } from '../../shared/calibration/interval-review';
import { checkKindTitles } from '../../shared/checks/vocabulary';
import { checkInputLines, checkResultLines, storedWords } from '../../shared/records/check-lines';
import type { EquipmentRecordView, RecordCalibration, RecordHold, RecordIntervalChange, RecordPeriod, ReferenceArtefact } from '../../shared/records/views';
import { assetAuditLines, type AuditLine } from '../audit/audit.service';
import { calibrationsForRecord, certificateBytes, impactReviewsForRecord, type CalibrationEntry } from '../calibration';
import { checksForRecord } from '../checks';
import type { Scoped } from '../db/scoped';
import { inspectPdf } from '../documents/pdf-inspection';
import { assetViewsByIds, custodyForRecord } from '../fleet';
import { holdsForRecord, type HoldEntry } from '../holds';
import { incidentsForRecord, photoThumbnails } from '../incidents';
import { formatOf, type OrgContext } from '../organizations';
import { peopleNames } from '../users';
import { recordContentHash, sha256 } from './content-hash';
import { equipmentRecordItems, type RecordWords } from './equipment-record-items';

/** A record with the files its PDF shows: certificates by calibration id (null: not stored), thumbnails by photo id. */
export type AssembledRecord = { view: EquipmentRecordView; certificates: Map<string, Buffer | null>; thumbnails: Map<string, Buffer> };

const iso = (d: Date | string | null) => (d === null ? null : new Date(d).toISOString());
const groupBy = <T extends { assetId: string }>(rows: T[]) => {
  const map = new Map<string, T[]>();
  for (const r of rows) map.set(r.assetId, [...(map.get(r.assetId) ?? []), r]);
  return map;
};

export function adjustmentText(asFound: AsFound, asLeft: AsFound): string {
  if (asLeft === 'out_of_tolerance') return 'Left out of tolerance: not fit for use until repaired and calibrated again';
  if (asFound === 'out_of_tolerance') return 'Adjusted or repaired by the lab: found out of tolerance, left in tolerance (the certificate describes the work)';
  if (asFound === 'not_reported') return 'The lab did not report the as-found result, so whether it adjusted the item is not on record';
  return 'Found and left in tolerance: no adjustment on record';
}

const intervalActions = ['calibration.interval_accepted', 'calibration.interval_declined', 'asset.updated'];

function intervalChanges(calibrations: CalibrationEntry[], audit: AuditLine[], names: Map<string, string>): RecordIntervalChange[] {
  const changes: RecordIntervalChange[] = [];
  calibrations.forEach((c, i) => {
    const before = calibrations[i - 1];
    if (before && before.intervalMonths !== c.intervalMonths)
      changes.push({
        at: iso(c.createdAt)!,
        by: names.get(c.recordedById) ?? null,
        fromMonths: before.intervalMonths,
        toMonths: c.intervalMonths,
        reason: `Given with certificate ${c.certificateNumber}`,
      });
  });
  for (const line of audit) {
    const d = line.details;
    const by = line.actorId ? (names.get(line.actorId) ?? null) : null;
    if (line.action === 'calibration.interval_accepted' || line.action === 'calibration.interval_declined') {
      const accepted = line.action === 'calibration.interval_accepted';
      changes.push({
        at: iso(line.at)!,
        by,
        fromMonths: Number(d.from),
        toMonths: accepted ? Number(d.suggested) : Number(d.from),
        reason: `${accepted ? 'Suggestion accepted' : `Suggestion of ${d.suggested} months declined`}: ${d.reason}`,
      });
    }
    const changed = (d.changes as Record<string, { from: unknown; to: unknown }> | undefined)?.calibrationIntervalMonths;
    if (line.action === 'asset.updated' && changed)
      changes.push({
        at: iso(line.at)!,
        by,
        fromMonths: (changed.from as number | null) ?? null,
        toMonths: (changed.to as number | null) ?? null,
        reason: 'Changed by hand in the calibration plan',
      });
  }
  return changes.sort((a, b) => a.at.localeCompare(b.at));
}

function evidenceWords(hold: HoldEntry, calibrations: CalibrationEntry[], say: RecordWords): string[] {
  return (hold.releaseEvidence?.evidence ?? []).map((e) => {
    if (e.kind === 'calibration') {
      const c = calibrations.find((x) => x.id === e.id);
      return c
        ? `Calibration of ${say.date(c.performedOn)}, certificate ${c.certificateNumber} (as left ${c.asLeft.replace(/_/g, ' ')})`
        : `Calibration of ${say.date(e.performedAt)}`;
    }
    const title = checkKindTitles[e.kind as keyof typeof checkKindTitles] ?? e.kind;
    return `Passing ${title.toLowerCase()} of ${say.date(e.performedAt)}${e.position ? ` (${e.position})` : ''}`;
  });
}

function referenceArtefact(asset: AssetView, calibrations: RecordCalibration[], say: RecordWords): ReferenceArtefact | null {
  const s = asset.specs;
  const values =
    asset.type === 'reference_sphere' || asset.type === 'smr'
      ? [{ label: 'Diameter', value: `${say.number(s.diameterMm)} mm` }]
      : asset.type === 'scale_bar'
        ? [
            { label: 'Certified length at 20 °C (ISO 1)', value: `${say.number(s.certifiedLengthMm)} mm` },
            { label: 'Thermal expansion coefficient', value: `${say.number(s.expansionPpmPerK)} µm/(m·K)` },
          ]
        : null;
  if (!values) return null;
  const latest = calibrations.at(-1);
  return {
    values,
    certificateNumber: latest?.certificateNumber ?? null,
    validFrom: latest?.performedOn ?? asset.calibration.lastCalibratedOn,
    validThrough: latest?.dueOn ?? asset.calibration.dueOn,
  };
}

async function certificateFile(tx: Scoped, c: CalibrationEntry) {
  const bytes = c.certificateFileId ? await certificateBytes(tx, c.certificateFileId) : null;
  if (!bytes) return { bytes: null, file: null };
  const inspection = await inspectPdf(bytes);
  return { bytes, file: { fileName: c.fileName ?? 'certificate.pdf', sizeBytes: bytes.length, sha256: sha256(bytes), readable: inspection.kind === 'pdf' } };
}

/** Dates and measures as the record's hash reads them: the same text the record carried before it spoke the firm's format. */
const fixedWords: RecordWords = { ...storedWords, date: (value) => value.slice(0, 10) };

const decimalsOf = (value: number) => (String(value).split('.')[1] ?? '').length;

/**
 * The firm's dates (a moment's day in the firm's zone) and measures with every stored decimal and no grouping; lists
 * part with semicolons and points name each axis, so a decimal comma is never read as a separator.
 */
function firmWords(ctx: OrgContext): RecordWords {
  const f = formatOf(ctx);
  const number = (value: unknown) => (typeof value === 'number' ? f.number(value, 6, false) : String(value));
  return {
    date: f.date,
    number,
    list: (values) => values.map(number).join('; '),
    point: (x, y, z) => f.coordinate([x, y, z], Math.min(6, Math.max(3, decimalsOf(x), decimalsOf(y), decimalsOf(z)))),
  };
}

/**
 * Each item's equipment record for the period, asking each component that owns a part for it (a batch of items at
 * a time: one query per part, not per item). Certificates and thumbnails come along for the PDF.
 */
export async function assembleRecords(tx: Scoped, ctx: OrgContext, assetIds: string[], period: RecordPeriod, publicUrl: string): Promise<AssembledRecord[]> {
  const tz = ctx.timeZone;
  const say = firmWords(ctx);
  const [assets, calibrations, checks, holds, incidents, reviews, custody, audit] = await Promise.all([
    assetViewsByIds(tx, ctx, assetIds, publicUrl),
    calibrationsForRecord(tx, assetIds, period),
    checksForRecord(tx, assetIds, period, tz),
    holdsForRecord(tx, assetIds, period, tz),
    incidentsForRecord(tx, assetIds, period, tz),
    impactReviewsForRecord(tx, assetIds, period),
    custodyForRecord(tx, assetIds, period, tz),
    assetAuditLines(tx, assetIds, intervalActions, period, tz),
  ]);
  const names = await peopleNames(
    tx,
    [
      ...calibrations.map((c) => c.recordedById),
      ...checks.map((c) => c.performedById),
      ...holds.flatMap((h) => [h.startedById, h.releasedById ?? '']),
      ...incidents.map((i) => i.reportedById),
      ...reviews.flatMap((r) => r.bookings.map((b) => b.assessedById ?? '')),
      ...custody.map((c) => c.actorId ?? ''),
      ...audit.map((a) => a.actorId ?? ''),
    ].filter(Boolean),
  );
  const who = (id: string | null) => (id ? (names.get(id) ?? null) : null);
  const thumbnails = await photoThumbnails(
    tx,
    incidents.flatMap((i) => i.photos.filter((p) => p.hasThumbnail).map((p) => p.id)),
  );
  const byCal = groupBy(calibrations);
  const byCheck = groupBy(checks);
  const byHold = groupBy(holds);
  const byIncident = groupBy(incidents);
  const byReview = groupBy(reviews);
  const byCustody = groupBy(custody);
  const byAudit = groupBy(audit.map((a) => ({ ...a, assetId: a.subjectId })));

  const records: AssembledRecord[] = [];
  for (const asset of assets) {
    const cals = byCal.get(asset.id) ?? [];
    const certificates = new Map<string, Buffer | null>();
    const calibrationViews: RecordCalibration[] = [];
    for (const c of cals) {
      const { bytes, file } = await certificateFile(tx, c);
      certificates.set(c.id, bytes);
      calibrationViews.push({
        id: c.id,
        performedOn: c.performedOn,
        provider: c.provider,
        certificateNumber: c.certificateNumber,
        certificateUrl: `/api/calibrations/${c.id}/certificate.pdf`,
        certificate: file,
        asFound: c.asFound,
        asLeft: c.asLeft,
        adjustment: adjustmentText(c.asFound, c.asLeft),
        intervalMonths: c.intervalMonths,
        dueOn: c.dueOn,
        note: c.note,
        recordedBy: who(c.recordedById),
        recordedAt: iso(c.createdAt)!,
      });
    }
    const checksIn = (words: RecordWords) =>
      (byCheck.get(asset.id) ?? []).map((check) => {
        return {
          id: check.id,
          kind: check.kind,
          performedAt: iso(check.performedAt)!,
          performedBy: who(check.performedById),
          position: check.position,
          relatedAssetTag: check.relatedAssetTag,
          inputs: check.inputs,
          result: check.result,
          inputLines: checkInputLines(check.kind, check.inputs, words),
          resultLines: checkResultLines(check.kind, check.result, words),
          toleranceUm: check.toleranceUm,
          expandedUncertaintyUm: check.expandedUncertaintyUm,
          guardBandUm: check.guardBandUm,
          decisionRule: check.decisionRule,
          decision: check.decision,
          note: check.note,
        };
      });
    const holdsIn = (words: RecordWords) =>
      (byHold.get(asset.id) ?? []).map((hold): RecordHold => ({
        id: hold.id,
        reason: hold.reason,
        summary: hold.summary,
        startedAt: iso(hold.startedAt)!,
        startedBy: who(hold.startedById),
        releasedAt: iso(hold.releasedAt),
        releasedBy: who(hold.releasedById),
        releaseEvidence: evidenceWords(hold, cals, words),
        releaseNote: hold.releaseEvidence?.note ?? null,
      }));
    const sections = {
      calibrations: calibrationViews,
      checks: checksIn(say),
      holds: holdsIn(say),
      incidents: (byIncident.get(asset.id) ?? []).map((incident) => {
        return {
          id: incident.id,
          kind: incident.kind,
          description: incident.description,
          occurredAt: iso(incident.occurredAt)!,
          location: incident.location,
          state: incident.state,
          resolution: incident.resolution,
          reportedBy: who(incident.reportedById),
          photos: incident.photos.map((p) => ({
            id: p.id,
            fileName: p.fileName,
            contentType: p.contentType,
            url: `/api/incidents/${incident.id}/photos/${p.id}`,
            thumbnailUrl: p.hasThumbnail ? `/api/incidents/${incident.id}/photos/${p.id}?size=thumbnail` : null,
          })),
        };
      }),
      impactReviews: (byReview.get(asset.id) ?? []).map((review) => {
        return {
          id: review.id,
          trigger: review.trigger,
          triggerId: review.triggerId,
          since: review.since,
          foundOn: review.foundOn,
          state: review.state,
          openedAt: iso(review.openedAt)!,
          closedAt: iso(review.closedAt),
          bookings: review.bookings.map((b) => ({
            bookingId: b.bookingId,
            jobReference: b.jobReference,
            customerName: b.customerName,
            startsOn: b.startsOn,
            endsOn: b.endsOn,
            assessment: b.assessment,
            note: b.note,
            assessedBy: who(b.assessedById),
            assessedAt: iso(b.assessedAt),
            noticeQueuedAt: iso(b.noticeQueuedAt),
            noticeTo: b.noticeQueuedAt ? b.contactEmail : null,
          })),
        };
      }),
      custody: (byCustody.get(asset.id) ?? []).map((entry) => {
        return {
          at: iso(entry.at)!,
          kind: entry.kind,
          by: who(entry.actorId),
          holder: entry.holder,
          location: entry.location,
          bookingId: entry.bookingId,
          note: entry.note,
        };
      }),
      intervalChanges: intervalChanges(cals, byAudit.get(asset.id) ?? [], names),
      reference: referenceArtefact(asset, calibrationViews, say),
    };
    const base = {
      asset,
      organization: { name: ctx.name },
      period,
      items: equipmentRecordItems(asset, sections, say),
      ...sections,
      recordDate: ctx.today,
      generatedAt: new Date().toISOString(),
    };
    // The hash reads the record's sentences with fixed dates and decimals: a new locale in the settings is no new content.
    const fixed = { ...sections, checks: checksIn(fixedWords), holds: holdsIn(fixedWords), reference: referenceArtefact(asset, calibrationViews, fixedWords) };
    const contentHash = recordContentHash({ ...base, ...fixed, items: equipmentRecordItems(asset, fixed, fixedWords) });
    records.push({ view: { ...base, contentHash }, certificates, thumbnails });
  }
  return records;
}
