import { Link } from 'react-router-dom';
import { isApiError } from '../lib/api-client';
import { formatCalendarDate, formatDateRange } from '../lib/format';
import type { AlternativeItem, BookingRefusalDetails } from '../../shared/bookings/views';
import { blockReasonText } from '../lib/bookings';
import { Button } from './button';
import { AlertIcon } from './icons';

/** Why the server refused kit for some dates, per item, with the alternatives it offered. */
export interface BookingRefusal {
  message: string;
  items: { assetId: string; why: string; bookingId?: string; alternatives: AlternativeItem[] }[];
}

/** The refusal in an API error, or null when the error is something else; `range` words the dates of the booking in the way. */
export function bookingRefusalFrom(error: unknown, range = formatDateRange): BookingRefusal | null {
  if (!isApiError(error) || (error.code !== 'conflict' && error.code !== 'booking_blocked')) return null;
  const details = (error.details ?? {}) as BookingRefusalDetails;
  const offered = (assetId: string) => details.alternatives?.[assetId] ?? [];
  const blocked = (details.blocked ?? []).map((b) => ({
    assetId: b.assetId,
    why: `${b.assetTag} cannot go: ${blockReasonText[b.reason]}.`,
    alternatives: offered(b.assetId),
  }));
  // The server lists every booking that holds an item; one line per item (its first clash) keeps one set of swap buttons.
  const clashes = (details.conflicts ?? [])
    .filter((c, i, all) => all.findIndex((o) => o.assetId === c.assetId) === i && !blocked.some((b) => b.assetId === c.assetId))
    .map((c) => ({
      assetId: c.assetId,
      why: `${c.assetTag} is already booked ${range(c.startsOn, c.endsOn)}.`,
      bookingId: c.bookingId,
      alternatives: offered(c.assetId),
    }));
  return { message: error.message, items: [...blocked, ...clashes] };
}

/** The refusal in words, each refused item with a button per alternative to swap in. */
export function BookingRefusalPanel({ refusal, onSwap }: { refusal: BookingRefusal; onSwap: (refusedId: string, alternative: AlternativeItem) => void }) {
  return (
    <div role="alert" className="rounded-md border border-bad/50 bg-bad-wash px-3 py-2 text-ink-900">
      <p className="flex items-start gap-2 font-semibold">
        <AlertIcon size={18} className="mt-0.5 shrink-0 text-bad" />
        {refusal.message}
      </p>
      <ul className="mt-2 flex flex-col gap-2">
        {refusal.items.map((item) => (
          <li key={item.assetId} className="rounded border border-paper-line bg-card px-3 py-2 text-sm">
            <p>
              {item.why}{' '}
              {item.bookingId ? (
                <Link to={`/bookings/${item.bookingId}`} className="font-semibold text-brass-deep underline">
                  See that booking
                </Link>
              ) : null}
            </p>
            {item.alternatives.length ? (
              <p className="mt-2 flex flex-wrap gap-2">
                {item.alternatives.map((alt) => (
                  <Button
                    key={alt.id}
                    size="sm"
                    onClick={() => onSwap(item.assetId, alt)}
                    title={[alt.model, alt.dueOn ? `calibration due ${formatCalendarDate(alt.dueOn)}` : null].filter(Boolean).join(', ') || undefined}
                  >
                    Use {alt.assetTag} instead
                  </Button>
                ))}
              </p>
            ) : (
              <p className="mt-1 text-ink-700">No item of the same type is free and in calibration for these dates.</p>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
