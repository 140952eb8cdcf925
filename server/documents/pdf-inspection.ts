import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRef, PDFStream, type PDFContext, type PDFObject, type PDFPage } from 'pdf-lib';

/**
 * What a stored PDF (a lab's certificate) may not carry: anything a viewer runs
 * or opens by itself. Names as in ISO 32000-1: JavaScript actions (§12.6.4.16)
 * and the document's /JavaScript name tree (§7.7.4), Launch actions (§12.6.4.5),
 * embedded files (§7.11.4), RichMedia, XFA forms (§12.7.8), and /OpenAction or
 * /AA (§12.6.3) when they lead to one of those.
 */
export type ActiveContent = '/JavaScript' | '/Launch' | '/EmbeddedFiles' | '/RichMedia' | '/XFA' | '/OpenAction' | '/AA';

export type PdfInspection =
  { kind: 'pdf'; document: PDFDocument; pages: number; activeContent: ActiveContent[] } | { kind: 'encrypted' } | { kind: 'not_pdf'; reason: string };

/** How each finding reads in an error message, in the order it is reported. */
const words: Record<ActiveContent, string> = {
  '/JavaScript': 'JavaScript',
  '/Launch': 'an action that starts a program',
  '/EmbeddedFiles': 'embedded files',
  '/RichMedia': 'embedded media',
  '/XFA': 'an XFA form',
  '/OpenAction': 'an action run when the document opens',
  '/AA': 'actions run on page or field events',
};

const byKey: Record<string, ActiveContent> = {
  JS: '/JavaScript',
  JavaScript: '/JavaScript',
  EmbeddedFiles: '/EmbeddedFiles',
  EF: '/EmbeddedFiles',
  RichMediaContent: '/RichMedia',
  RichMediaSettings: '/RichMedia',
  XFA: '/XFA',
};
/** Action types (/S) that run code, start a program or open embedded content. */
const byAction: Record<string, ActiveContent> = { JavaScript: '/JavaScript', Launch: '/Launch', RichMediaExecute: '/RichMedia', GoToE: '/EmbeddedFiles' };
/** /Type or /Subtype values of embedded content. */
const byType: Record<string, ActiveContent> = { EmbeddedFile: '/EmbeddedFiles', RichMedia: '/RichMedia' };

const nameOf = (o: PDFObject | undefined) => (o instanceof PDFName ? o.decodeText() : undefined);
const resolve = (o: PDFObject | undefined, context: PDFContext) => (o instanceof PDFRef ? context.lookup(o) : o);

/** An action (or a /Next chain of them) that runs code or opens something. */
function actionIsActive(o: PDFObject | undefined, context: PDFContext, seen: Set<PDFObject>): boolean {
  const action = resolve(o, context);
  if (!action || seen.has(action)) return false;
  seen.add(action);
  if (action instanceof PDFArray) return action.asArray().some((a) => actionIsActive(a, context, seen));
  if (!(action instanceof PDFDict)) return false;
  if (byAction[nameOf(action.get(PDFName.of('S'))) ?? ''] || action.has(PDFName.of('JS'))) return true;
  return actionIsActive(action.get(PDFName.of('Next')), context, seen);
}

/** /OpenAction is an action or a plain destination (an array); /AA maps events to actions. */
function triggerIsActive(key: string, value: PDFObject, context: PDFContext): boolean {
  const resolved = resolve(value, context);
  if (!(resolved instanceof PDFDict)) return false;
  if (key === 'OpenAction') return actionIsActive(resolved, context, new Set());
  return resolved.values().some((action) => actionIsActive(action, context, new Set()));
}

function scanDict(dict: PDFDict, context: PDFContext, found: Set<ActiveContent>) {
  for (const [key, value] of dict.entries()) {
    const k = key.decodeText();
    if (byKey[k]) found.add(byKey[k]);
    if (k === 'S' && byAction[nameOf(value) ?? '']) found.add(byAction[nameOf(value)!]);
    if ((k === 'Type' || k === 'Subtype') && byType[nameOf(value) ?? '']) found.add(byType[nameOf(value)!]);
    if ((k === 'OpenAction' || k === 'AA') && triggerIsActive(k, value, context)) found.add(`/${k}`);
    scanDirect(value, context, found);
  }
}

/** Direct (nested) objects only: every indirect object is visited on its own. */
function scanDirect(o: PDFObject, context: PDFContext, found: Set<ActiveContent>) {
  if (o instanceof PDFDict) scanDict(o, context, found);
  else if (o instanceof PDFStream) scanDict(o.dict, context, found);
  else if (o instanceof PDFArray) for (const item of o.asArray()) scanDirect(item, context, found);
}

/** Every object of the file (reachable or not, including those packed in object streams), not only the usual places. */
function activeContentIn(document: PDFDocument): ActiveContent[] {
  const found = new Set<ActiveContent>();
  for (const [, object] of document.context.enumerateIndirectObjects()) scanDirect(object, document.context, found);
  return (Object.keys(words) as ActiveContent[]).filter((k) => found.has(k));
}

/**
 * Read a file with a real PDF parser (pdf-lib, strict about broken objects) and
 * report whether it is a PDF with at least one page and what active content it carries.
 * A leading "%PDF-" alone proves nothing: the rest must parse too.
 */
export async function inspectPdf(bytes: Uint8Array): Promise<PdfInspection> {
  if (Buffer.from(bytes.subarray(0, 5)).toString('latin1') !== '%PDF-') return { kind: 'not_pdf', reason: 'it does not start like a PDF' };
  let document: PDFDocument;
  try {
    document = await PDFDocument.load(bytes, { throwOnInvalidObject: true, updateMetadata: false, ignoreEncryption: true });
  } catch {
    return { kind: 'not_pdf', reason: 'its structure cannot be read' };
  }
  // Encrypted strings and streams cannot be read, so they cannot be checked either.
  if (document.isEncrypted) return { kind: 'encrypted' };
  let pages: number;
  try {
    pages = document.getPageCount();
  } catch {
    return { kind: 'not_pdf', reason: 'its page tree cannot be read' };
  }
  if (pages < 1) return { kind: 'not_pdf', reason: 'it has no pages' };
  return { kind: 'pdf', document, pages, activeContent: activeContentIn(document) };
}

/** "JavaScript, embedded files and an action run when the document opens", for a person reading an error. */
export function describeActiveContent(found: ActiveContent[]): string {
  const parts = found.map((f) => words[f]);
  return parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}` : (parts[0] ?? '');
}

/** Page entries that draw the page; everything else (annotations, /AA, beads, thumbnails…) is left behind. */
const drawingEntries = new Set([
  'Type',
  'Parent',
  'MediaBox',
  'CropBox',
  'BleedBox',
  'TrimBox',
  'ArtBox',
  'Rotate',
  'UserUnit',
  'Resources',
  'Contents',
  'Group',
]);

/** Reduce a page of a loaded document to what it draws, so copying it brings no annotations or actions along. */
export function keepDrawingOnly(page: PDFPage) {
  for (const key of page.node.keys()) if (!drawingEntries.has(key.decodeText())) page.node.delete(key);
}
