import { PDFDocument, type PDFPage } from 'pdf-lib';
import { daysIncluded, heading, table, typeTitle, type DocumentFirm } from './document-layout';
import { MM, renderPdf } from './pdf';
import { inspectPdf, keepDrawingOnly } from './pdf-inspection';

export type CertificateEntry = {
  assetTag: string;
  type: string;
  serialNumber: string;
  model: string | null;
  certificateNumber: string | null;
  performedOn: string | null;
  dueOn: string | null;
  provider: string | null;
  pdf: Buffer | null;
};

type PackInput = { firm: DocumentFirm; rentalNumber: string; customerCompany: string; startsOn: string; endsOn: string; entries: CertificateEntry[] };

export type CertificatePages = { pages: PDFPage[]; contentOnly: boolean };

/**
 * The certificate's pages copied into `pack`, or why there are none. An unreadable file must not sink the pack.
 * pdf-lib copies a page with everything it refers to (annotations and their actions, the page's /AA), so a file
 * stored before uploads were checked gives only what its pages draw, and only if that copy checks clean.
 */
export async function certificatePages(pack: PDFDocument, pdf: Buffer | null): Promise<CertificatePages | 'missing' | 'unreadable' | 'withheld'> {
  if (!pdf) return 'missing';
  const inspection = await inspectPdf(pdf);
  if (inspection.kind !== 'pdf') return 'unreadable';
  const source = inspection.document;
  if (!inspection.activeContent.length) return { pages: await pack.copyPages(source, source.getPageIndices()), contentOnly: false };
  source.getPages().forEach(keepDrawingOnly);
  const plain = await PDFDocument.create();
  for (const page of await plain.copyPages(source, source.getPageIndices())) plain.addPage(page);
  const recheck = await inspectPdf(await plain.save());
  if (recheck.kind !== 'pdf' || recheck.activeContent.length) return 'withheld';
  return { pages: await pack.copyPages(recheck.document, recheck.document.getPageIndices()), contentOnly: true };
}

type Found = Awaited<ReturnType<typeof certificatePages>>;

export const certificateStatusText = {
  missing: 'no certificate on file',
  unreadable: 'certificate could not be read',
  withheld: 'certificate left out: it carries scripts or files',
} as const;
const foundText = (found: Found) =>
  typeof found === 'string' ? certificateStatusText[found] : found.contentOnly ? 'pages attached; scripts and files removed' : 'certificate attached';

function coverPdf(input: PackInput, found: Found[]) {
  const f = input.firm.format;
  return renderPdf({ size: 'A4', margin: 18 * MM }, (doc) => {
    heading(doc, input.firm.name, `Certificate pack — rental ${input.rentalNumber}`, [
      `${input.customerCompany} · ${daysIncluded(f, input.startsOn, input.endsOn)}`,
      input.entries.length
        ? 'This pack lets you show your own auditors that the rented kit was in calibration for the rental. The certificates follow this page in the order listed.'
        : 'None of the rented items needs calibration (batteries, nests, cases and the like), so there are no certificates to include.',
    ]);
    if (!input.entries.length) return;
    table(
      doc,
      [
        { header: 'Tag', share: 0.11, mono: true },
        { header: 'Type', share: 0.12 },
        { header: 'Serial', share: 0.13, mono: true },
        { header: 'Certificate', share: 0.13 },
        { header: 'Calibrated on', share: 0.11 },
        { header: 'Due on', share: 0.11 },
        { header: 'Provider', share: 0.14 },
        { header: 'File', share: 0.15 },
      ],
      input.entries.map((e, i) => {
        const pages = found[i];
        return [
          e.assetTag,
          [typeTitle(e.type), e.model].filter(Boolean).join(' '),
          e.serialNumber,
          e.certificateNumber ?? '—',
          f.date(e.performedOn),
          f.date(e.dueOn),
          e.provider ?? '—',
          foundText(pages),
        ];
      }),
      8,
    );
  });
}

/** One PDF for the renter: a cover listing every item, then each item's certificate pages in entry order. */
export async function certificatePackPdf(input: PackInput): Promise<Buffer> {
  const pack = await PDFDocument.create();
  const found: Found[] = [];
  for (const entry of input.entries) found.push(await certificatePages(pack, entry.pdf));
  const cover = await PDFDocument.load(await coverPdf(input, found));
  for (const page of await pack.copyPages(cover, cover.getPageIndices())) pack.addPage(page);
  for (const f of found) if (typeof f !== 'string') f.pages.forEach((p) => pack.addPage(p));
  pack.setTitle(`Certificate pack ${input.rentalNumber}`);
  pack.setSubject(`${input.customerCompany}, ${input.firm.format.dateRange(input.startsOn, input.endsOn)}`);
  pack.setProducer('Nestkeeper');
  pack.setCreator('Nestkeeper');
  return Buffer.from(await pack.save());
}
