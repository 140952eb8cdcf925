import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';

export const MM = 72 / 25.4;
export type Pdf = PDFKit.PDFDocument;

/** Build a PDF in memory with pdfkit's built-in fonts (nothing fetched, nothing embedded from disk). */
export function renderPdf(options: PDFKit.PDFDocumentOptions, build: (doc: Pdf) => void): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ ...options, info: { Producer: 'Nestkeeper', Creator: 'Nestkeeper', ...(options.info ?? {}) } });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    build(doc);
    doc.end();
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
