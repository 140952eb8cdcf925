import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import * as mupdf from 'mupdf';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import type { EquipmentRecordView } from '../../shared/records/views';
import { pdfImagesByPage, pdfText } from '../support/pdf';
import { bearer, binaryBody, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: string;
let manager: string;
let tech: string;
const today = todayIn('Europe/Berlin');
const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');

beforeAll(async () => {
  t = await createTestApp();
  [owner, manager, tech] = await Promise.all(['owner@demo.test', 'manager@demo.test', 'tech@demo.test'].map((e) => t.tokenFor(e)));
});
afterAll(() => t.close());

const assetByTag = async (tag: string) =>
  (await t.api.get(`/api/assets?q=${tag}`).set(bearer(manager))).body.items.find((a: { assetTag: string }) => a.assetTag === tag);
const recordOf = async (id: string, query = '') => (await t.api.get(`/api/assets/${id}/record${query}`).set(bearer(manager))).body as EquipmentRecordView;
const pdfOf = async (id: string) => (await t.api.get(`/api/assets/${id}/record.pdf`).set(bearer(manager)).buffer(true).parse(binaryBody)).body as Buffer;
const pageTexts = (pdf: Buffer) => {
  const doc = mupdf.Document.openDocument(pdf, 'application/pdf');
  return Array.from({ length: doc.countPages() }, (_, i) => doc.loadPage(i).toStructuredText('preserve-whitespace').asText().replace(/\s+/g, ' '));
};

describe('the equipment record of the tracker found out of tolerance', () => {
  let trk: { id: string };
  let review: { id: string; bookings: { bookingId: string }[] };

  beforeAll(async () => {
    trk = await assetByTag('TRK-001');
    review = (await t.api.get(`/api/assets/${trk.id}/impact`).set(bearer(owner))).body;
    expect(review.bookings.length).toBeGreaterThan(0);
    const assessed = await t.api
      .put(`/api/impact-reviews/${review.id}/bookings/${review.bookings[0].bookingId}`)
      .set(bearer(owner))
      .send({ assessment: 'remeasure_offered', note: 'Bore positions re-measured on site' });
    expect(assessed.status).toBe(200);
  });

  it('lists the certificate with both results, the length check and the impact review with its assessment, each with who and when', async () => {
    const record = await recordOf(trk.id);
    const calibrations = (await t.api.get(`/api/assets/${trk.id}/calibrations`).set(bearer(manager))).body.items as {
      certificateNumber: string;
      asFound: string;
    }[];
    const oot = calibrations.find((c) => c.asFound === 'out_of_tolerance')!;
    const found = record.calibrations.find((c) => c.certificateNumber === oot.certificateNumber)!;
    expect(found).toMatchObject({ asFound: 'out_of_tolerance', asLeft: 'in_tolerance', recordedBy: 'Idris Penvale' });
    expect(found.certificateUrl).toMatch(/^\/api\/calibrations\/.+\/certificate\.pdf$/);
    expect(found.certificate).toMatchObject({ readable: true });
    expect(found.adjustment).toContain('found out of tolerance, left in tolerance');
    expect(found.dueOn > found.performedOn).toBe(true);

    const length = record.checks.find((c) => c.kind === 'length_check')!;
    expect(length).toMatchObject({ relatedAssetTag: 'BAR-001', decisionRule: 'simple', toleranceUm: 52 });
    expect(length.performedBy).toBeTruthy();
    expect(length.resultLines.join(' ')).toMatch(/Length error -?\d/);
    expect(length.inputLines.join(' ')).toContain('Bar temperature 44 °C');

    const impact = record.impactReviews.find((r) => r.id === review.id)!;
    expect(impact).toMatchObject({ trigger: 'calibration', state: 'open', foundOn: found.performedOn });
    expect(impact.bookings[0]).toMatchObject({ assessment: 'remeasure_offered', note: 'Bore positions re-measured on site', assessedBy: 'Maren Holloway' });
    expect(record.items.find((i) => i.clause === '6.4.13 c)')?.value).toContain(oot.certificateNumber);
    expect(record.custody.length).toBeGreaterThan(0);
  });

  it('reads the same facts back from the PDF, with the record date and content hash on every page and the certificate annexed', async () => {
    const record = await recordOf(trk.id);
    const pdf = await pdfOf(trk.id);
    const text = pdfText(pdf);
    const oot = record.calibrations.find((c) => c.asFound === 'out_of_tolerance')!;
    for (const fact of [
      oot.certificateNumber,
      'As found out of tolerance',
      'As left in tolerance',
      'Length check',
      'BAR-001',
      'Bar temperature 44 °C',
      're-measurement offered: Bore positions re-measured on site',
      'Contents',
    ])
      expect(text).toContain(fact);
    const pages = pageTexts(pdf);
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => expect(page).toContain(`content SHA-256 ${record.contentHash} · page ${i + 1} of ${pages.length}`));
    // The annex carries the stored certificates' own pages (the demo certificates say so on their face).
    expect(text).toContain('DEMO DOCUMENT generated by Nestkeeper');
  });

  it('shows the same hash on a reprint and a new one once the content changes', async () => {
    const first = await recordOf(trk.id);
    const again = await recordOf(trk.id);
    expect(again.generatedAt).not.toBe(first.generatedAt);
    expect(again.contentHash).toBe(first.contentHash);
    expect(first.contentHash).toMatch(/^[0-9a-f]{64}$/);
    await t.api.put(`/api/impact-reviews/${review.id}/bookings/${review.bookings[0].bookingId}`).set(bearer(owner)).send({ assessment: 'no_effect' });
    expect((await recordOf(trk.id)).contentHash).not.toBe(first.contentHash);
  });
});

describe('nothing missing silently', () => {
  it('says in words when an item has nothing on record, and when a certificate file cannot be read', async () => {
    const created = (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({
          type: 'scale_bar',
          assetTag: 'BAR-R1',
          serialNumber: 'R1',
          specs: { certifiedLengthMm: 1200.004, expansionPpmPerK: 0.6 },
          calibration: { required: true, intervalMonths: 12 },
        })
    ).body;
    const empty = await recordOf(created.id);
    expect(empty.calibrations).toEqual([]);
    expect(empty.items.find((i) => i.clause === '6.4.13 c)')?.note).toBe('No calibration certificate or field check is on record for this period.');
    expect(empty.items.find((i) => i.clause === '6.4.13 f)')).toMatchObject({ note: 'No certificate on record for these certified values.' });
    expect(empty.reference?.values.map((v) => v.value)).toEqual(['1200.004 mm', '0.6 µm/(m·K)']);
    const emptyText = pdfText(await pdfOf(created.id));
    expect(emptyText).toContain('No calibration is on record for this item in the period');
    expect(emptyText).toContain('No field check is on record for this item in the period');

    const trk = await assetByTag('TRK-002');
    const record = await recordOf(trk.id);
    const latest = record.calibrations.at(-1)!;
    await t.db.query(`UPDATE certificate_files SET data = $1 WHERE id = (SELECT certificate_file_id FROM calibration_events WHERE id = $2)`, [
      Buffer.from('this is no PDF'),
      latest.id,
    ]);
    const broken = (await recordOf(trk.id)).calibrations.at(-1)!;
    expect(broken.certificate).toMatchObject({ readable: false, sizeBytes: 14 });
    expect(pdfText(await pdfOf(trk.id))).toContain('certificate could not be read: the stored file');
  });

  it('limits the record to a period, keeping the certificate that covered its first day', async () => {
    const trk = await assetByTag('TRK-001');
    const all = await recordOf(trk.id);
    const from = addDays(today, -1);
    const recent = await recordOf(trk.id, `?from=${from}&to=${today}`);
    expect(recent.period).toEqual({ from, to: today });
    expect(recent.calibrations.map((c) => c.id)).toEqual([all.calibrations.at(-1)!.id]);
    expect(recent.checks.every((c) => c.performedAt.slice(0, 10) >= addDays(from, -1))).toBe(true);
    expect((await t.api.get(`/api/assets/${trk.id}/record?from=${today}&to=${from}`).set(bearer(manager))).body.error.details.fields).toHaveProperty('to');
  });
});

type ZipEntries = Map<string, Buffer>;
function unzip(zip: Buffer): Promise<ZipEntries> {
  return new Promise((resolve, reject) => {
    const entries: ZipEntries = new Map();
    yauzl.fromBuffer(zip, { lazyEntries: true }, (err, file) => {
      if (err || !file) return reject(err);
      file.on('entry', (entry: yauzl.Entry) =>
        file.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            entries.set(entry.fileName, Buffer.concat(chunks));
            file.readEntry();
          });
        }),
      );
      file.on('end', () => resolve(entries));
      file.on('error', reject);
      file.readEntry();
    });
  });
}

describe('the audit pack', () => {
  const from = addDays(today, -365);

  it('packs a kit: one record per member, every certificate as stored, a summary, and an index whose hashes match the files', async () => {
    const kits = (await t.api.get('/api/kits').set(bearer(owner))).body.items as { id: string; name: string; memberCount: number }[];
    const kit = kits.find((k) => k.name === 'Kit Alder')!;
    const query = `from=${from}&to=${today}&scope=kit&kitId=${kit.id}`;
    const preview = (await t.api.get(`/api/audit-pack/preview?${query}`).set(bearer(owner))).body;
    expect(preview.items).toBe(kit.memberCount);

    const res = await t.api.get(`/api/audit-pack.zip?${query}`).set(bearer(owner)).buffer(true).parse(binaryBody);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['x-pack-items']).toBe(String(kit.memberCount));
    const files = await unzip(res.body as Buffer);
    const index = parse(files.get('index.csv')!, { columns: true, bom: true }) as Record<string, string>[];

    const listed = index.filter((r) => r.file);
    expect(new Set(listed.map((r) => r.file))).toEqual(new Set([...files.keys()].filter((f) => f !== 'index.csv')));
    for (const row of listed) {
      expect(sha256(files.get(row.file)!), row.file).toBe(row.sha256);
      expect(files.get(row.file)!.length).toBe(Number(row.bytes));
    }
    const records = listed.filter((r) => r.fileKind === 'equipment record');
    expect(records).toHaveLength(kit.memberCount);
    const certificates = listed.filter((r) => r.fileKind === 'certificate');
    expect(certificates).toHaveLength(preview.certificates);
    expect(certificates.length).toBeGreaterThan(0);

    // A certificate in the pack is the stored file, byte for byte; the item's record names where it lies.
    const sample = certificates[0];
    const member = await assetByTag(sample.item);
    const calibration = (await recordOf(member.id, `?from=${from}&to=${today}`)).calibrations.find((c) => c.certificateNumber === sample.certificateNumber)!;
    const stored = (await t.api.get(calibration.certificateUrl).set(bearer(owner)).buffer(true).parse(binaryBody)).body as Buffer;
    expect(sha256(stored)).toBe(sample.sha256);
    expect(pdfText(files.get(`records/${sample.item}.pdf`)!)).toContain(`In this pack as ${sample.file}`);
    expect(pdfText(files.get('summary.pdf')!)).toContain('Audit pack — summary of the period');
  });

  it('packs the items out of tolerance or held in the period, and names them in the summary', async () => {
    const res = await t.api.get(`/api/audit-pack.zip?from=${from}&to=${today}&scope=flagged`).set(bearer(owner)).buffer(true).parse(binaryBody);
    const files = await unzip(res.body as Buffer);
    expect(files.has('records/TRK-001.pdf')).toBe(true);
    const summary = pdfText(files.get('summary.pdf')!);
    expect(summary).toMatch(/TRK-001 .*as found at calibration, certificate/);
    expect(summary).toContain('Holds in force during the period');
  });

  it('is the owner’s, and refuses unclear choices with the field named', async () => {
    expect((await t.api.get(`/api/audit-pack.zip?from=${from}&to=${today}`).set(bearer(tech))).status).toBe(403);
    const bad = await t.api.get(`/api/audit-pack/preview?from=${from}&to=${today}&scope=kit`).set(bearer(owner));
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.fields).toHaveProperty('kitId');
  });
});

describe('incident photos in the record', () => {
  it('prints each photo’s thumbnail on the incident’s page of the PDF', async () => {
    const bar = (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({ type: 'scale_bar', assetTag: 'BAR-R2', serialNumber: 'R2', specs: { certifiedLengthMm: 800.002, expansionPpmPerK: 0.6 } })
    ).body;
    // Two 640 × 480 JPEGs made by sharp; the server keeps a 320-pixel-wide thumbnail of each (tests/api/checks.test.ts).
    const photo = (background: string) =>
      sharp({ create: { width: 640, height: 480, channels: 3, background } })
        .jpeg()
        .toBuffer();
    const reported = await t.api
      .post('/api/incidents')
      .set(bearer(tech))
      .field('assetId', bar.id)
      .field('kind', 'dropped')
      .field('description', 'Slid off the bench onto the floor mat.')
      .field('occurredAt', `${today}T08:30:00Z`)
      .attach('photos', await photo('#88775f'), { filename: 'left-end.jpg', contentType: 'image/jpeg' })
      .attach('photos', await photo('#3f5f88'), { filename: 'right-end.jpg', contentType: 'image/jpeg' });
    expect(reported.status).toBe(201);
    const pdf = await pdfOf(bar.id);
    const texts = pageTexts(pdf);
    // The hold the report started quotes the description too: the incident's page is the one listing its photos.
    const incidentPage = texts.findIndex((text) => /Photos 2: (left|right)-end\.jpg, (left|right)-end\.jpg/.test(text));
    expect(incidentPage).toBeGreaterThanOrEqual(0);
    expect(texts[incidentPage]).toContain('Description Slid off the bench onto the floor mat.');
    const images = pdfImagesByPage(pdf);
    expect(images[incidentPage]).toEqual([
      { width: 320, height: 240 },
      { width: 320, height: 240 },
    ]);
    expect(images.flat()).toHaveLength(2);
  });
});
