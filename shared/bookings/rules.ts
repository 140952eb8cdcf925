import { differenceInCalendarDays, parseISO } from 'date-fns';
import type { AssetStatus, AssetType } from '../schemas/assets';
import type { BookingPurpose } from '../schemas/bookings';

/** Why an item cannot be booked for a window (API.md `booking_blocked`). */
export type BlockReason = 'calibration_expires' | 'held' | 'retired' | 'at_lab' | 'tip_not_validated';

export const blockReasonText: Record<BlockReason, string> = {
  calibration_expires: 'its calibration runs out before the booking ends',
  held: 'it is on hold',
  retired: 'it is retired',
  at_lab: 'it is at the calibration lab',
  tip_not_validated: 'this tip has no passing validation in every position it is used in',
};

export type BookableAsset = {
  type: AssetType;
  status: AssetStatus;
  calibration: { required: boolean; dueOn: string | null };
  /** Tips only: every mounting position has a passing latest validation. */
  tipValidated?: boolean;
};

/**
 * The rules a booking must pass for one item (DESIGN.md §4.1). Calibration must
 * be valid through `endsOn`: an item is valid through its due date, so due on
 * the last day is fine and due the day before is not. The server decides with
 * this function and the browser previews with it.
 */
export function blockReason(asset: BookableAsset, endsOn: string, purpose: BookingPurpose = 'job'): BlockReason | null {
  if (asset.status === 'retired') return 'retired';
  // A lab trip is how an item gets back into service: a hold or a lapsing calibration is the reason it goes.
  if (purpose === 'lab') return null;
  if (asset.status === 'held') return 'held';
  if (asset.status === 'at_lab') return 'at_lab';
  if (asset.calibration.required && (!asset.calibration.dueOn || asset.calibration.dueOn < endsOn)) return 'calibration_expires';
  if (asset.type === 'tip' && asset.tipValidated === false) return 'tip_not_validated';
  return null;
}

/** Whole days, both ends included. */
export const bookingDays = (startsOn: string, endsOn: string) => differenceInCalendarDays(parseISO(endsOn), parseISO(startsOn)) + 1;

/** Inclusive date ranges overlap when each starts on or before the other ends. */
export const rangesOverlap = (a: { startsOn: string; endsOn: string }, b: { startsOn: string; endsOn: string }) =>
  a.startsOn <= b.endsOn && b.startsOn <= a.endsOn;
