import type { AssetStatus, AssetType } from '../../../lib/assets';
import type { BlockReason } from '../../../lib/bookings';

export type { BookingPurpose, BookingState } from '../../../lib/bookings';
import type { BookingPurpose, BookingState } from '../../../lib/bookings';

export type ItemCondition = 'good' | 'worn' | 'damaged';

export interface ChecklistLine {
  assetId: string;
  present: boolean;
  condition: ItemCondition;
  note?: string;
}

export interface BookingItem {
  id: string;
  assetTag: string;
  type: AssetType;
  status: AssetStatus;
}

export interface Booking {
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
  assetIds: string[];
  items: BookingItem[];
  checkedOutAt: string | null;
  takenBy: string | null;
  takenByUserId: string | null;
  checkoutChecklist: ChecklistLine[] | null;
  returnedAt: string | null;
  broughtBackBy: string | null;
  returnChecklist: ChecklistLine[] | null;
  createdAt: string;
}

export interface BookingPage {
  items: Booking[];
  total: number;
}

export interface BookingListParams {
  from?: string;
  to?: string;
  assetId?: string;
  kitId?: string;
  jobId?: string;
  state?: BookingState[];
}

export interface BookingInput {
  assetIds?: string[];
  kitId?: string;
  startsOn: string;
  endsOn: string;
  jobId?: string;
  rentalId?: string;
  note?: string;
}

export interface HandoverInput {
  checklist: ChecklistLine[];
  counterpart: string;
}

export interface ReturnResult extends Booking {
  incidents: { assetId: string; incidentId: string }[];
}

export type BlockedBooking = Booking & { blocked: { assetId: string; assetTag: string; type: AssetType; reason: BlockReason }[] };

export interface CounterDay {
  today: string;
  checkouts: Booking[];
  returns: Booking[];
  late: Booking[];
  blocked: BlockedBooking[];
}

export interface MyKit {
  now: Booking[];
  next: Booking[];
}

export interface AvailabilityParams {
  type?: AssetType;
  startsOn: string;
  endsOn: string;
  limit?: number;
}

export interface AvailableAsset {
  id: string;
  assetTag: string;
  type: AssetType;
  model: string | null;
  dueOn: string | null;
  kitName: string | null;
}
