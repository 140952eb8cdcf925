import { formatWattHours, shippingClassText, type shippingSheet } from '../../shared/batteries/shipping-class';
import type { DocumentFirm } from './document-layout';
import { BRASS, INK, MM, MUTED, renderPdf } from './pdf';

/** DESIGN.md §6 cautions, as printed on the sheet that travels with the kit. */
export const batteryCautions = [
  'Lithium-ion batteries that were dropped, are swollen or damaged are a fire risk: do not charge them and do not ship them by air.',
  'Over 100 Wh up to 160 Wh: the carrier must approve. Over 160 Wh: not in passenger baggage.',
  'Tracker cases are heavy: lift with two people or use a trolley.',
  "These lines summarise common rules; the carrier's current rules, local codes and the instrument maker's instructions come first.",
];

export const shippingSheetPdf = (kitName: string, firm: DocumentFirm, sheet: ReturnType<typeof shippingSheet>) =>
  renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: `Battery shipping sheet ${kitName}` } }, (doc) => {
    const left = doc.page.margins.left;
    doc.font('Helvetica').fontSize(9).fillColor(MUTED).text(firm.name);
    doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(`Battery shipping sheet — ${kitName}`);
    doc
      .font('Helvetica')
      .fontSize(9)
      .fillColor(MUTED)
      .text('Watt-hours = nominal voltage × rated capacity. Classes follow the IATA lithium-ion passenger limits.');
    doc.moveDown(1);
    const cols = [left, left + 35 * MM, left + 60 * MM, left + 82 * MM, left + 104 * MM];
    const header = ['Battery', 'Nominal V', 'Rated Ah', 'Energy', 'Class'];
    let y = doc.y;
    doc.font('Helvetica-Bold').fontSize(9).fillColor(INK);
    header.forEach((h, i) => doc.text(h, cols[i], y));
    y += 14;
    doc.font('Helvetica').fontSize(9);
    for (const line of sheet.lines) {
      const cells = [
        line.assetTag,
        firm.format.number(line.nominalVoltageV, 2),
        firm.format.number(line.ratedCapacityAh, 2),
        formatWattHours(line.wattHours, firm.format.locale),
        shippingClassText[line.class],
      ];
      cells.forEach((c, i) => doc.font(i === 0 ? 'Courier' : 'Helvetica').text(c, cols[i], y, { width: i === 4 ? 70 * MM : 30 * MM }));
      y += 14;
    }
    if (sheet.lines.length === 0) {
      doc.text('This kit has no batteries.', left, y);
      y += 14;
    }
    doc
      .font('Helvetica-Bold')
      .text(`Total: ${firm.format.count(sheet.count)} batteries, ${formatWattHours(sheet.totalWattHours, firm.format.locale)}`, left, y + 6);
    doc.moveDown(2);
    doc
      .save()
      .rect(left, doc.y, doc.page.width - 2 * left, 3)
      .fill(BRASS)
      .restore();
    doc.moveDown(0.8);
    doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text('Cautions', left);
    doc.font('Helvetica').fontSize(9);
    for (const c of batteryCautions) doc.text(`•  ${c}`, { width: doc.page.width - 2 * left });
  });
