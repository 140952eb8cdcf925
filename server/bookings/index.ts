/**
 * The bookings component's public surface. Bookings own their rows: other
 * components book, move, cancel, check out, take back and close only through
 * these functions (in their own transaction), and see bookings as plain views.
 */
import { Booking, BookingItem } from './booking.entity';
import { Job } from './job.entity';

/** Customer site jobs, bookings and their items. */
export const bookingEntities = [Job, Booking, BookingItem];
export {
  book,
  cancelBooking,
  changeItems,
  checkOut,
  closeBooking,
  loadBooking,
  markNotCollected,
  moveBooking,
  takeBack,
  type BookingRequest,
} from './lifecycle';
export { busyDays } from './booking-queries';
export type { BookingView } from './booking-view';
export type { ChecklistLine } from '../../shared/bookings/views';
export type { HandoverGates } from './handover.service';
export { seedBooking, seedJob } from './seed';
export { countBookings, seedBenchBookings } from './bench-seed';
