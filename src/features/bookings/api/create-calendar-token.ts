import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

/** POST /api/calendar/token — a new secret feed address for the signed-in person (the old one stops working). */
export function createCalendarToken(): Promise<{ url: string }> {
  return apiClient.post<{ url: string }>('/calendar/token');
}

export function useCreateCalendarToken() {
  return useMutation({ mutationFn: createCalendarToken });
}
