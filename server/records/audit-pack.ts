import { once } from 'node:events';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Writable } from 'node:stream';
import { ZipArchive, type ZipEntryData } from 'archiver';
import { overdueDays } from '../../shared/records/overdue-days';
import type { AuditPackPreview, EquipmentRecordView, RecordPeriod } from '../../shared/records/views';
import type { AuditPackQuery } from '../../shared/schemas/records';
import { calibrationsForRecord, outOfToleranceAssetIds } from '../calibration';
import { failedCheckAssetIds } from '../checks';
import type { Scoped } from '../db/scoped';
import { csvRows, toCsv } from '../documents/csv';
import { auditSummaryPdf, type AuditSummary } from '../documents/audit-summary-pdf';
import { equipmentRecordPdf } from '../documents/equipment-record-pdf';
import { assetIdsSelected, getKit, inTagOrder } from '../fleet';
import { heldAssetIds } from '../holds';
import { documentFirm, type OrgContext } from '../organizations';
import { sha256 } from './content-hash';
import { assembleRecords, type AssembledRecord } from './record-assembly';

/** Items per round of queries: enough to keep the database busy, few enough that memory stays flat. */
const BATCH = 50;
/** A record PDF without an annex is a few kilobytes; the estimate only drives the progress bar. */
const RECORD_BYTES_ESTIMATE = 9_000;
/** Build no further file while this much of the pack waits for a slow reader. */
const BACKLOG_BYTES = 1024 * 1024;

const safeName = (s: string) => s.replace(/[^\w.-]+/g, '_').slice(0, 80);
export const certificatePath = (r: EquipmentRecordView, calibrationId: string) => {
  const c = r.calibrations.find((x) => x.id === calibrationId)!;
  return `certificates/${safeName(r.asset.assetTag)}/${safeName(c.certificateNumber)}-${c.id.slice(0, 8)}.pdf`;
};

/** The pack's items, in asset-tag order. */
export async function packItems(tx: Scoped, ctx: OrgContext, query: AuditPackQuery): Promise<string[]> {
  const period = { from: query.from, to: query.to };
  if (query.scope === 'kit') await getKit(tx, query.kitId!);
  if (query.scope !== 'flagged')
    return assetIdsSelected(tx, query.scope === 'kit' ? { kitId: query.kitId } : query.scope === 'type' ? { type: query.type } : {});
  const ids = new Set([
    ...(await outOfToleranceAssetIds(tx, period)),
    ...(await failedCheckAssetIds(tx, period, ctx.timeZone)),
    ...(await heldAssetIds(tx, period, ctx.timeZone)),
  ]);
  return ids.size ? inTagOrder(tx, [...ids]) : [];
}

export async function packPreview(tx: Scoped, ids: string[], period: RecordPeriod): Promise<AuditPackPreview> {
  const calibrations = ids.length ? await calibrationsForRecord(tx, ids, period) : [];
  const stored = calibrations.filter((c) => c.certificateFileId);
  return {
    items: ids.length,
    calibrations: calibrations.length,
    certificates: stored.length,
    estimatedBytes: stored.reduce((sum, c) => sum + (c.sizeBytes ?? 0), 0) + ids.length * RECORD_BYTES_ESTIMATE + 20_000,
  };
}

/** index.csv, for an auditor's tools: plain values (sizes in bytes, hex SHA-256), the unit in the column's name. */
const indexColumns = [
  'item',
  'type',
  'serialNumber',
  'calibrations',
  'fieldChecks',
  'holds',
  'incidents',
  'impactReviews',
  'custodyEvents',
  'file',
  'fileKind',
  'certificateNumber',
  'bytes',
  'sha256',
  'recordContentHash',
  'note',
];

/**
 * The ZIP as it goes out. zip-stream takes each file at once whatever the reader's pace (the archive's own buffers
 * stay small while the backlog piles up inside it), so `add` counts what went in against what came out of the
 * archive (its pointer) and returns only when less than BACKLOG_BYTES waits: the next record is built when the
 * reader has nearly caught up. A reader who hangs up ends the wait with an error.
 */
function zipStream(out: Writable) {
  const archive = new ZipArchive({ zlib: { level: 6 } });
  let handedIn = 0;
  let hungUp = false;
  const closed = new Promise<void>((resolve) => out.once('close', () => ((hungUp = true), resolve())));
  const finished = new Promise<void>((resolve, reject) => {
    out.once('finish', resolve);
    out.once('close', resolve);
    out.once('error', reject);
    archive.once('error', reject);
  });
  finished.catch(() => undefined);
  archive.pipe(out);
  return {
    archive,
    finished,
    async add(data: Buffer, entry: ZipEntryData) {
      const taken = once(archive, 'entry');
      archive.append(data, { ...entry, store: true });
      handedIn += data.length;
      await taken;
      while (handedIn - archive.pointer() > BACKLOG_BYTES) {
        if (hungUp || out.destroyed) throw new Error('The reader closed the download before the pack was complete.');
        await Promise.race([once(archive, 'data'), closed]);
      }
    },
  };
}

/** index.csv, written to a temporary file a batch of rows at a time and added to the ZIP last. */
async function indexFile() {
  const dir = await fs.promises.mkdtemp(path.join(os.tmpdir(), 'nestkeeper-pack-'));
  const file = path.join(dir, 'index.csv');
  const stream = fs.createWriteStream(file);
  const write = async (text: string) => {
    if (text && !stream.write(text)) await once(stream, 'drain');
  };
  // papaparse ends a header without rows with a line break; each batch brings its own.
  await write(toCsv(indexColumns, []).trimEnd());
  return {
    file,
    addRows: (rows: unknown[][]) => write(rows.length ? `\r\n${csvRows(rows)}` : ''),
    async close() {
      stream.end();
      await once(stream, 'close');
    },
    remove: () => {
      stream.destroy();
      return fs.promises.rm(dir, { recursive: true, force: true });
    },
  };
}

type Sources = { read: <T>(work: (tx: Scoped) => Promise<T>) => Promise<T>; ctx: OrgContext; publicUrl: string; scopeText: string };

/**
 * Stream the audit pack as a ZIP into `out`: one record PDF per item, every certificate as stored, a summary PDF of
 * the period and a CSV index of every file with its SHA-256. Items are read a batch at a time; each file is built
 * only when the reader has taken nearly all of the one before, and an item's data is let go once its files are in.
 * What stays is the index on disk and the summary's short lines (findings, holds, days past due, missing files).
 */
export async function writeAuditPack(out: Writable, ids: string[], query: AuditPackQuery, sources: Sources) {
  const { ctx, publicUrl } = sources;
  const period = { from: query.from, to: query.to };
  const zip = zipStream(out);
  const index = await indexFile();
  const firm = documentFirm(ctx);
  const summary: AuditSummary = {
    firm,
    period,
    scope: sources.scopeText,
    items: ids.length,
    findings: [],
    holds: [],
    overdue: [],
    gaps: [],
    calibrations: 0,
    certificates: 0,
  };
  try {
    for (let start = 0; start < ids.length; start += BATCH) {
      const records = await sources.read((tx) => assembleRecords(tx, ctx, ids.slice(start, start + BATCH), period, publicUrl));
      while (records.length) await addItem(zip.add, records.shift()!, summary, index.addRows, sources);
    }
    const summaryPdf = await auditSummaryPdf(summary);
    await zip.add(summaryPdf, { name: 'summary.pdf' });
    await index.addRows([['', '', '', '', '', '', '', '', '', 'summary.pdf', 'period summary', '', summaryPdf.length, sha256(summaryPdf), '', '']]);
    await index.close();
    zip.archive.append(fs.createReadStream(index.file), { name: 'index.csv' });
    await zip.archive.finalize();
    await zip.finished;
  } catch (err) {
    zip.archive.abort();
    throw err;
  } finally {
    await index.remove();
  }
}

type AddFile = (data: Buffer, entry: ZipEntryData) => Promise<void>;

/** One item: its certificates as stored, then its record PDF, with their index rows and its part of the summary. */
async function addItem(
  add: AddFile,
  { view, certificates, thumbnails }: AssembledRecord,
  summary: AuditSummary,
  addRows: (rows: unknown[][]) => Promise<void>,
  sources: Sources,
) {
  const a = view.asset;
  const counts = [view.calibrations.length, view.checks.length, view.holds.length, view.incidents.length, view.impactReviews.length, view.custody.length];
  const rows: unknown[][] = [];
  const row = (file: string, kind: string, certificateNumber: string, bytes: number | string, hash: string, note: string) =>
    rows.push([a.assetTag, a.type, a.serialNumber, ...counts, file, kind, certificateNumber, bytes, hash, view.contentHash, note]);
  for (const c of view.calibrations) {
    summary.calibrations += 1;
    const bytes = certificates.get(c.id);
    if (!c.certificate || !bytes) {
      row('', 'certificate', c.certificateNumber, '', '', 'No certificate file is on record for this calibration.');
      summary.gaps.push({ assetTag: a.assetTag, certificateNumber: c.certificateNumber, performedOn: c.performedOn, problem: 'no certificate file on record' });
      continue;
    }
    const packFile = certificatePath(view, c.id);
    await add(bytes, { name: packFile, date: new Date(c.recordedAt) });
    summary.certificates += 1;
    if (!c.certificate.readable)
      summary.gaps.push({
        assetTag: a.assetTag,
        certificateNumber: c.certificateNumber,
        performedOn: c.performedOn,
        problem: 'certificate file cannot be read',
      });
    row(
      packFile,
      'certificate',
      c.certificateNumber,
      bytes.length,
      c.certificate.sha256,
      c.certificate.readable ? 'As stored.' : 'As stored; the file does not open as a PDF.',
    );
  }
  const pdf = await equipmentRecordPdf({
    view,
    certificates,
    thumbnails,
    format: summary.firm.format,
    publicUrl: sources.publicUrl,
    printedAt: new Date(view.generatedAt),
    placement: { annex: false, packFile: (id) => certificatePath(view, id) },
  });
  const recordPath = `records/${safeName(a.assetTag)}.pdf`;
  await add(pdf, { name: recordPath });
  const required = a.calibration.required && !view.calibrations.length;
  row(recordPath, 'equipment record', '', pdf.length, sha256(pdf), required ? 'Needs calibration, but no certificate is on record for the period.' : '');
  await addRows(rows);
  collectSummary(summary, view, sources.ctx.today);
}

function collectSummary(summary: AuditSummary, view: EquipmentRecordView, today: string) {
  const { from, to } = view.period as { from: string; to: string };
  const tag = view.asset.assetTag;
  for (const c of view.calibrations)
    if (c.asFound === 'out_of_tolerance' && c.performedOn >= from)
      summary.findings.push({
        assetTag: tag,
        foundOn: c.performedOn,
        how: `as found at calibration, certificate ${c.certificateNumber}`,
        review: reviewText(view, c.id),
      });
  for (const c of view.checks)
    if (c.decision === 'fail')
      summary.findings.push({ assetTag: tag, foundOn: c.performedAt, how: `failed ${c.kind.replace(/_/g, ' ')}`, review: reviewText(view, c.id) });
  for (const h of view.holds)
    summary.holds.push({ assetTag: tag, startedAt: h.startedAt, releasedAt: h.releasedAt, summary: h.summary, evidence: h.releaseEvidence.join('; ') });
  if (view.asset.calibration.required) {
    const coverage = view.calibrations.map((c) => ({ performedOn: c.performedOn, dueOn: c.dueOn }));
    const plan = view.asset.calibration;
    if (plan.lastCalibratedOn && plan.dueOn && !coverage.some((c) => c.performedOn === plan.lastCalibratedOn))
      coverage.push({ performedOn: plan.lastCalibratedOn, dueOn: plan.dueOn });
    const days = overdueDays({ from, to: to < today ? to : today }, coverage);
    if (days > 0) summary.overdue.push({ assetTag: tag, days });
  }
}

function reviewText(view: EquipmentRecordView, triggerId: string) {
  const review = view.impactReviews.find((r) => r.triggerId === triggerId);
  if (!review) return 'no impact review on record';
  const assessed = review.bookings.filter((b) => b.assessment).length;
  const notices = review.bookings.filter((b) => b.noticeQueuedAt).length;
  return `review ${review.state}: ${assessed} of ${review.bookings.length} booking(s) assessed, ${notices} notice(s) sent`;
}
