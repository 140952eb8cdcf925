import type { BookingView } from '../../shared/bookings/views';
import type { AssetStatus, AssetType } from '../../shared/schemas/assets';
import type { Scoped } from '../db/scoped';
import type { Booking } from './booking.entity';

type RentalLabel = { id: string; number: string; customerCompany: string };
type BookedItem = { bookingId: string; id: string; assetTag: string; type: AssetType; status: AssetStatus };

/** The rental (number and customer) behind each rental booking, in one query. */
async function bookingRentals(tx: Scoped, bookings: Pick<Booking, 'rentalId'>[]): Promise<Map<string, RentalLabel>> {
  const ids = [...new Set(bookings.map((b) => b.rentalId).filter((id): id is string => !!id))];
  if (!ids.length) return new Map();
  const rows = await tx.sql<RentalLabel>(
    `SELECT r.id, r.number, c.company AS "customerCompany" FROM rentals r JOIN customers c ON c.id = r.customer_id WHERE r.organization_id = $1 AND r.id = ANY($2)`,
    [ids],
  );
  return new Map(rows.map((r) => [r.id, r]));
}

/** Items of the bookings, in packing-list order. */
async function bookingAssets(tx: Scoped, bookingIds: string[]) {
  if (!bookingIds.length) return [];
  return tx.sql<BookedItem>(
    `SELECT bi.booking_id AS "bookingId", a.id, a.asset_tag AS "assetTag", a.type, a.status
       FROM booking_items bi JOIN assets a ON a.id = bi.asset_id
      WHERE bi.organization_id = $1 AND bi.booking_id = ANY($2) ORDER BY a.type, a.asset_tag`,
    [bookingIds],
  );
}

export type { BookingView };

/** A booking as every other component and the API see it: plain values, no entity. */
const bookingView = (b: Booking, items: BookedItem[], rentals: Map<string, RentalLabel>): BookingView => ({
  id: b.id,
  state: b.state,
  purpose: b.purpose,
  startsOn: b.startsOn,
  endsOn: b.endsOn,
  jobId: b.jobId,
  job: b.job ? { id: b.job.id, reference: b.job.reference, customerName: b.job.customerName } : null,
  rentalId: b.rentalId,
  rental: b.rentalId ? (rentals.get(b.rentalId) ?? null) : null,
  kitId: b.kitId,
  kit: b.kit ? { id: b.kit.id, name: b.kit.name } : null,
  note: b.note,
  history: b.history,
  checkoutNote: b.checkoutNote,
  assetIds: items.map((i) => i.id),
  items: items.map((i) => ({ id: i.id, assetTag: i.assetTag, type: i.type, status: i.status })),
  checkedOutAt: b.checkedOutAt?.toISOString() ?? null,
  takenBy: b.takenBy,
  takenByUserId: b.takenByUserId,
  checkoutChecklist: b.checkoutChecklist,
  returnedAt: b.returnedAt?.toISOString() ?? null,
  broughtBackBy: b.broughtBackBy,
  returnChecklist: b.returnChecklist,
  createdAt: b.createdAt.toISOString(),
});

/** Views of booking rows loaded with their job and kit: items and rental labels in one query each. */
export async function bookingViews(tx: Scoped, rows: Booking[]): Promise<BookingView[]> {
  const items = await bookingAssets(
    tx,
    rows.map((r) => r.id),
  );
  const rentals = await bookingRentals(tx, rows);
  return rows.map((b) =>
    bookingView(
      b,
      items.filter((i) => i.bookingId === b.id),
      rentals,
    ),
  );
}
