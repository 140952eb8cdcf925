import type { AssetView, EquipmentRecordItem } from '../../shared/assets/views';
import { INK, MM, MUTED, renderPdf } from './pdf';

export const equipmentRecordPdf = (a: AssetView, items: EquipmentRecordItem[], firm: string, generatedAt: Date) =>
  renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: `Equipment record ${a.assetTag}` } }, (doc) => {
    const left = doc.page.margins.left;
    const width = doc.page.width - left - doc.page.margins.right;
    doc.font('Helvetica').fontSize(9).fillColor(MUTED).text(firm);
    doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(`Equipment record — ${a.assetTag}`);
    doc
      .font('Helvetica')
      .fontSize(9)
      .fillColor(MUTED)
      .text(`Items of ISO/IEC 17025:2017 §6.4.13. Generated ${generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC by Nestkeeper.`);
    doc.moveDown(1);
    for (const item of items) {
      const y = doc.y;
      doc
        .font('Helvetica-Bold')
        .fontSize(9)
        .fillColor(INK)
        .text(item.clause, left, y, { width: 22 * MM });
      doc
        .font('Helvetica')
        .fontSize(8)
        .fillColor(MUTED)
        .text(item.requirement, left + 24 * MM, y, { width: width - 24 * MM });
      doc
        .font('Helvetica')
        .fontSize(10)
        .fillColor(INK)
        .text(item.value ?? '— nothing recorded —', { width: width - 24 * MM });
      if (item.note)
        doc
          .font('Helvetica-Oblique')
          .fontSize(8)
          .fillColor(MUTED)
          .text(item.note, { width: width - 24 * MM });
      doc.moveDown(0.6);
      doc
        .save()
        .strokeColor('#d8d1c2')
        .lineWidth(0.5)
        .moveTo(left, doc.y)
        .lineTo(left + width, doc.y)
        .stroke()
        .restore();
      doc.moveDown(0.6);
    }
  });
