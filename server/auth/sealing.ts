import { createCipheriv, createDecipheriv, createHash, createHmac, hkdfSync, randomBytes } from 'node:crypto';

/**
 * Keys derived (HKDF-SHA-256, RFC 5869) from the installation's own secret, one per use, so
 * nothing here is built in and a copy of the database alone opens no second step.
 */
export class Sealing {
  private readonly sealKey: Buffer;
  private readonly codeKey: Buffer;

  constructor(installationSecret: string) {
    const derive = (info: string) => Buffer.from(hkdfSync('sha256', installationSecret, 'nestkeeper', info, 32));
    this.sealKey = derive('second-step secret sealing');
    this.codeKey = derive('recovery code hashing');
  }

  /** AES-256-GCM: `v1.<iv>.<tag>.<ciphertext>`, base64url. */
  seal(plain: string): string {
    const iv = randomBytes(12);
    const cipher = createCipheriv('aes-256-gcm', this.sealKey, iv);
    const body = Buffer.concat([cipher.update(plain, 'utf8'), cipher.final()]);
    return ['v1', iv, cipher.getAuthTag(), body].map((p) => (typeof p === 'string' ? p : p.toString('base64url'))).join('.');
  }

  unseal(sealed: string): string {
    const [version, iv, tag, body] = sealed.split('.');
    if (version !== 'v1') throw new Error('Unknown sealing version');
    const decipher = createDecipheriv('aes-256-gcm', this.sealKey, Buffer.from(iv, 'base64url'));
    decipher.setAuthTag(Buffer.from(tag, 'base64url'));
    return Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]).toString('utf8');
  }

  /** Recovery codes are kept as HMACs under an installation key: 50 random bits would not survive an offline search of a plain hash. */
  recoveryCodeHash(code: string): string {
    return createHmac('sha256', this.codeKey).update(code).digest('hex');
  }
}

/** A mailed link's secret, and the SHA-256 that is all the database keeps of it. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: linkTokenHash(token) };
}

export const linkTokenHash = (token: string) => createHash('sha256').update(token).digest('hex');
