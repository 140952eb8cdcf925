import { randomBytes } from 'node:crypto';
import { Secret, TOTP } from 'otpauth';

/** RFC 6238 as every authenticator app reads it by default: HMAC-SHA-1, 30-second steps, 6 digits. */
const PERIOD_SECONDS = 30;
const DIGITS = 6;

const totp = (secretBase32: string, digits = DIGITS, label = '') =>
  new TOTP({ issuer: 'Nestkeeper', label, secret: Secret.fromBase32(secretBase32), algorithm: 'SHA1', digits, period: PERIOD_SECONDS });

/** 160 random bits, the key length RFC 4226 §4 recommends. */
export const newTotpSecret = () => new Secret({ size: 20 }).base32;

/** The otpauth:// address an app scans; the label names the firm and the person. */
export const totpUri = (secretBase32: string, account: string) => totp(secretBase32, DIGITS, account).toString();

/** The code for a moment (tests and the RFC's vectors use other lengths). */
export const totpCodeAt = (secretBase32: string, timestampMs: number, digits = DIGITS) => totp(secretBase32, digits).generate({ timestamp: timestampMs });

/**
 * The time step a typed code belongs to, or null. One step either side is accepted for clocks
 * that drift (RFC 6238 §5.2); a step at or before the last one used is refused, so a code is good once.
 */
export function acceptedStep(secretBase32: string, code: string, lastStep: number | null, now = Date.now()): number | null {
  const t = totp(secretBase32);
  const delta = t.validate({ token: code, timestamp: now, window: 1 });
  if (delta === null) return null;
  const step = t.counter({ timestamp: now }) + delta;
  return lastStep !== null && step <= lastStep ? null : step;
}

/** Ten single-use recovery codes, 50 random bits each, written XXXXX-XXXXX in the RFC 4648 base32 alphabet. */
export function newRecoveryCodes(): string[] {
  return Array.from({ length: 10 }, () => {
    const b32 = new Secret({ buffer: randomBytes(10).buffer as ArrayBuffer }).base32.slice(0, 10);
    return `${b32.slice(0, 5)}-${b32.slice(5)}`;
  });
}

/** A recovery code as stored and compared: no dash, upper case. */
export const normalRecoveryCode = (code: string) => code.replace(/[\s-]/g, '').toUpperCase();
