import type { AssetView } from '../../shared/assets/views';
import { assetTypeTitles } from '../../shared/schemas/assets';
import type { DocumentFirm } from './document-layout';
import { drawQr, INK, MM, MUTED, renderPdf, type Pdf } from './pdf';

/** Label size: 70 × 36 mm, a common roll-label format. */
const LABEL_W = 70 * MM;
const LABEL_H = 36 * MM;

/** The calibration status line (ISO/IEC 17025:2017 §6.4.8: equipment labelled with its calibration status or validity period). */
function calibrationLine(a: AssetView, firm: DocumentFirm) {
  if (!a.calibration.required) return 'Calibration: not required';
  if (!a.calibration.dueOn) return 'Calibration: none on record';
  return `Calibration due ${firm.format.date(a.calibration.dueOn)}`;
}

function drawLabel(doc: Pdf, a: AssetView, firm: DocumentFirm, x: number, y: number, w: number, h: number) {
  const pad = 2 * MM;
  const qr = h - 2 * pad;
  doc.save().lineWidth(0.5).strokeColor('#c9c2b3').rect(x, y, w, h).stroke().restore();
  drawQr(doc, a.qrPayload, x + pad, y + pad, qr);
  const tx = x + pad + qr + 2 * MM;
  const tw = w - (tx - x) - pad;
  const size = Math.max(6, Math.min(9, h / 11));
  doc
    .fillColor(INK)
    .font('Courier-Bold')
    .fontSize(size * 1.55)
    .text(a.assetTag, tx, y + pad, { width: tw, lineBreak: false, ellipsis: true });
  doc.font('Helvetica').fontSize(size).fillColor(INK).text(assetTypeTitles[a.type], { width: tw, lineBreak: false, ellipsis: true });
  doc
    .font('Courier')
    .fontSize(size * 0.95)
    .text(`S/N ${a.serialNumber}`, { width: tw, lineBreak: false, ellipsis: true });
  doc.moveDown(0.3).font('Helvetica-Bold').fontSize(size).text(calibrationLine(a, firm), { width: tw });
  doc
    .font('Helvetica')
    .fontSize(size * 0.8)
    .fillColor(MUTED)
    .text(firm.name, tx, y + h - pad - size, { width: tw, height: size, ellipsis: true });
}

export const assetLabelPdf = (a: AssetView, firm: DocumentFirm) =>
  renderPdf({ size: [LABEL_W, LABEL_H], margin: 0, info: { Title: `Label ${a.assetTag}` } }, (doc) => drawLabel(doc, a, firm, 0, 0, LABEL_W, LABEL_H));

/** Every member's label on one A4 page: three across, rows shrink to fit. */
export const kitLabelSheetPdf = (kitName: string, members: AssetView[], firm: DocumentFirm) =>
  renderPdf({ size: 'A4', margin: 10 * MM, info: { Title: `Labels for ${kitName}` } }, (doc) => {
    const left = 10 * MM;
    const top = 18 * MM;
    const cols = 3;
    const w = (doc.page.width - 2 * left) / cols;
    const rows = Math.max(1, Math.ceil(members.length / cols));
    const h = Math.min(LABEL_H, (doc.page.height - top - 10 * MM) / rows);
    doc
      .font('Helvetica-Bold')
      .fontSize(11)
      .fillColor(INK)
      .text(`${kitName} — ${members.length} labels`, left, 10 * MM);
    members.forEach((a, i) => drawLabel(doc, a, firm, left + (i % cols) * w, top + Math.floor(i / cols) * h, w, h));
  });
