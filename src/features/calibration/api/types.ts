import type { AsFound, IntervalChange } from '../../../lib/calibration';
import type { DueRow, ThreatenedBooking } from '../../../../shared/calibration/review-types';
export type { DueRow, ThreatenedBooking };

export type { AsFound } from '../../../lib/calibration';

/** One certificate recorded against an item (`GET /api/assets/:id/calibrations`). */
export interface CalibrationEvent {
  id: string;
  assetId: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  /** Same-origin link to the certificate PDF. */
  certificateUrl: string;
  asFound: AsFound;
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
}

export interface RecordCalibrationInput {
  assetId: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  asFound: AsFound;
  asLeft: AsFound;
  intervalMonths?: number;
  note?: string;
  certificate: File;
}


export interface AtLabRow {
  tripId: string;
  provider: string;
  sentOn: string;
  expectedBackOn: string;
  late: boolean;
  assetId: string;
  assetTag: string;
}

export interface ImpactReviewSummary {
  id: string;
  assetId: string;
  assetTag: string;
  foundOn: string;
  bookings: number;
  assessed: number;
}

/** `GET /api/calibration/review` — the owner's review page. */
export interface CalibrationReview {
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
}

/** `GET /api/assets/:id/lab-windows` — when the item can go without breaking a booking. */
export interface LabWindows {
  assetId: string;
  provider: string | null;
  turnaroundDays: number;
  dueOn: string | null;
  gaps: { startsOn: string; endsOn: string | null; freeDays: number | null; returnBy: string }[];
  threatenedIfSentNow: { bookingId: string; startsOn: string; endsOn: string; purpose: string; jobReference: string | null }[];
}

export type LabTripState = 'planned' | 'at_lab' | 'back';

export interface LabTrip {
  id: string;
  provider: string;
  sentOn: string;
  expectedBackOn: string;
  state: LabTripState;
  bookingId: string | null;
  items: { assetId: string; assetTag: string; type: string; receivedOn: string | null; calibrationEventId: string | null }[];
}

export interface PlanLabTripInput {
  provider: string;
  assetIds: string[];
  sentOn: string;
  expectedBackOn?: string;
}

export type ImpactAssessment = 'no_effect' | 'customer_notified' | 'remeasure_offered';

export interface ImpactBooking {
  bookingId: string;
  jobId: string | null;
  jobReference: string | null;
  customerName: string | null;
  contactEmail: string | null;
  rentalId: string | null;
  customerId: string | null;
  startsOn: string;
  endsOn: string;
  assessment: ImpactAssessment | null;
  note: string | null;
  noticeQueuedAt: string | null;
}

export interface ImpactReview {
  id: string;
  assetId: string;
  asset?: { id?: string; assetTag: string; type: string };
  trigger: 'calibration' | 'check';
  triggerId: string;
  since: string | null;
  foundOn: string;
  state: 'open' | 'closed';
  bookings: ImpactBooking[];
  assessedCount: number;
}

/** `GET /api/assets/:id/impact` answers `state: 'none'` when the item never had one. */
export type AssetImpact = ImpactReview | { state: 'none'; bookings: []; since: null; foundOn: null };

export interface ImpactNotice {
  to: string;
  customerName: string | null;
  subject: string;
  text: string;
}
