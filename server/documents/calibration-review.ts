import type { DueRow } from '../../shared/calibration/views';
import type { DocumentFirm } from './document-layout';
import { toCsv } from './csv';
import { INK, MM, MUTED, renderPdf } from './pdf';

/** Each booking the item's due date threatens; `period` words its days (ISO in the CSV, the firm's format on paper). */
const threatenedText = (r: DueRow, period: (first: string, last: string) => string) =>
  r.threatened.map((t) => `${t.jobReference ?? 'booking'} ${period(t.startsOn, t.endsOn)}`).join('; ');

/** The overdue and due-soon list as CSV: codes and ISO 8601 dates, as programs read them (csv.ts). */
export const dueItemsCsv = (rows: DueRow[]) =>
  toCsv(
    ['assetTag', 'type', 'state', 'dueOn', 'provider', 'kit', 'status', 'threatenedBookings'],
    rows.map((r) => [r.assetTag, r.type, r.state, r.dueOn ?? '', r.provider ?? '', r.kitName ?? '', r.status, threatenedText(r, (a, b) => `${a}/${b}`)]),
  );

/** A one-glance PDF of the same list for the owner's meeting or an auditor. */
export function dueItemsPdf(firm: DocumentFirm, today: string, rows: DueRow[]) {
  const f = firm.format;
  return renderPdf({ size: 'A4', layout: 'landscape', margin: 14 * MM, info: { Title: `Recalibrations due — ${f.date(today)}` } }, (doc) => {
    doc.font('Helvetica').fontSize(9).fillColor(MUTED).text(firm.name);
    doc
      .font('Helvetica-Bold')
      .fontSize(15)
      .fillColor(INK)
      .text(`Recalibrations overdue and due soon — ${f.date(today)}`);
    doc.moveDown(0.8);
    const cols = [0, 32, 62, 84, 106, 150, 185].map((c) => doc.page.margins.left + c * MM);
    const header = ['Item', 'Type', 'State', 'Due', 'Provider', 'Kit', 'Bookings it threatens'];
    let y = doc.y;
    doc.font('Helvetica-Bold').fontSize(8.5);
    header.forEach((h, i) => doc.text(h, cols[i], y));
    y += 13;
    doc.font('Helvetica').fontSize(8.5);
    for (const r of rows) {
      if (y > doc.page.height - doc.page.margins.bottom - 14) {
        doc.addPage();
        y = doc.page.margins.top;
      }
      const cells = [
        r.assetTag,
        r.type.replace('_', ' '),
        r.state === 'overdue' ? 'OVERDUE' : 'due soon',
        r.dueOn ? f.date(r.dueOn) : 'none on record',
        r.provider ?? '',
        r.kitName ?? '',
        threatenedText(r, f.dateRange) || '—',
      ];
      cells.forEach((c, i) =>
        doc
          .font(i === 0 ? 'Courier-Bold' : i === 2 && r.state === 'overdue' ? 'Helvetica-Bold' : 'Helvetica')
          .text(c, cols[i], y, { width: i === 6 ? 90 * MM : 30 * MM, lineBreak: false, ellipsis: true }),
      );
      y += 13;
    }
    if (!rows.length) doc.text('Nothing is overdue or due soon.', cols[0], y);
  });
}
