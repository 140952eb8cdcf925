import type { AgreementAcceptanceView } from '../../shared/billing/views';
import type { Scoped } from '../db/scoped';
import { AgreementAcceptance } from './renter-link.entity';

/** The rental's latest acceptance of its agreement, or null. */
export async function latestAcceptance(tx: Scoped, rentalId: string): Promise<AgreementAcceptanceView | null> {
  const [a] = await tx.find(AgreementAcceptance, { where: { rentalId }, order: { acceptedAt: 'DESC' }, take: 1 });
  return a ? { fullName: a.fullName, acceptedAt: a.acceptedAt.toISOString(), ipAddress: a.ipAddress, agreementSha256: a.agreementSha256 } : null;
}
