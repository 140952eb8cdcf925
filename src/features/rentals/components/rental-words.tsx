import type { RentalState } from '../../../../shared/billing/views';
import { StatusChip, type StatusTone } from '../../../components/status-chip';

const rentalStates: Record<RentalState, [string, StatusTone]> = {
  reserved: ['Reserved', 'paused'],
  not_collected: ['Not collected', 'warn'],
  out: ['Out with the renter', 'info'],
  returned: ['Returned, to settle', 'warn'],
  invoiced: ['Invoiced', 'ok'],
  cancelled: ['Cancelled', 'none'],
};
export const rentalStateWord = (state: RentalState) => rentalStates[state][0];
export function RentalStateChip({ state }: { state: RentalState }) {
  return <StatusChip tone={rentalStates[state][1]} label={rentalStates[state][0]} />;
}
