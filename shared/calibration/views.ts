/**
 * What the calibration API answers (certificates, the owner's review, lab
 * trips, impact reviews). Plain types, no zod: the browser imports them as types only.
 */
import type { AssetType } from '../assets/vocabulary';
import type { AsFound, IntervalChange } from './interval-review';
import type { AsFoundErrorSource, TriageFacts } from './triage';

/** One certificate recorded against an item (`GET /api/assets/:id/calibrations`). */
export type CalibrationEventView = {
  id: string;
  assetId: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  /** Same-origin link to the certificate PDF. */
  certificateUrl: string;
  asFound: AsFound;
  /** The largest as-found error the certificate states (µm), when recorded. */
  asFoundErrorUm: number | null;
  asLeft: AsFound;
  intervalMonths: number;
  dueOn: string;
  suggestedIntervalMonths: number;
  suggestionReason: string;
  /** Which way the suggestion moves; `outside_policy` when the interval is outside the firm's range and left to a person. */
  suggestedChange: IntervalChange;
  intervalDecision: null | 'accepted' | 'declined';
  labTripId: string | null;
  note: string | null;
  recordedBy: string;
  createdAt: string;
};

/** A booking that runs past an item's due date. */
export type ThreatenedBooking = { bookingId: string; startsOn: string; endsOn: string; jobReference: string | null; customerName: string | null };

/** An item overdue or due soon, with the bookings it threatens (GET /api/calibration/review and /due). */
export type DueRow = {
  id: string;
  assetTag: string;
  type: AssetType;
  status: string;
  dueOn: string | null;
  provider: string | null;
  kitId: string | null;
  kitName: string | null;
  state: 'overdue' | 'due_soon';
  threatened: ThreatenedBooking[];
};

/** An item at the lab and not yet back. */
export type AtLabRow = { tripId: string; provider: string; sentOn: string; expectedBackOn: string; late: boolean; assetId: string; assetTag: string };

/** An open impact review, counted. */
export type ImpactReviewSummary = { id: string; assetId: string; assetTag: string; foundOn: string; bookings: number; assessed: number };

/** `GET /api/calibration/review`: the owner's review page. */
export type CalibrationReviewView = {
  firm: string;
  today: string;
  dueSoonDays: number;
  overdue: DueRow[];
  dueSoon: DueRow[];
  /** Totals; the lists hold at most `listLimit` of the most urgent items. */
  counts: { overdue: number; dueSoon: number };
  listLimit: number;
  byKit: { kitId: string; kitName: string; items: DueRow[] }[];
  /** 52 weeks from this week (weeks start on Monday). */
  timeline: { weekStart: string; count: number }[];
  atLab: AtLabRow[];
  impactReviews: ImpactReviewSummary[];
};

/** `GET /api/assets/:id/lab-windows` (one item) and `GET /api/lab-windows?assetIds=` (one trip for several): when the items can go to the lab
 * without breaking a booking. */
export type LabWindowsView = {
  /** The first item (the only one for a single item's finder). */
  assetId: string;
  assets: { id: string; assetTag: string }[];
  /** The lab named on every item's plan; null when none is named or they differ. */
  provider: string | null;
  /** The longest turnaround among the items' labs. */
  turnaroundDays: number;
  /** The earliest due date among the items. */
  dueOn: string | null;
  /** `endsOn` and `freeDays` are null for the open gap after the last booking. Windows starting on or before the due date come first (`beforeDue`). */
  gaps: { startsOn: string; endsOn: string | null; freeDays: number | null; returnBy: string; beforeDue: boolean }[];
  /** True when the item has a due date and no window starts on or before it. */
  noneBeforeDue: boolean;
  /** A trip already planned (or at the lab) with this item: no second one is offered. */
  plannedTrip: { id: string; provider: string; sentOn: string; expectedBackOn: string; state: LabTripState } | null;
  /** Every item of these already on a trip not yet back, one line per item. */
  plannedTrips: (NonNullable<LabWindowsView['plannedTrip']> & { assetId: string; assetTag: string })[];
  threatenedIfSentNow: { bookingId: string; startsOn: string; endsOn: string; purpose: string; jobReference: string | null }[];
};

export type LabTripState = 'planned' | 'at_lab' | 'back';

export type LabTripView = {
  id: string;
  provider: string;
  sentOn: string;
  expectedBackOn: string;
  state: LabTripState;
  bookingId: string | null;
  items: { assetId: string; assetTag: string; type: AssetType; receivedOn: string | null; calibrationEventId: string | null }[];
};

export type ImpactAssessment = 'no_effect' | 'customer_notified' | 'remeasure_offered';

/** A booking that used the item between its last passing evidence and the finding. */
export type ImpactBookingView = {
  bookingId: string;
  jobId: string | null;
  jobReference: string | null;
  customerName: string | null;
  contactEmail: string | null;
  rentalId: string | null;
  /** Not filled in yet: rentals' customers are not looked up for impact reviews. */
  customerId: null;
  startsOn: string;
  endsOn: string;
  assessment: ImpactAssessment | null;
  note: string | null;
  noticeQueuedAt: string | null;
  /** When the notice reached the mail server (null: not sent, or still waiting to send). */
  noticeSentAt: string | null;
  /** The job's contact person, whom a notice greets. */
  contactName: string | null;
  /** The job's tightest tolerance as recorded now (null: none, or a rental). */
  toleranceNote: string | null;
  /** Triage from today's records: a suggestion a person accepts or changes. */
  suggestion: TriageFacts;
  /** The triage shown when the booking was assessed, kept for the auditor (null until assessed). */
  triage: TriageFacts | null;
};

export type ImpactReviewView = {
  id: string;
  assetId: string;
  asset?: { id: string; assetTag: string; type: AssetType };
  trigger: 'calibration' | 'check';
  triggerId: string;
  since: string | null;
  foundOn: string;
  state: 'open' | 'closed';
  bookings: ImpactBookingView[];
  assessedCount: number;
  /** The instrument's as-found error the triage uses: the certificate's recorded value or the failing check's result. */
  asFound: { errorUm: number | null; source: AsFoundErrorSource };
  /** The firm's triage ratio today. */
  triageRatio: number;
  /** Bookings assessed "re-measure offered", or not yet assessed with "re-measure advised" suggested. */
  remeasureCount: number;
};

/** `GET /api/assets/:id/impact`: the item's latest review, or `state: 'none'` when it never had one. */
export type AssetImpactView = ImpactReviewView | { state: 'none'; bookings: []; since: null; foundOn: null };

/** `POST /api/impact-reviews/:id/notices`: one draft per customer with an e-mail address; `sent` when they were queued. */
/** Which notice a booking's customer gets: by its assessment, `pending` while not assessed. */
export type NoticeGroup = ImpactAssessment | 'pending';

/** `POST /api/impact-reviews/:id/notices`: one draft per customer and group with an e-mail address; `sent` when they were queued. */
export type ImpactNoticesView = {
  drafts: { to: string; customerName: string | null; group: NoticeGroup; jobReferences: string[]; bookingIds: string[]; subject: string; text: string }[];
  sent: boolean;
  /** Who the notices come from: the firm's name (From), its Reply-To ('' for none) and the address that signs them. */
  sender: { name: string; replyTo: string; address: string };
};
