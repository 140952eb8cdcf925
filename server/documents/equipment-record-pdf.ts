import { PDFDocument, rgb, StandardFonts } from 'pdf-lib';
import { checkKindTitles } from '../../shared/checks/vocabulary';
import { custodyWord } from '../../shared/assets/record-words';
import { holdReasonWords } from '../../shared/holds/release-rule';
import { incidentKindTitles, incidentStateTitles, type IncidentKind, type IncidentState } from '../../shared/incidents/vocabulary';
import type { EquipmentRecordView } from '../../shared/records/views';
import { certificatePages, certificateStatusText } from './certificate-pack';
import type { FirmFormat } from '../../shared/formatting/firm-format';
import { contentWidth, facts, keepTogether, section, table, typeTitle } from './document-layout';
import { BRASS, forStandardFonts, INK, MM, MUTED, renderPdf, type Pdf } from './pdf';

/** Where the record's certificates are: appended to this PDF, or beside it in an audit pack (by calibration id). */
export type CertificatePlacement = { annex: true } | { annex: false; packFile: (calibrationId: string) => string };

export type RecordPdfInput = {
  view: EquipmentRecordView;
  certificates: Map<string, Buffer | null>;
  thumbnails: Map<string, Buffer>;
  /** The firm's format (no reader's zone: times name the firm's zone). */
  format: FirmFormat;
  publicUrl: string;
  printedAt: Date;
  placement: CertificatePlacement;
};

const words = (v: string) => v.replace(/_/g, ' ');
const ruleWords = { simple: 'simple acceptance', guarded: 'guarded acceptance, guard band w = U' } as const;
const assessmentWords = { no_effect: 'no effect on the results', customer_notified: 'customer notified', remeasure_offered: 're-measurement offered' } as const;
const MARGIN = 18 * MM;
const FOOTER = 10 * MM;

type Annexed = { calibrationId: string; certificateNumber: string; firstPage: number; pageCount: number };

function periodText(view: EquipmentRecordView, f: FirmFormat) {
  const { from, to } = view.period;
  if (!from && !to) return 'Everything on record for this item.';
  const period = from && to ? f.dateRange(from, to) : `${from ? f.date(from) : 'from the first record'} to ${to ? f.date(to) : 'today'}`;
  return `Period ${period}, both days included; the certificate that covered the period's first day is listed too.`;
}

/** "nothing of this kind in the period", said in a sentence instead of an empty table. */
const none = (doc: Pdf, sentence: string) => doc.font('Helvetica-Oblique').fontSize(9).fillColor(MUTED).text(sentence).font('Helvetica').fillColor(INK);

function itemsSection(doc: Pdf, view: EquipmentRecordView) {
  table(
    doc,
    [
      { header: 'Clause', share: 0.1 },
      { header: 'What the clause asks for', share: 0.38 },
      { header: 'What Nestkeeper holds', share: 0.52 },
    ],
    view.items.map((i) => [i.clause, i.requirement, [i.value ?? 'Nothing recorded.', i.note].filter(Boolean).join('\n')]),
    8,
  );
}

function certificateWhere(view: EquipmentRecordView, id: string, input: RecordPdfInput, annexed: Annexed[]) {
  const c = view.calibrations.find((x) => x.id === id)!;
  if (!c.certificate) return 'No certificate file is on record for this calibration.';
  if (!c.certificate.readable) return `${certificateStatusText.unreadable}: the stored file "${c.certificate.fileName}" does not open as a PDF.`;
  const fileLine = `"${c.certificate.fileName}", ${input.format.count(c.certificate.sizeBytes)} bytes, SHA-256 ${c.certificate.sha256}`;
  if (!input.placement.annex) return `In this pack as ${input.placement.packFile(id)} (${fileLine}).`;
  const a = annexed.find((x) => x.calibrationId === id);
  return a
    ? `Annexed on ${a.pageCount === 1 ? `page ${a.firstPage}` : `pages ${a.firstPage}–${a.firstPage + a.pageCount - 1}`} (${fileLine}).`
    : `Not annexed: ${certificateStatusText.withheld} (${fileLine}).`;
}

function calibrationsSection(doc: Pdf, input: RecordPdfInput, annexed: Annexed[]) {
  const { view, format: f } = input;
  if (!view.calibrations.length) return none(doc, 'No calibration is on record for this item in the period, so there is no certificate to show.');
  for (const c of view.calibrations) {
    keepTogether(doc, 110);
    doc
      .font('Helvetica-Bold')
      .fontSize(10)
      .fillColor(INK)
      .text(`${f.date(c.performedOn)} · ${c.provider} · certificate `, { continued: true });
    doc.fillColor(BRASS).text(c.certificateNumber, { link: `${input.publicUrl.replace(/\/$/, '')}${c.certificateUrl}`, underline: true });
    doc.fillColor(INK).font('Helvetica').fontSize(9);
    facts(doc, [
      ['As found', words(c.asFound)],
      ['As left', words(c.asLeft)],
      ['Adjustment', c.adjustment],
      ['Interval and due date set', `${c.intervalMonths} months, due ${f.date(c.dueOn)}`],
      ['Certificate file', certificateWhere(view, c.id, input, annexed)],
      ['Note', c.note],
      ['Recorded', `${f.dateTime(c.recordedAt)} by ${c.recordedBy ?? 'someone no longer on record'}`],
    ]);
    doc.moveDown(0.6);
  }
}

function checksSection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.checks.length) return none(doc, 'No field check is on record for this item in the period.');
  for (const c of view.checks) {
    keepTogether(doc, 120);
    doc
      .font('Helvetica-Bold')
      .fontSize(10)
      .fillColor(INK)
      .text(`${checkKindTitles[c.kind]}${c.position ? ` (${c.position})` : ''} · ${f.dateTime(c.performedAt)} · ${c.decision === 'pass' ? 'PASS' : 'FAIL'}`);
    doc.font('Helvetica').fontSize(9);
    facts(doc, [
      ['With', c.relatedAssetTag],
      ['Inputs', c.inputLines.join('\n') || 'Not stored.'],
      ['Result', c.resultLines.join('\n') || 'Not stored.'],
      ['Tolerance', f.um(c.toleranceUm)],
      ['Uncertainty', `U = ${f.um(c.expandedUncertaintyUm)} (k = 2); guard band ${f.um(c.guardBandUm)}`],
      ['Decision rule', `${ruleWords[c.decisionRule]} (ILAC-G8)`],
      ['Decision', c.decision],
      ['Note', c.note],
      ['Performed by', c.performedBy ?? 'someone no longer on record'],
    ]);
    doc.moveDown(0.6);
  }
}

function holdsSection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.holds.length) return none(doc, 'The item was not on hold in the period.');
  for (const h of view.holds) {
    keepTogether(doc, 80);
    doc.font('Helvetica-Bold').fontSize(10).fillColor(INK).text(`${holdReasonWords[h.reason]} · ${h.summary}`);
    doc.font('Helvetica').fontSize(9);
    facts(doc, [
      ['Held', `${f.dateTime(h.startedAt)} by ${h.startedBy ?? 'someone no longer on record'}`],
      ['Released', h.releasedAt ? `${f.dateTime(h.releasedAt)} by ${h.releasedBy ?? 'someone no longer on record'}` : 'Not released: still on hold'],
      ['Evidence', h.releasedAt ? h.releaseEvidence.join('\n') || 'No evidence is on record for this release.' : null],
      ['Release note', h.releaseNote],
    ]);
    doc.moveDown(0.6);
  }
}

const THUMB_W = 38 * MM;
const THUMB_H = 28 * MM;

function incidentsSection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.incidents.length) return none(doc, 'No damage, loss or malfunction was reported for this item in the period.');
  for (const i of view.incidents) {
    // The first row of thumbnails stays on the page of the words that describe them.
    keepTogether(doc, 90 + (i.photos.length ? THUMB_H + 4 : 0));
    doc
      .font('Helvetica-Bold')
      .fontSize(10)
      .fillColor(INK)
      .text(
        `${incidentKindTitles[i.kind as IncidentKind] ?? 'Damage or loss'} · ${f.dateTime(i.occurredAt)} · ${incidentStateTitles[i.state as IncidentState] ?? 'Reported'}`,
      );
    doc.font('Helvetica').fontSize(9);
    facts(doc, [
      ['Description', i.description],
      ['Where', i.location],
      ['Resolution', i.resolution],
      ['Reported by', i.reportedBy ?? 'someone no longer on record'],
      ['Photos', i.photos.length ? `${i.photos.length}: ${i.photos.map((p) => p.fileName).join(', ')}` : 'No photos were taken.'],
    ]);
    const left = doc.page.margins.left;
    let x = left;
    for (const p of i.photos) {
      const thumb = input.thumbnails.get(p.id);
      if (x + THUMB_W > left + contentWidth(doc)) {
        x = left;
        doc.y += THUMB_H + 4;
      }
      keepTogether(doc, THUMB_H + 4);
      if (thumb) doc.image(thumb, x, doc.y, { fit: [THUMB_W, THUMB_H] });
      else
        doc
          .fontSize(7.5)
          .fillColor(MUTED)
          .text(`${p.fileName}: no thumbnail (this kind of photo opens in Nestkeeper)`, x, doc.y, { width: THUMB_W, height: THUMB_H });
      x += THUMB_W + 3 * MM;
    }
    if (i.photos.length) doc.y += THUMB_H + 4;
    doc.x = left;
    doc.fillColor(INK).moveDown(0.6);
  }
}

function reviewsSection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.impactReviews.length) return none(doc, 'No impact review concerns this item in the period.');
  for (const r of view.impactReviews) {
    keepTogether(doc, 90);
    doc
      .font('Helvetica-Bold')
      .fontSize(10)
      .fillColor(INK)
      .text(`Found ${r.trigger === 'calibration' ? 'out of tolerance as found' : 'failing a field check'} on ${f.date(r.foundOn)} · review ${r.state}`);
    doc.font('Helvetica').fontSize(9);
    facts(doc, [
      ['Last passing evidence', r.since ? f.date(r.since) : 'none on record: every earlier use is in question'],
      ['Opened', f.dateTime(r.openedAt)],
      ['Closed', r.closedAt ? f.dateTime(r.closedAt) : null],
    ]);
    if (!r.bookings.length) none(doc, 'No booking used the item between its last passing evidence and the finding.');
    else
      table(
        doc,
        [
          { header: 'Job', share: 0.14 },
          { header: 'Customer', share: 0.17 },
          { header: 'Dates', share: 0.17 },
          { header: 'Assessment', share: 0.26 },
          { header: 'Notice', share: 0.26 },
        ],
        r.bookings.map((b) => [
          b.jobReference ?? 'booking',
          b.customerName ?? '—',
          f.dateRange(b.startsOn, b.endsOn),
          b.assessment
            ? `${assessmentWords[b.assessment]}${b.note ? `: ${b.note}` : ''} (${b.assessedBy ?? '?'}, ${b.assessedAt ? f.dateTime(b.assessedAt) : '?'})`
            : 'not assessed yet',
          b.noticeQueuedAt ? `sent to ${b.noticeTo ?? 'the customer'} ${f.dateTime(b.noticeQueuedAt)}` : 'no notice sent',
        ]),
        8,
      );
    doc.moveDown(0.6);
  }
}

function intervalsSection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.intervalChanges.length) return none(doc, 'The calibration interval did not change in the period.');
  table(
    doc,
    [
      { header: 'When', share: 0.2 },
      { header: 'Interval', share: 0.14 },
      { header: 'Reason', share: 0.48 },
      { header: 'By', share: 0.18 },
    ],
    view.intervalChanges.map((c) => [f.dateTime(c.at), `${c.fromMonths ?? '—'} → ${c.toMonths ?? '—'} months`, c.reason, c.by ?? '—']),
    8,
  );
}

function referenceSection(doc: Pdf, view: EquipmentRecordView, f: FirmFormat) {
  const r = view.reference;
  if (!r) return none(doc, `A ${typeTitle(view.asset.type).toLowerCase()} is not a reference artefact: it carries no certified values.`);
  facts(doc, [
    ...r.values.map((v): [string, string] => [v.label, v.value]),
    ['Certificate', r.certificateNumber ?? 'No certificate on record for these values.'],
    ['Valid', r.validThrough ? `${r.validFrom ? f.date(r.validFrom) : '?'} to ${f.date(r.validThrough)}` : 'No validity on record.'],
  ]);
}

function custodySection(doc: Pdf, input: RecordPdfInput) {
  const { view, format: f } = input;
  if (!view.custody.length) return none(doc, 'No hand-over, lab shipment, return, hold or release is on record in the period.');
  table(
    doc,
    [
      { header: 'When', share: 0.19 },
      { header: 'What', share: 0.14 },
      { header: 'Holder', share: 0.2 },
      { header: 'Where', share: 0.17 },
      { header: 'Note', share: 0.16 },
      { header: 'By', share: 0.14 },
    ],
    view.custody.map((c) => [f.dateTime(c.at), custodyWord(c.kind), c.holder ?? '—', c.location ?? '—', c.note ?? '', c.by ?? '—']),
    7.5,
  );
}

const sections: { title: string; draw: (doc: Pdf, input: RecordPdfInput, annexed: Annexed[]) => void }[] = [
  { title: 'ISO/IEC 17025:2017 §6.4.13 at a glance', draw: (doc, input) => itemsSection(doc, input.view) },
  { title: 'Calibrations and certificates', draw: calibrationsSection },
  { title: 'Field checks', draw: checksSection },
  { title: 'Holds and releases', draw: holdsSection },
  { title: 'Incidents', draw: incidentsSection },
  { title: 'Impact reviews', draw: reviewsSection },
  { title: 'Calibration interval changes', draw: intervalsSection },
  { title: 'Reference artefact (§6.4.13 f)', draw: (doc, input) => referenceSection(doc, input.view, input.format) },
  { title: 'Chain of custody', draw: custodySection },
];

/** Drawn by pdfkit and, on annexed pages, by pdf-lib: its standard font also draws WinAnsi only. */
const footerText = (input: RecordPdfInput, page: number, total: number) =>
  forStandardFonts(
    `${input.view.asset.assetTag} · record of ${input.format.date(input.view.recordDate)} · content SHA-256 ${input.view.contentHash} · page ${page} of ${total}`,
  );

/** The record's pages (pdfkit): heading, contents, the sections, and the footer with the hash on every page. */
function recordPages(input: RecordPdfInput, annexed: Annexed[], annexPages: number) {
  const { view } = input;
  return renderPdf(
    {
      size: 'A4',
      margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER },
      bufferPages: true,
      info: { Title: `Equipment record ${view.asset.assetTag}` },
    },
    (doc) => {
      doc.font('Helvetica').fontSize(9).fillColor(MUTED).text(view.organization.name);
      doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(`Equipment record — ${view.asset.assetTag}`);
      doc
        .font('Helvetica')
        .fontSize(9)
        .fillColor(MUTED)
        .text(
          `${typeTitle(view.asset.type)} · ${[view.asset.manufacturer, view.asset.model].filter(Boolean).join(' ')} · S/N ${view.asset.serialNumber}. ${periodText(view, input.format)}`,
        )
        .text(`Record of ${input.format.date(view.recordDate)}; printed ${input.format.dateTime(input.printedAt)} by Nestkeeper.`)
        .text(`Content SHA-256 ${view.contentHash}: a reprint of the same content shows the same hash.`);
      doc.moveDown(0.8);
      doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text('Contents');
      const tocTop = doc.y + 2;
      const tocLines = sections.length + Math.min(annexed.length, 12) + (annexed.length > 12 ? 1 : 0);
      doc.y = tocTop + tocLines * 12 + 6;
      const starts: number[] = [];
      for (const s of sections) {
        section(doc, s.title);
        const range = doc.bufferedPageRange();
        starts.push(range.start + range.count);
        doc.outline.addItem(s.title);
        s.draw(doc, input, annexed);
      }
      const recordPageCount = doc.bufferedPageRange().count;
      const total = recordPageCount + annexPages;
      doc.switchToPage(0);
      const left = doc.page.margins.left;
      const width = contentWidth(doc);
      const line = (text: string, page: string, i: number) => {
        const y = tocTop + i * 12;
        doc
          .font('Helvetica')
          .fontSize(9)
          .fillColor(INK)
          .text(text, left, y, { width: width - 20 * MM, lineBreak: false });
        doc.text(page, left + width - 20 * MM, y, { width: 20 * MM, align: 'right', lineBreak: false });
      };
      sections.forEach((s, i) => line(`${i + 1}. ${s.title}`, String(starts[i]), i));
      annexed.slice(0, 12).forEach((a, i) => line(`Annex: certificate ${a.certificateNumber}`, String(a.firstPage), sections.length + i));
      if (annexed.length > 12) line(`Annex: ${annexed.length - 12} more certificates`, String(annexed[12].firstPage), sections.length + 12);
      for (let p = 0; p < recordPageCount; p += 1) {
        doc.switchToPage(p);
        const bottom = doc.page.margins.bottom;
        doc.page.margins.bottom = 0;
        doc
          .font('Courier')
          .fontSize(6.5)
          .fillColor(MUTED)
          .text(footerText(input, p + 1, total), left, doc.page.height - MARGIN - 4, { width, lineBreak: false });
        doc.page.margins.bottom = bottom;
      }
    },
  );
}

/**
 * The equipment record as PDF: contents, each section (saying in words when it holds nothing), the record's date
 * and content hash on every page, and, when asked, each readable certificate appended as an annex.
 */
export async function equipmentRecordPdf(input: RecordPdfInput): Promise<Buffer> {
  const annex = await PDFDocument.create();
  const annexed: Omit<Annexed, 'firstPage'>[] = [];
  if (input.placement.annex) {
    for (const c of input.view.calibrations) {
      if (!c.certificate?.readable) continue;
      const found = await certificatePages(annex, input.certificates.get(c.id) ?? null);
      if (typeof found === 'string') continue;
      found.pages.forEach((p) => annex.addPage(p));
      annexed.push({ calibrationId: c.id, certificateNumber: c.certificateNumber, pageCount: found.pages.length });
    }
  }
  const annexPages = annex.getPageCount();
  if (!annexPages) return recordPages(input, [], 0);
  // The record's own page count decides where the annex starts; the contents are sized before the count is known.
  const draft = await recordPages(input, placeAnnex(annexed, 1), annexPages);
  const recordPageCount = (await PDFDocument.load(draft)).getPageCount();
  const placed = placeAnnex(annexed, recordPageCount + 1);
  const record = await recordPages(input, placed, annexPages);
  const out = await PDFDocument.load(record);
  const font = await out.embedFont(StandardFonts.Courier);
  const total = recordPageCount + annexPages;
  const copied = await out.copyPages(annex, annex.getPageIndices());
  copied.forEach((page, i) => {
    out.addPage(page);
    const { width } = page.getSize();
    page.drawRectangle({ x: 0, y: 0, width, height: 16, color: rgb(1, 1, 1) });
    page.drawText(footerText(input, recordPageCount + i + 1, total), { x: 12, y: 5, size: 6, font, color: rgb(0.36, 0.39, 0.46) });
  });
  return Buffer.from(await out.save());
}

function placeAnnex(annexed: Omit<Annexed, 'firstPage'>[], firstPage: number): Annexed[] {
  let page = firstPage;
  return annexed.map((a) => {
    const placed = { ...a, firstPage: page };
    page += a.pageCount;
    return placed;
  });
}
