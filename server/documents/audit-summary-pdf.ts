import type { RecordPeriod } from '../../shared/records/views';
import { calendarDate, facts, heading, section, table } from './document-layout';
import { MM, MUTED, renderPdf, type Pdf } from './pdf';

/** What an audit pack's summary page reports, gathered while the pack's records are written. */
export type AuditSummary = {
  firm: string;
  period: RecordPeriod;
  scope: string;
  items: number;
  calibrations: number;
  certificates: number;
  findings: { assetTag: string; foundOn: string; how: string; review: string }[];
  holds: { assetTag: string; startedAt: string; releasedAt: string | null; summary: string; evidence: string }[];
  overdue: { assetTag: string; days: number }[];
  /** Calibrations whose certificate is missing or cannot be read. */
  gaps: { assetTag: string; certificateNumber: string; performedOn: string; problem: string }[];
};

const none = (doc: Pdf, sentence: string) => doc.font('Helvetica-Oblique').fontSize(9).fillColor(MUTED).text(sentence).font('Helvetica');

/** The period at a glance: out-of-tolerance findings and their reviews, holds, days past due, certificates missing. */
export const auditSummaryPdf = (s: AuditSummary) =>
  renderPdf({ size: 'A4', margin: 16 * MM, info: { Title: `Audit pack summary ${s.period.from} to ${s.period.to}` } }, (doc) => {
    heading(doc, s.firm, 'Audit pack — summary of the period', [
      `${s.period.from ? calendarDate(s.period.from) : ''} to ${s.period.to ? calendarDate(s.period.to) : ''}, both days included · ${s.scope}`,
      'Each item has its own equipment record in records/; certificates are in certificates/ as stored; index.csv lists every file with its SHA-256.',
    ]);
    facts(doc, [
      ['Items', String(s.items)],
      ['Calibrations', `${s.calibrations} (${s.certificates} certificate files in the pack)`],
      ['Out-of-tolerance findings', String(s.findings.length)],
      ['Holds', String(s.holds.length)],
      ['Items past their due date', `${s.overdue.length} (${s.overdue.reduce((sum, o) => sum + o.days, 0)} item-days in all)`],
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
        s.findings.map((f) => [f.assetTag, f.foundOn, f.how, f.review]),
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
        s.holds.map((h) => [h.assetTag, h.startedAt.slice(0, 10), h.releasedAt?.slice(0, 10) ?? 'still held', h.summary, h.evidence || '—']),
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
        s.overdue.map((o) => [o.assetTag, String(o.days)]),
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
        s.gaps.map((g) => [g.assetTag, g.certificateNumber, g.performedOn, g.problem]),
        8,
      );
  });
