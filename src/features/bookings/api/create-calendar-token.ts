import { useMutation } from '@tanstack/react-query';
import type { CalendarFeedView } from '../../../../shared/bookings/views';
import { apiClient } from '../../../lib/api-client';

/** POST /api/calendar/token — a new secret feed address for the signed-in person (the old one stops working). */
export function createCalendarToken(): Promise<CalendarFeedView> {
  return apiClient.post<CalendarFeedView>('/calendar/token');
}

export function useCreateCalendarToken() {
  return useMutation({ mutationFn: createCalendarToken });
}
