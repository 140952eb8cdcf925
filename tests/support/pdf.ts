import * as mupdf from 'mupdf';
import jsQR from 'jsqr';
import { PNG } from 'pngjs';

type Region = { x: number; y: number; w: number; h: number };

/** Render a PDF page with MuPDF (an independent renderer) and decode the QR code in
 * `region` (PDF points; the whole page when omitted) with jsQR. */
export function decodeQrFromPdf(pdf: Buffer, region?: Region, dpi = 300): string | null {
  const doc = mupdf.Document.openDocument(pdf, 'application/pdf');
  const scale = dpi / 72;
  const pixmap = doc.loadPage(0).toPixmap(mupdf.Matrix.scale(scale, scale), mupdf.ColorSpace.DeviceRGB, false, true);
  const png = PNG.sync.read(Buffer.from(pixmap.asPNG()));
  if (!region) return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
  const [x0, y0, w, h] = [region.x, region.y, region.w, region.h].map((v) => Math.round(v * scale));
  const crop = new Uint8ClampedArray(w * h * 4);
  for (let row = 0; row < h; row += 1) crop.set(png.data.subarray(((y0 + row) * png.width + x0) * 4, ((y0 + row) * png.width + x0 + w) * 4), row * w * 4);
  return jsQR(crop, w, h)?.data ?? null;
}

/** The text MuPDF extracts from every page. */
export function pdfText(pdf: Buffer): string {
  const doc = mupdf.Document.openDocument(pdf, 'application/pdf');
  const pages: string[] = [];
  for (let i = 0; i < doc.countPages(); i += 1) pages.push(doc.loadPage(i).toStructuredText('preserve-whitespace').asText());
  return pages.join('\n').replace(/\s+/g, ' ');
}

export const pdfPageCount = (pdf: Buffer) => mupdf.Document.openDocument(pdf, 'application/pdf').countPages();

/** The images MuPDF finds drawn on each page (width × height in pixels, as embedded), page by page. */
export function pdfImagesByPage(pdf: Buffer): { width: number; height: number }[][] {
  const doc = mupdf.Document.openDocument(pdf, 'application/pdf');
  return Array.from({ length: doc.countPages() }, (_, i) => {
    const images: { width: number; height: number }[] = [];
    doc
      .loadPage(i)
      .toStructuredText('preserve-images')
      .walk({ onImageBlock: (_bbox, _transform, image) => images.push({ width: image.getWidth(), height: image.getHeight() }) });
    return images;
  });
}
