import { createHmac } from 'node:crypto';
import { Secret } from 'otpauth';
import { describe, expect, it } from 'vitest';
import { acceptedStep, newRecoveryCodes, newTotpSecret, totpCodeAt } from './totp';

// RFC 6238 Appendix B: the SHA-1 seed is the 20 ASCII bytes "12345678901234567890", T0 = 0, X = 30 s, 8 digits.
// Source: https://www.rfc-editor.org/rfc/rfc6238#appendix-B (Table "Test Vectors", mode SHA1).
const rfcSeed = Secret.fromLatin1('12345678901234567890').base32;
const appendixB: [unixSeconds: number, code: string][] = [
  [59, '94287082'],
  [1111111109, '07081804'],
  [1111111111, '14050471'],
  [1234567890, '89005924'],
  [2000000000, '69279037'],
  [20000000000, '65353130'],
];

/** RFC 4226 §5.3 dynamic truncation with node's own HMAC: an independent reference for the secrets this module makes. */
function referenceCode(secretBase32: string, step: number): string {
  const key = Buffer.from(Secret.fromBase32(secretBase32).bytes);
  const counter = Buffer.alloc(8);
  counter.writeBigUInt64BE(BigInt(step));
  const mac = createHmac('sha1', key).update(counter).digest();
  const offset = mac[mac.length - 1] & 0x0f;
  return String((mac.readUInt32BE(offset) & 0x7fffffff) % 1_000_000).padStart(6, '0');
}

describe('TOTP codes (RFC 6238)', () => {
  it.each(appendixB)('gives the Appendix B code at T = %i s', (seconds, code) => {
    expect(totpCodeAt(rfcSeed, seconds * 1000, 8)).toBe(code);
  });

  it('accepts the 6-digit form of an Appendix B code (its last six digits, RFC 4226 §5.3) and names its time step', () => {
    // T = 1111111109 s lies in step floor(1111111109 / 30) = 37037036.
    expect(acceptedStep(rfcSeed, '081804', null, 1111111109_000)).toBe(37037036);
  });

  it('accepts a code one step early or late, not two, and never the same step twice', () => {
    const secret = newTotpSecret();
    const now = 1_800_000_000_000;
    const step = Math.floor(now / 30_000);
    expect(acceptedStep(secret, referenceCode(secret, step - 1), null, now)).toBe(step - 1);
    expect(acceptedStep(secret, referenceCode(secret, step + 1), null, now)).toBe(step + 1);
    expect(acceptedStep(secret, referenceCode(secret, step - 2), null, now)).toBeNull();
    expect(acceptedStep(secret, referenceCode(secret, step), step, now)).toBeNull();
    expect(acceptedStep(secret, referenceCode(secret, step), step - 1, now)).toBe(step);
  });

  it('makes 160-bit secrets and ten distinct recovery codes', () => {
    expect(Secret.fromBase32(newTotpSecret()).bytes.length).toBe(20);
    const codes = newRecoveryCodes();
    expect(codes).toHaveLength(10);
    expect(new Set(codes).size).toBe(10);
    for (const c of codes) expect(c).toMatch(/^[A-Z2-7]{5}-[A-Z2-7]{5}$/);
  });
});
