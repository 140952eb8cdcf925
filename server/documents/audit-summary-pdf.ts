import type { RecordPeriod } from '../../shared/records/views';
import { facts, heading, section, table, type DocumentFirm } from './document-layout';
import { MM, MUTED, renderPdf, type Pdf } from './pdf';

/** What an audit pack's summary page reports, gathered while the pack's records are written. */
export type AuditSummary = {
  firm: DocumentFirm;
  period: RecordPeriod;
  scope: string;
  items: number;
  calibrations: number;
  certificates: number;
  /** Dates as calendar dates or moments: the summary prints each as the firm's date. */
  findings: { assetTag: string; foundOn: string; how: string; review: string }[];
  holds: { assetTag: string; startedAt: string; releasedAt: string | null; summary: string; evidence: string }[];
  overdue: { assetTag: string; days: number }[];
  /** Calibrations whose certificate is missing or cannot be read. */
  gaps: { assetTag: string; certificateNumber: string; performedOn: string; problem: string }[];
};

const none = (doc: Pdf, sentence: string) => doc.font('Helvetica-Oblique').fontSize(9).fillColor(MUTED).text(sentence).font('Helvetica');

/** The period at a glance: out-of-tolerance findings and their reviews, holds, days past due, certificates missing. */
export function auditSummaryPdf(s: AuditSummary) {
  const f = s.firm.format;
  const period = s.period.from && s.period.to ? f.dateRange(s.period.from, s.period.to) : `${f.date(s.period.from)} to ${f.date(s.period.to)}`;
  return renderPdf({ size: 'A4', margin: 16 * MM, info: { Title: `Audit pack summary ${period}` } }, (doc) => {
    heading(doc, s.firm.name, 'Audit pack — summary of the period', [
      `${period}, both days included · ${s.scope}`,
      'Each item has its own equipment record in records/; certificates are in certificates/ as stored; index.csv lists every file with its SHA-256.',
    ]);
    facts(doc, [
      ['Items', f.count(s.items)],
      ['Calibrations', `${f.count(s.calibrations)} (${f.count(s.certificates)} certificate files in the pack)`],
      ['Out-of-tolerance findings', f.count(s.findings.length)],
      ['Holds', f.count(s.holds.length)],
      ['Items past their due date', `${f.count(s.overdue.length)} (${f.count(s.overdue.reduce((sum, o) => sum + o.days, 0))} item-days in all)`],
    ]);
    section(doc, 'Out-of-tolerance findings and their impact reviews');
    if (!s.findings.length) none(doc, 'No item was found out of tolerance in the period.');
    else
      table(
        doc,
        [
          { header: 'Item', share: 0.14, mono: true },
          { header: 'Found on', share: 0.13 },
          { header: 'How', share: 0.33 },
          { header: 'Review', share: 0.4 },
        ],
        s.findings.map((x) => [x.assetTag, f.date(x.foundOn), x.how, x.review]),
        8,
      );
    section(doc, 'Holds in force during the period');
    if (!s.holds.length) none(doc, 'No item was on hold in the period.');
    else
      table(
        doc,
        [
          { header: 'Item', share: 0.14, mono: true },
          { header: 'Held', share: 0.13 },
          { header: 'Released', share: 0.13 },
          { header: 'Why', share: 0.3 },
          { header: 'Released on evidence', share: 0.3 },
        ],
        s.holds.map((h) => [h.assetTag, f.date(h.startedAt), h.releasedAt ? f.date(h.releasedAt) : 'still held', h.summary, h.evidence || '—']),
        8,
      );
    section(doc, 'Days past the calibration due date');
    if (!s.overdue.length) none(doc, 'No item that needs calibration was past its due date in the period.');
    else
      table(
        doc,
        [
          { header: 'Item', share: 0.3, mono: true },
          { header: 'Days past due in the period', share: 0.7 },
        ],
        s.overdue.map((o) => [o.assetTag, f.count(o.days)]),
        8,
      );
    section(doc, 'Certificates missing or unreadable');
    if (!s.gaps.length) none(doc, 'Every calibration in the period has its certificate file, and each one opens as a PDF.');
    else
      table(
        doc,
        [
          { header: 'Item', share: 0.16, mono: true },
          { header: 'Certificate', share: 0.24 },
          { header: 'Calibrated on', share: 0.2 },
          { header: 'Problem', share: 0.4 },
        ],
        s.gaps.map((g) => [g.assetTag, g.certificateNumber, f.date(g.performedOn), g.problem]),
        8,
      );
  });
}
