import type { DepositRequestView } from '../../shared/billing/views';
import type { Scoped } from '../db/scoped';
import { DepositRequest } from './deposit-request.entity';

/** A request as the clerk and the renter see it: an open page past its time reads as expired before the provider's event says so. */
export function depositRequestView(r: DepositRequest, now = new Date()): DepositRequestView {
  const expired = r.state === 'expired' || (r.state === 'open' && r.expiresAt <= now);
  const state = r.state === 'complete' ? 'authorized' : expired ? 'expired' : r.declineMessage ? 'declined' : 'waiting';
  return {
    id: r.id,
    state,
    url: state === 'waiting' || state === 'declined' ? r.url : null,
    expiresAt: r.expiresAt.toISOString(),
    sentTo: r.sentTo,
    createdAt: r.createdAt.toISOString(),
    declineMessage: r.declineMessage,
  };
}

/** The rental's latest request that a newer one has not replaced. */
export async function currentDepositRequest(tx: Scoped, rentalId: string): Promise<DepositRequest | null> {
  const [latest] = await tx.find(DepositRequest, { where: { rentalId }, order: { createdAt: 'DESC' }, take: 1 });
  return latest && latest.state !== 'replaced' ? latest : null;
}
