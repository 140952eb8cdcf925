import type { AvailabilityParams, BookingListParams } from './types';

export const bookingsKeys = {
  all: ['bookings'] as const,
  lists: () => [...bookingsKeys.all, 'list'] as const,
  list: (params: BookingListParams) => [...bookingsKeys.lists(), params] as const,
  one: (id: string) => [...bookingsKeys.all, 'one', id] as const,
  today: () => [...bookingsKeys.all, 'today'] as const,
  mine: () => [...bookingsKeys.all, 'mine'] as const,
  availability: (params: AvailabilityParams) => [...bookingsKeys.all, 'availability', params] as const,
};
