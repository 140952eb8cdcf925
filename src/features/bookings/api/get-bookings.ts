import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingsKeys, type BookingListParams } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { BookingView } from '../../../../shared/bookings/views';

const PAGE = 500;
/** A board window rarely holds more; past this the list says so. */
const MOST = 5_000;

function listQuery(params: BookingListParams) {
  return {
    from: params.from,
    to: params.to,
    assetId: params.assetId,
    kitId: params.kitId,
    jobId: params.jobId,
    state: params.state?.length ? params.state.join(',') : undefined,
  };
}

/** Every booking touching the window (the API pages at 500; this reads page after page). */
export async function getBookings(params: BookingListParams, signal?: AbortSignal): Promise<Page<BookingView>> {
  const items: BookingView[] = [];
  let total = 0;
  do {
    const page = await apiClient.get<Page<BookingView>>('/bookings', {
      query: { ...listQuery(params), limit: PAGE, offset: items.length },
      signal,
    });
    items.push(...page.items);
    total = page.total;
    if (page.items.length === 0) break;
  } while (items.length < total && items.length < MOST);
  return { items, total };
}

export const bookingsQueryOptions = (params: BookingListParams) =>
  queryOptions({
    queryKey: bookingsKeys.list(params),
    queryFn: ({ signal }) => getBookings(params, signal),
    placeholderData: keepPreviousData,
  });

export function useBookings(params: BookingListParams, options: { enabled?: boolean } = {}) {
  return useQuery({ ...bookingsQueryOptions(params), enabled: options.enabled ?? true });
}
