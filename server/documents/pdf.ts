import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';

export const MM = 72 / 25.4;
export type Pdf = PDFKit.PDFDocument;

/** What pdfkit's built-in fonts (PDF's standard 14, WinAnsi encoding) draw beyond Latin-1. */
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
/** Intl's thin and narrow no-break spaces (dates, times, grouping), minus signs, arrows and stroked letters, in drawable look-alikes. */
const STAND_INS: Record<string, string> = {
  '\u2009': ' ',
  '\u202f': '\u00a0',
  '\u2007': '\u00a0',
  '\u2212': '-',
  '\u2010': '-',
  '\u2011': '-',
  '\u2192': '->',
  // Letters with a stroke have no base letter to fall back on.
  Ł: 'L',
  ł: 'l',
  Đ: 'D',
  đ: 'd',
  ı: 'i',
};
const drawable = (c: string) => c.charCodeAt(0) < 0x100 || WIN_ANSI_EXTRA.has(c);

/**
 * Text the built-in fonts can draw: a character outside WinAnsi would print as two wrong glyphs, so it becomes its
 * stand-in, else its base letter (a month name's "ź" prints "z"), else "?".
 */
export function forStandardFonts(text: string): string {
  let out = '';
  for (const c of text) {
    if (drawable(c)) out += c;
    else out += STAND_INS[c] ?? ([...c.normalize('NFD')].filter(drawable).join('') || '?');
  }
  return out;
}

/** Build a PDF in memory with pdfkit's built-in fonts (nothing fetched, nothing embedded from disk). */
export function renderPdf(options: PDFKit.PDFDocumentOptions, build: (doc: Pdf) => void): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ ...options, info: { Producer: 'Nestkeeper', Creator: 'Nestkeeper', ...(options.info ?? {}) } });
    drawOnlyWhatTheFontHas(doc);
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    build(doc);
    doc.end();
  });
}

/** Every string a document writes or measures passes `forStandardFonts`, so the firm's formats print whatever the locale. */
function drawOnlyWhatTheFontHas(doc: Pdf) {
  const plain = (value: unknown) => (typeof value === 'string' ? forStandardFonts(value) : value);
  const text = doc.text.bind(doc) as (...args: unknown[]) => Pdf;
  const heightOfString = doc.heightOfString.bind(doc) as (...args: unknown[]) => number;
  const widthOfString = doc.widthOfString.bind(doc) as (...args: unknown[]) => number;
  Object.assign(doc, {
    text: (value: unknown, ...rest: unknown[]) => text(plain(value), ...rest),
    heightOfString: (value: unknown, ...rest: unknown[]) => heightOfString(plain(value), ...rest),
    widthOfString: (value: unknown, ...rest: unknown[]) => widthOfString(plain(value), ...rest),
  });
}

/**
 * Draw a QR code (ISO/IEC 18004, encoded by the `qrcode` package) as vector
 * squares, with the standard's four-module quiet zone inside `size`.
 */
export function drawQr(doc: Pdf, payload: string, x: number, y: number, size: number) {
  const { modules } = QRCode.create(payload, { errorCorrectionLevel: 'M' });
  const quiet = 4;
  const cell = size / (modules.size + 2 * quiet);
  doc.save().rect(x, y, size, size).fill('#ffffff').fillColor('#000000');
  for (let r = 0; r < modules.size; r += 1) {
    for (let c = 0; c < modules.size; c += 1) {
      if (modules.get(r, c)) doc.rect(x + (c + quiet) * cell, y + (r + quiet) * cell, cell, cell);
    }
  }
  doc.fill('#000000').restore();
}

export const INK = '#1c2536';
export const BRASS = '#b08d3c';
export const MUTED = '#5b6475';
