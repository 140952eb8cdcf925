import { bookingsQueryRoot } from '../../../lib/asset-status';
import type { BookingState } from '../../../lib/bookings';

export interface BookingListParams {
  from?: string;
  to?: string;
  assetId?: string;
  kitId?: string;
  jobId?: string;
  state?: BookingState[];
}

export const bookingsKeys = {
  all: bookingsQueryRoot,
  lists: () => [...bookingsKeys.all, 'list'] as const,
  list: (params: BookingListParams) => [...bookingsKeys.lists(), params] as const,
  one: (id: string) => [...bookingsKeys.all, 'one', id] as const,
  today: () => [...bookingsKeys.all, 'today'] as const,
  mine: () => [...bookingsKeys.all, 'mine'] as const,
};
