import * as mupdf from 'mupdf';
import { PDFDocument, PDFName, PDFString } from 'pdf-lib';
import { renderPdf } from '../../server/documents/pdf';

/** A plain stand-in lab certificate (pdfkit), one line of text per page. */
export const plainCertificate = (lines: string[] = ['Calibration certificate OCL-7781 (test document)']) =>
  renderPdf({ size: 'A4' }, (doc) =>
    lines.forEach((line, i) => {
      if (i > 0) doc.addPage();
      doc.text(line);
    }),
  );

type Change = (doc: PDFDocument) => void | Promise<void>;

/** A plain certificate changed through pdf-lib's low-level objects (ISO 32000-1 names). */
export async function certificateWith(change: Change, lines?: string[]): Promise<Buffer> {
  const doc = await PDFDocument.load(await plainCertificate(lines));
  await change(doc);
  return Buffer.from(await doc.save());
}

const javaScript = (doc: PDFDocument, code = 'app.alert("test")') => doc.context.obj({ S: 'JavaScript', JS: PDFString.of(code) });

/** Ways a PDF runs or opens something by itself (one fixture each). */
export const activeChanges: Record<string, Change> = {
  // Catalog /OpenAction → JavaScript action (§12.6.4.16).
  openActionJavaScript: (doc) => doc.catalog.set(PDFName.of('OpenAction'), doc.context.register(javaScript(doc))),
  // Document-level scripts: the /JavaScript name tree under /Names (§7.7.4).
  namesJavaScript: (doc) =>
    doc.catalog.set(
      PDFName.of('Names'),
      doc.context.obj({ JavaScript: doc.context.obj({ Names: [PDFString.of('setup'), doc.context.register(javaScript(doc))] }) }),
    ),
  // An attached file: pdf-lib writes /Names /EmbeddedFiles and an /EmbeddedFile stream (§7.11.4).
  embeddedFile: (doc) => doc.attach(Buffer.from('calc.exe would be here'), 'readme.txt', { mimeType: 'text/plain' }),
  // A link annotation on the page whose action launches a program (§12.6.4.5).
  launchLink: (doc) => {
    const link = doc.context.obj({
      Type: 'Annot',
      Subtype: 'Link',
      Rect: [50, 700, 300, 720],
      Border: [0, 0, 0],
      A: { S: 'Launch', F: PDFString.of('calc.exe') },
    });
    doc.getPage(0).node.set(PDFName.of('Annots'), doc.context.obj([doc.context.register(link)]));
  },
  // A page's additional actions: JavaScript when the page opens (§12.6.3, Table 195).
  pageOpenJavaScript: (doc) => doc.getPage(0).node.set(PDFName.of('AA'), doc.context.obj({ O: doc.context.register(javaScript(doc)) })),
  // An XFA form in the AcroForm dictionary (§12.7.8).
  xfaForm: (doc) => doc.catalog.set(PDFName.of('AcroForm'), doc.context.obj({ Fields: [], XFA: doc.context.register(doc.context.stream('<xdp:xdp/>')) })),
};

/**
 * The active-content names another parser (MuPDF) finds in any object of the
 * file: an independent look at what a fixture holds and a pack leaves out.
 */
export function activeNamesSeenByMuPdf(pdf: Uint8Array): string[] {
  const doc = mupdf.Document.openDocument(pdf, 'application/pdf') as mupdf.PDFDocument;
  const found = new Set<string>();
  for (let i = 1; i < doc.countObjects(); i += 1) {
    const text = doc.newIndirect(i).resolve().toString(true);
    for (const m of text.matchAll(/\/(JavaScript|JS|Launch|EmbeddedFiles?|EF|RichMedia\w*|XFA|OpenAction|AA)(?![\w#])/g)) found.add(`/${m[1]}`);
  }
  return [...found].sort();
}
