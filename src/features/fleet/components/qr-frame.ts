import jsQR from 'jsqr';

/** A camera frame as the worker receives it: RGBA pixels, row by row. */
export type QrFrame = { data: Uint8ClampedArray; width: number; height: number };

/** The text of the QR code in a frame (ISO/IEC 18004), or null when none can be read. Runs in the decoding worker. */
export function decodeQrFrame({ data, width, height }: QrFrame): string | null {
  // Labels are dark on light: skipping the inverted pass halves the work per frame.
  return jsQR(data, width, height, { inversionAttempts: 'dontInvert' })?.data || null;
}
