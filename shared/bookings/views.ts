/**
 * What the bookings API answers (bookings, the counter's day, site jobs).
 * Plain types, no zod: the browser imports them as types only.
 */
import type { AssetStatus, AssetType } from '../assets/vocabulary';
import type { JobTolerance } from '../calibration/triage';
import type { BookingPurpose, BookingState } from '../schemas/bookings';
import type { BlockReason } from './rules';

export type ItemCondition = 'good' | 'worn' | 'damaged';

/** One line of the packing list as walked at the counter. */
export type ChecklistLine = { assetId: string; present: boolean; condition: ItemCondition; note?: string };

export type BookingItemView = { id: string; assetTag: string; type: AssetType; status: AssetStatus };

export type BookingView = {
  id: string;
  state: BookingState;
  purpose: BookingPurpose;
  startsOn: string;
  endsOn: string;
  jobId: string | null;
  job: { id: string; reference: string; customerName: string } | null;
  rentalId: string | null;
  /** The rental behind a rental booking: its number and customer. */
  rental: { id: string; number: string; customerCompany: string } | null;
  kitId: string | null;
  kit: { id: string; name: string } | null;
  note: string | null;
  /** Past use the owner recorded; never reserved or handed over in Nestkeeper. */
  history: boolean;
  /** Why the kit went before its checkout window opened, or late after it was not collected. */
  checkoutNote: string | null;
  assetIds: string[];
  /** In packing-list order. */
  items: BookingItemView[];
  checkedOutAt: string | null;
  takenBy: string | null;
  takenByUserId: string | null;
  checkoutChecklist: ChecklistLine[] | null;
  returnedAt: string | null;
  broughtBackBy: string | null;
  returnChecklist: ChecklistLine[] | null;
  createdAt: string;
};

/** `POST /api/bookings/:id/return`: missing or damaged items come back with an incident each. */
export type ReturnView = BookingView & { incidents: { assetId: string; incidentId: string }[] };

/** An item a booking asks for that may not go for its dates (the rules of ./rules.ts). */
export type BlockedItem = { assetId: string; assetTag: string; type: AssetType; reason: BlockReason };

/** `GET /api/bookings/today`: the counter's day. */
export type CounterDayView = {
  today: string;
  checkouts: BookingView[];
  returns: BookingView[];
  late: BookingView[];
  /** Reservations whose days passed without checkout: cancel them, or check them out late with a note. */
  notCollected: BookingView[];
  /** Reserved bookings an item no longer qualifies for. */
  blocked: (BookingView & { blocked: BlockedItem[] })[];
};

/** `GET /api/bookings/mine`: kit a technician carries now and next. */
export type MyKitView = { now: BookingView[]; next: BookingView[] };

/** A free, valid item of the same type the server offers in place of a refused one. */
export type AlternativeItem = { id: string; assetTag: string; model: string | null; dueOn: string | null };

/** `details` of 409 `conflict` and 422 `booking_blocked` (booking, renting, moving a booking, handing over). */
export type BookingRefusalDetails = {
  conflicts?: { assetId: string; assetTag: string; bookingId: string; startsOn: string; endsOn: string }[];
  blocked?: Omit<BlockedItem, 'type'>[];
  alternatives?: Record<string, AlternativeItem[]>;
};

/** A customer site job of the firm's own (DESIGN.md §3 "Job"). */
export type SiteJobView = {
  id: string;
  reference: string;
  customerName: string;
  contactName: string | null;
  contactEmail: string | null;
  siteAddress: string | null;
  startsOn: string;
  endsOn: string;
  leadTechnicianId: string | null;
  notes: string | null;
  /** The tightest feature tolerance measured, if recorded (impact triage weighs an instrument's error against it). */
  tightestTolerance: JobTolerance | null;
};

/** `POST /api/calendar/token`: the new secret address of the person's calendar feed. */
export type CalendarFeedView = { url: string };
