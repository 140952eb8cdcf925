/**
 * Layout pieces shared by the rental documents (agreement, invoice, certificate
 * pack cover): heading, sections, a paginating table and a totals block, in the
 * house style of the other Nestkeeper PDFs.
 */
import type { FirmFormat } from '../../shared/formatting/firm-format';
import { assetTypeTitles, type AssetType } from '../../shared/assets/vocabulary';
import { BRASS, INK, MM, MUTED, type Pdf } from './pdf';
import { batteryCautions } from './shipping-sheet-pdf';

const BODY = 9;

/**
 * Who prints a document and in whose voice: every date, time, amount and length on paper goes through the firm's
 * format (shared/formatting), made without a reader's zone so times always name the firm's zone.
 */
export type DocumentFirm = { name: string; format: FirmFormat };

/** 1 900 basis points → "19 %" in the firm's numbers ("19,5 %" for a decimal comma). */
export const taxRateText = (basisPoints: number, f: FirmFormat) => `${f.number(basisPoints / 100, 2)} %`;

/** Two calendar dates as a period a person signs for: "3–12 Mar 2025, both days included". */
export const daysIncluded = (f: FirmFormat, first: string, last: string) => `${f.dateRange(first, last)}, both days included`;

export const typeTitle = (type: string) => assetTypeTitles[type as AssetType] ?? type;

export const contentWidth = (doc: Pdf) => doc.page.width - doc.page.margins.left - doc.page.margins.right;
const bottom = (doc: Pdf) => doc.page.height - doc.page.margins.bottom;

/** pdfkit breaks pages only for flowing text; anything placed at an explicit y asks here first. */
export function keepTogether(doc: Pdf, height: number) {
  if (doc.y + height > bottom(doc)) doc.addPage();
}

export function heading(doc: Pdf, firm: string, title: string, notes: string[] = []) {
  doc.font('Helvetica').fontSize(BODY).fillColor(MUTED).text(firm);
  doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(title);
  doc.font('Helvetica').fontSize(BODY).fillColor(MUTED);
  for (const note of notes) doc.text(note);
  doc.fillColor(INK).moveDown(0.8);
}

/** A brass rule and a title, kept on the page with at least a few lines of what follows. */
export function section(doc: Pdf, title: string) {
  keepTogether(doc, 60);
  const left = doc.page.margins.left;
  doc.moveDown(0.6);
  doc.save().rect(left, doc.y, contentWidth(doc), 2).fill(BRASS).restore();
  doc.moveDown(0.5);
  doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text(title, left);
  doc.font('Helvetica').fontSize(BODY).moveDown(0.3);
}

/** Label–value lines (a customer block, rental dates); a line whose value is null is left out. */
export function facts(doc: Pdf, rows: [label: string, value: string | null][]) {
  const left = doc.page.margins.left;
  for (const [label, value] of rows) {
    if (value === null) continue;
    keepTogether(doc, 14);
    const y = doc.y;
    doc
      .font('Helvetica')
      .fontSize(BODY)
      .fillColor(MUTED)
      .text(label, left, y, { width: 40 * MM });
    const labelEnd = doc.y;
    doc.fillColor(INK).text(value, left + 42 * MM, y, { width: contentWidth(doc) - 42 * MM });
    doc.x = left;
    doc.y = Math.max(doc.y, labelEnd);
  }
}

export function bullets(doc: Pdf, lines: string[]) {
  const left = doc.page.margins.left;
  doc.font('Helvetica').fontSize(BODY).fillColor(INK);
  for (const line of lines) doc.text(`•  ${line}`, left, doc.y, { width: contentWidth(doc), paragraphGap: 2 });
}

/** `share` is the column's part of the content width; `mono` prints tags and serials in the mono face. */
export type Column = { header: string; share: number; mono?: boolean; right?: boolean };

const GAP = 2 * MM;
const cellFont = (column: Column, header: boolean) => (header ? 'Helvetica-Bold' : column.mono ? 'Courier' : 'Helvetica');

/** Rows wrap inside their cells; a new page repeats the header. */
export function table(doc: Pdf, columns: Column[], rows: string[][], fontSize = BODY) {
  const left = doc.page.margins.left;
  const widths = columns.map((c) => c.share * contentWidth(doc));
  const height = (cells: string[], header: boolean) =>
    Math.max(
      ...cells.map((text, i) =>
        doc
          .font(cellFont(columns[i], header))
          .fontSize(fontSize)
          .heightOfString(text, { width: widths[i] - GAP }),
      ),
    ) + 3;
  const draw = (cells: string[], header: boolean) => {
    const y = doc.y;
    let x = left;
    doc.fillColor(header ? MUTED : INK);
    cells.forEach((text, i) => {
      doc
        .font(cellFont(columns[i], header))
        .fontSize(fontSize)
        .text(text, x, y, { width: widths[i] - GAP, align: columns[i].right ? 'right' : 'left' });
      x += widths[i];
    });
    doc.x = left;
    doc.y = y + height(cells, header);
    if (header)
      doc
        .save()
        .strokeColor('#d8d1c2')
        .lineWidth(0.5)
        .moveTo(left, doc.y - 1.5)
        .lineTo(left + contentWidth(doc), doc.y - 1.5)
        .stroke()
        .restore();
  };
  const header = columns.map((c) => c.header);
  keepTogether(doc, height(header, true) + (rows[0] ? height(rows[0], false) : 0));
  draw(header, true);
  for (const row of rows) {
    if (doc.y + height(row, false) > bottom(doc)) {
      doc.addPage();
      draw(header, true);
    }
    draw(row, false);
  }
  doc.font('Helvetica').fontSize(BODY).fillColor(INK);
}

/** Right-hand money lines under a table; `strong` lines print bold. */
export function totals(doc: Pdf, rows: { label: string; value: string; strong?: boolean }[]) {
  const width = contentWidth(doc);
  const labelX = doc.page.margins.left + width * 0.4;
  const valueX = doc.page.margins.left + width * 0.75;
  keepTogether(doc, rows.length * 13 + 8);
  doc.moveDown(0.4);
  for (const row of rows) {
    const y = doc.y;
    doc
      .font(row.strong ? 'Helvetica-Bold' : 'Helvetica')
      .fontSize(BODY)
      .fillColor(INK);
    doc.text(row.label, labelX, y, { width: valueX - labelX - GAP, align: 'right' });
    doc.text(row.value, valueX, y, { width: width * 0.25 - GAP, align: 'right' });
    doc.y = Math.max(doc.y, y + 13);
  }
  doc.x = doc.page.margins.left;
}

/** DESIGN.md §6: the laser line joins the battery and lifting cautions the shipping sheet already prints. */
export const rentalCautions = [
  "Laser trackers emit a visible laser beam, commonly IEC 60825-1 Class 2 (the class on the instrument's label applies): do not stare into the beam and do not point it at anyone's eyes.",
  ...batteryCautions,
];

/** Signature lines side by side, one per party ("For <party>"). */
export function signatureLines(doc: Pdf, parties: string[]) {
  keepTogether(doc, 80);
  doc.moveDown(3);
  const y = doc.y;
  const width = contentWidth(doc) / parties.length;
  parties.forEach((party, i) => {
    const x = doc.page.margins.left + i * width;
    doc
      .save()
      .strokeColor(INK)
      .lineWidth(0.6)
      .moveTo(x, y)
      .lineTo(x + width - 12 * MM, y)
      .stroke()
      .restore();
    doc
      .font('Helvetica-Bold')
      .fontSize(9)
      .fillColor(INK)
      .text(`For ${party}`, x, y + 4, { width: width - 12 * MM });
    doc
      .font('Helvetica')
      .fillColor(MUTED)
      .text('Name, signature and date', x, doc.y, { width: width - 12 * MM });
  });
  doc.x = doc.page.margins.left;
}
