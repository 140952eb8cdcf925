/** A booking that runs past an item's due date. */
export type ThreatenedBooking = { bookingId: string; startsOn: string; endsOn: string; jobReference: string | null; customerName: string | null };

/** An item overdue or due soon, with the bookings it threatens (GET /api/calibration/review and /due). */
export type DueRow = {
  id: string;
  assetTag: string;
  type: string;
  status: string;
  dueOn: string | null;
  provider: string | null;
  kitId: string | null;
  kitName: string | null;
  state: 'overdue' | 'due_soon';
  threatened: ThreatenedBooking[];
};
