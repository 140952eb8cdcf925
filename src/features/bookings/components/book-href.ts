import type { BoardTarget } from './booking-board';

/** The "Book kit" form's address, prefilled with a kit or an asset and the days. */
export function bookFormHref(target: BoardTarget | null, startsOn?: string, endsOn?: string): string {
  const q = new URLSearchParams();
  if (target?.kitId) q.set('kitId', target.kitId);
  if (target?.assetId) q.set('assetId', target.assetId);
  if (startsOn) q.set('startsOn', startsOn);
  if (endsOn) q.set('endsOn', endsOn);
  const qs = q.toString();
  return qs ? `/bookings/new?${qs}` : '/bookings/new';
}
