import { createHash, randomBytes } from 'node:crypto';
import { IsNull, type DataSource } from 'typeorm';
import type { Scoped } from '../db/scoped';
import { AppError, notFound } from '../http/errors';
import { RenterLink } from './renter-link.entity';

/** How long the renter's page stays open: time to read the papers and place the deposit before the kit is collected. */
export const RENTER_LINK_DAYS = 7;

export const sha256 = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');

/**
 * A new address for the renter's page (the link in the mail). The secret is
 * returned once and only its SHA-256 is stored; earlier links of the rental stop working.
 */
export async function issueRenterLink(tx: Scoped, rentalId: string, now = new Date()): Promise<{ token: string; expiresAt: Date }> {
  await tx.updateWhere(RenterLink, { rentalId, revokedAt: IsNull() }, { revokedAt: now });
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + RENTER_LINK_DAYS * 86_400_000);
  await tx.insert(RenterLink, { rentalId, tokenSha256: sha256(token), expiresAt, revokedAt: null });
  return { token, expiresAt };
}

/** The live link this secret opens, across firms (the renter is signed in nowhere); 404 when unknown, 410 when expired or replaced. */
export async function openRenterLink(db: DataSource, token: string): Promise<{ id: string; organizationId: string; rentalId: string; expiresAt: Date }> {
  const [link] = await db.query(`SELECT id, organization_id, rental_id, expires_at, revoked_at FROM renter_links WHERE token_sha256 = $1`, [sha256(token)]);
  if (!link) throw notFound('That rental link');
  if (link.revoked_at || new Date(link.expires_at) <= new Date())
    throw new AppError(
      410,
      'link_expired',
      link.revoked_at
        ? 'This link was replaced by a newer one: use the link in the latest e-mail, or ask the firm to send it again.'
        : 'This link has expired: ask the firm to send you a new one.',
    );
  return { id: link.id, organizationId: link.organization_id, rentalId: link.rental_id, expiresAt: new Date(link.expires_at) };
}
