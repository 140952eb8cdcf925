import type { ChecklistLine } from '../../shared/bookings/views';
import { bullets, daysIncluded, facts, heading, rentalCautions, section, signatureLines, table, typeTitle, type DocumentFirm } from './document-layout';
import { MM, renderPdf } from './pdf';

export type HandoverSheet = {
  title: string;
  startsOn: string;
  endsOn: string;
  kitName: string | null;
  takenBy: string | null;
  checkedOutAt: string | null;
  items: { id: string; assetTag: string; type: string; serialNumber: string }[];
  checklist: ChecklistLine[] | null;
};

const conditionWords: Record<ChecklistLine['condition'], string> = { good: 'good', worn: 'worn', damaged: 'damaged' };

/**
 * The sheet both people sign at the counter: the packing list (ticked as
 * handed over once the kit is out, lines to fill in by hand before), a column
 * for the return, the cautions and two signature lines.
 */
export function handoverSheetPdf(firm: DocumentFirm, sheet: HandoverSheet): Promise<Buffer> {
  const f = firm.format;
  return renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: `Hand-over sheet ${sheet.title}` } }, (doc) => {
    heading(doc, firm.name, 'Hand-over sheet', [sheet.checkedOutAt ? `Handed over ${f.dateTime(sheet.checkedOutAt)}` : 'To be handed over']);
    facts(doc, [
      ['For', sheet.title],
      ['Dates', daysIncluded(f, sheet.startsOn, sheet.endsOn)],
      ['Kit', sheet.kitName],
      ['Taken by', sheet.takenBy],
    ]);
    section(doc, `Packing list (${sheet.items.length})`);
    table(
      doc,
      [
        { header: 'Tag', share: 0.16, mono: true },
        { header: 'Type', share: 0.2 },
        { header: 'Serial number', share: 0.22, mono: true },
        { header: 'Out', share: 0.2 },
        { header: 'Back', share: 0.22 },
      ],
      sheet.items.map((i) => {
        const line = sheet.checklist?.find((l) => l.assetId === i.id);
        // pdfkit's built-in fonts have no ballot-box glyphs: ticked lines say what was ticked, open ones leave a line to write on.
        return [
          i.assetTag,
          typeTitle(i.type),
          i.serialNumber,
          line ? `yes, ${conditionWords[line.condition]}${line.note ? `: ${line.note}` : ''}` : '________',
          '________',
        ];
      }),
    );
    section(doc, 'Cautions');
    bullets(doc, rentalCautions);
    signatureLines(doc, ['the shop (handed over by)', 'the person taking the kit']);
  });
}
