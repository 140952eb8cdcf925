import type { DepositAuthorizationView, DepositState } from '../../shared/billing/views';
import type { DepositAuthorization } from './deposit-authorization.entity';

export const authorizationView = (a: DepositAuthorization): DepositAuthorizationView => ({
  id: a.id,
  kind: a.kind,
  state: a.state,
  amountMinor: a.amountMinor,
  capturedMinor: a.capturedMinor,
  cardBrand: a.cardBrand,
  cardLast4: a.cardLast4,
  captureBefore: a.captureBefore?.toISOString() ?? null,
  initiatedBy: a.initiatedBy,
  failureMessage: a.failureMessage,
  captureReason: a.captureReason,
  createdAt: a.createdAt.toISOString(),
  settledAt: a.settledAt?.toISOString() ?? null,
});

/**
 * The deposit's state is its live authorization's, else its newest one's (a
 * replaced authorization no longer counts; a refused renewal leaves the live
 * one standing).
 */
export function depositState(rows: DepositAuthorization[]): { state: DepositState; authorization: DepositAuthorization | null } {
  const candidates = rows.filter((a) => a.kind === 'authorization' && a.state !== 'replaced').sort((a, b) => +b.createdAt - +a.createdAt);
  const current = candidates.find((a) => a.state === 'authorized') ?? candidates[0];
  if (!current) return { state: 'none', authorization: null };
  return { state: current.state as DepositState, authorization: current };
}
