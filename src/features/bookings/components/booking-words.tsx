import { StatusChip, type StatusTone } from '../../../components/status-chip';
import { bookingDays } from '../../../lib/bookings';
import type { BookingPurpose, BookingState } from '../../../lib/bookings';
import type { BookingView, ItemCondition } from '../../../../shared/bookings/views';

export const bookingStateWords: Record<BookingState, string> = {
  reserved: 'Reserved',
  out: 'Out',
  returned: 'Returned',
  cancelled: 'Cancelled',
  not_collected: 'Not collected',
};

// Reserved reads as a dashed outline, the same as its bar on the board.
const stateTones: Record<BookingState, StatusTone> = {
  reserved: 'paused',
  out: 'info',
  returned: 'ok',
  cancelled: 'none',
  not_collected: 'warn',
};

export function BookingStateChip({ state }: { state: BookingState }) {
  return <StatusChip tone={stateTones[state]} label={bookingStateWords[state]} />;
}

export const purposeWords: Record<BookingPurpose, string> = {
  job: 'Job',
  rental: 'Rental',
  lab: 'Lab',
  internal: 'Internal',
};

export const conditionWords: Record<ItemCondition, string> = {
  good: 'Good',
  worn: 'Worn',
  damaged: 'Damaged',
};

/** What a booking is for, in a few words: the job's or rental's number and customer, or the purpose. */
export function bookingTitle(booking: Pick<BookingView, 'job' | 'purpose'> & { rental?: BookingView['rental'] }): string {
  if (booking.job) return `${booking.job.reference} ${booking.job.customerName}`;
  if (booking.rental) return `${booking.rental.number} ${booking.rental.customerCompany}`;
  return purposeWords[booking.purpose];
}

export function dayCount(startsOn: string, endsOn: string): string {
  const days = bookingDays(startsOn, endsOn);
  return `${days} ${days === 1 ? 'day' : 'days'}`;
}

/** "what it's used for" plus the kit or the number of items. */
export function bookingContents(booking: Pick<BookingView, 'kit' | 'items'>): string {
  const count = `${booking.items.length} ${booking.items.length === 1 ? 'item' : 'items'}`;
  return booking.kit ? `${booking.kit.name} (${count})` : count;
}
