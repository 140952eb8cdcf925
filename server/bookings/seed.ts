import type { BookingPurpose, BookingState } from '../../shared/schemas/bookings';
import type { Scoped } from '../db/scoped';
import type { ChecklistLine } from '../../shared/bookings/views';
import { Booking, BookingItem } from './booking.entity';
import { Job } from './job.entity';

/** A booking as it stands after its past steps, for the invented demo firms. */
export type PastBooking = {
  startsOn: string;
  endsOn: string;
  state: BookingState;
  purpose: BookingPurpose;
  jobId?: string | null;
  rentalId?: string | null;
  kitId?: string | null;
  note?: string | null;
  createdBy: string;
  checkedOutAt?: Date | null;
  handedOverBy?: string | null;
  takenBy?: string | null;
  takenByUserId?: string | null;
  checkoutChecklist?: ChecklistLine[] | null;
  returnedAt?: Date | null;
  receivedBy?: string | null;
  broughtBackBy?: string | null;
  returnChecklist?: ChecklistLine[] | null;
};

/**
 * Writes demo history: a booking with its items in the state its past steps
 * left it (the lifecycle refuses past days, and rightly so). Items hold their
 * days only while the booking is reserved or out, as the lifecycle keeps them.
 */
export async function seedBooking(tx: Scoped, booking: PastBooking, assetIds: string[]): Promise<{ id: string }> {
  const row = await tx.insert(Booking, { jobId: null, rentalId: null, kitId: null, note: null, ...booking });
  const active = booking.state === 'reserved' || booking.state === 'out';
  await tx.insertMany(
    BookingItem,
    assetIds.map((assetId) => ({ bookingId: row.id, assetId, startsOn: booking.startsOn, endsOn: booking.endsOn, active })),
  );
  return { id: row.id };
}

/** A customer site job of the demo firm. */
export const seedJob = (tx: Scoped, job: Omit<Job, 'id' | 'organizationId' | 'createdAt' | 'updatedAt'>) => tx.insert(Job, job);
