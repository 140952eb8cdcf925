import type { DataSource } from 'typeorm';
import { inOrganization } from '../../server/db/transaction';
import { issueRenterLink } from '../../server/rentals';
import type { TestApp } from './test-app';

/** A renter's link for the rental, issued as the deposit request does (for tests whose subject is not the request itself). */
export async function renterLinkFor(db: DataSource, rentalId: string): Promise<string> {
  const [{ organization_id }] = await db.query(`SELECT organization_id FROM rentals WHERE id = $1`, [rentalId]);
  return (await inOrganization(db, organization_id, (tx) => issueRenterLink(tx, rentalId))).token;
}

/** The renter opens their page and accepts the agreement it shows, as a person would. */
export async function renterAccepts(api: TestApp['api'], token: string, fullName = 'Ines Varga') {
  const page = await api.get(`/api/renter/${token}`);
  if (page.status !== 200) throw new Error(`the renter's page answered ${page.status}: ${JSON.stringify(page.body)}`);
  return api.post(`/api/renter/${token}/agreement`).send({ fullName, agreed: true, agreementSha256: page.body.agreement.sha256 });
}
