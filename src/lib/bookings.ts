/** The booking rules shared with the server (shared/bookings/rules.ts), without zod, so the form explains a refusal before saving. */
export { blockReason, blockReasonText, bookingDays, rangesOverlap } from '../../shared/bookings/rules';
export type { BlockReason, BookableAsset } from '../../shared/bookings/rules';
export { addDays, calendarDayIn, todayIn } from '../../shared/calibration/due-date';
export type { BookingPurpose, BookingState } from '../../shared/schemas/bookings';
