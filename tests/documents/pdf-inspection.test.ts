import { PDFDocument, PDFName, PDFString } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { describeActiveContent, inspectPdf } from '../../server/documents/pdf-inspection';
import { renderPdf } from '../../server/documents/pdf';
import { activeChanges, activeNamesSeenByMuPdf, certificateWith, plainCertificate } from '../support/pdf-fixtures';

// Names of active content from ISO 32000-1 (PDF 1.7): §12.6.4.16 JavaScript actions, §7.7.4 the
// /JavaScript name tree, §12.6.4.5 Launch actions, §7.11.4 embedded files, §12.7.8 XFA,
// §12.6.3 /OpenAction and /AA trigger events.
describe('inspecting an uploaded PDF (pdf-lib parser)', () => {
  it('passes a plain certificate and counts its pages', async () => {
    const pdf = await plainCertificate(['page one', 'page two']);
    expect(activeNamesSeenByMuPdf(pdf)).toEqual([]);
    expect(await inspectPdf(pdf)).toMatchObject({ kind: 'pdf', pages: 2, activeContent: [] });
  });

  it('cannot look inside an encrypted PDF, so says so (pdfkit, owner password only)', async () => {
    const locked = await renderPdf({ size: 'A4', ownerPassword: 'lab-owner-secret', permissions: { printing: 'highResolution' } }, (doc) =>
      doc.text('Certificate OCL-7790'),
    );
    expect(Buffer.from(locked).toString('latin1')).toContain('/Encrypt');
    expect(await inspectPdf(locked)).toEqual({ kind: 'encrypted' });
  });

  it.each([
    ['openActionJavaScript', ['/JavaScript', '/OpenAction']],
    ['namesJavaScript', ['/JavaScript']],
    ['embeddedFile', ['/EmbeddedFiles']],
    ['launchLink', ['/Launch']],
    ['pageOpenJavaScript', ['/JavaScript', '/AA']],
    ['xfaForm', ['/XFA']],
  ])('finds %s: %j', async (fixture, found) => {
    const pdf = await certificateWith(activeChanges[fixture]);
    // The fixture really holds it, as an independent parser (MuPDF) reads the file.
    expect(activeNamesSeenByMuPdf(pdf).length).toBeGreaterThan(0);
    const result = await inspectPdf(pdf);
    expect(result.kind).toBe('pdf');
    expect(result.kind === 'pdf' && result.activeContent).toEqual(found);
  });

  it('reads names written with # escapes (§7.3.5: /J#61vaScript is /JavaScript) in a file without object streams', async () => {
    const doc = await PDFDocument.load(await plainCertificate());
    doc.catalog.set(PDFName.of('OpenAction'), doc.context.register(doc.context.obj({ S: 'JavaScript', JS: PDFString.of('app.alert(1)') })));
    const text = Buffer.from(await doc.save({ useObjectStreams: false })).toString('latin1');
    expect(text).toContain('/S /JavaScript');
    const escaped = Buffer.from(text.replace('/S /JavaScript', '/S /J#61vaScript').replace('/JS (', '/J#53 ('), 'latin1');
    const result = await inspectPdf(escaped);
    expect(result.kind === 'pdf' && result.activeContent).toEqual(['/JavaScript', '/OpenAction']);
  });

  it('does not count a plain link or a page destination on opening as active', async () => {
    const pdf = await certificateWith((doc) => {
      doc.catalog.set(PDFName.of('OpenAction'), doc.context.obj([doc.getPage(0).ref, PDFName.of('Fit')]));
      const link = doc.context.obj({
        Type: 'Annot',
        Subtype: 'Link',
        Rect: [50, 700, 300, 720],
        A: { S: 'URI', URI: PDFString.of('https://lab.example/verify') },
      });
      doc.getPage(0).node.set(PDFName.of('Annots'), doc.context.obj([doc.context.register(link)]));
    });
    expect(await inspectPdf(pdf)).toMatchObject({ kind: 'pdf', activeContent: [] });
  });

  it.each([
    ['HTML after a PDF header', Buffer.from('%PDF-1.7\n<html><body><script>alert(1)</script></body></html>')],
    ['a PNG', Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex')],
    ['a header and nothing else', Buffer.from('%PDF-1.4\n%%EOF\n')],
  ])('refuses %s as not a PDF', async (_what, bytes) => {
    expect(await inspectPdf(bytes)).toMatchObject({ kind: 'not_pdf' });
  });

  it('refuses a PDF with no pages', async () => {
    const empty = await PDFDocument.create();
    expect(await inspectPdf(await empty.save({ addDefaultPage: false }))).toEqual({ kind: 'not_pdf', reason: 'it has no pages' });
  });

  it('words the findings for a person', () => {
    expect(describeActiveContent(['/JavaScript', '/EmbeddedFiles', '/OpenAction'])).toBe(
      'JavaScript, embedded files and an action run when the document opens',
    );
    expect(describeActiveContent(['/Launch'])).toBe('an action that starts a program');
  });
});
