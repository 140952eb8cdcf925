import type { Response } from 'express';

/** Send a generated document; `inline` PDFs open in the browser's viewer. */
export function sendDocument(res: Response, body: Buffer | string, type: string, filename: string, inline = false) {
  res
    .status(200)
    .type(type)
    .set('Content-Disposition', `${inline ? 'inline' : 'attachment'}; filename="${filename.replace(/[^\w.\-]/g, '_')}"`)
    .set('Cache-Control', 'no-store')
    .send(body);
}
