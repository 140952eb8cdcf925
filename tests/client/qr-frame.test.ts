import QRCode from 'qrcode';
import { describe, expect, it } from 'vitest';
import { decodeQrFrame } from '../../src/features/fleet/components/qr-frame';

/** A QR symbol drawn by an independent encoder (the `qrcode` package) as RGBA pixels, `scale` pixels a module, with the 4-module quiet zone ISO/IEC 18004 asks for. */
function frameOf(text: string, scale = 4) {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const side = (modules.size + 8) * scale;
  const data = new Uint8ClampedArray(side * side * 4).fill(255);
  for (let r = 0; r < modules.size; r += 1)
    for (let c = 0; c < modules.size; c += 1)
      if (modules.get(r, c))
        for (let y = 0; y < scale; y += 1)
          for (let x = 0; x < scale; x += 1) {
            const i = (((r + 4) * scale + y) * side + (c + 4) * scale + x) * 4;
            data[i] = data[i + 1] = data[i + 2] = 0;
          }
  return { data, width: side, height: side };
}

describe('decoding a camera frame (the scanner worker)', () => {
  it('reads a label payload that another library encoded', () => {
    const payload = 'https://nestkeeper.example/scan/3f2b6c1e-9a7d-4e2b-8c1f-5d6e7f8a9b0c';
    expect(decodeQrFrame(frameOf(payload))).toBe(payload);
    expect(decodeQrFrame(frameOf('TIP-005', 6))).toBe('TIP-005');
  });

  it('answers null for a frame with no code in it', () => {
    const blank = new Uint8ClampedArray(200 * 200 * 4).fill(200);
    expect(decodeQrFrame({ data: blank, width: 200, height: 200 })).toBeNull();
  });
});
