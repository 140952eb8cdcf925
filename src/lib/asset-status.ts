import type { QueryClient } from '@tanstack/react-query';

/**
 * Query roots of the features that show an asset's status (fleet lists and
 * pages, kit readiness, holds). A check, an incident, a hold or a release
 * changes the status, so each of those mutations refreshes these too; the
 * features own their key factories and start them from these roots.
 */
export const fleetQueryRoot = ['fleet'] as const;
export const kitsQueryRoot = ['kits'] as const;
export const holdsQueryRoot = ['holds'] as const;

export function invalidateAssetStatus(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([fleetQueryRoot, kitsQueryRoot, holdsQueryRoot].map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}

/** Incidents: taking kit back with an item missing or damaged opens one each. */
export const incidentsQueryRoot = ['incidents'] as const;

/**
 * The booking board's root: a lab trip reserves its window as a lab booking,
 * and sending or receiving it moves that booking along.
 */
export const bookingsQueryRoot = ['bookings'] as const;

export function invalidateBookingBoard(queryClient: QueryClient): Promise<unknown> {
  return queryClient.invalidateQueries({ queryKey: bookingsQueryRoot });
}
