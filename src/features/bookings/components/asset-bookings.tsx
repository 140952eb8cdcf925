import { formatDateRange } from '../../../lib/format';
import { Link } from 'react-router-dom';
import { buttonClasses } from '../../../components/button';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { Panel } from '../../../components/panel';
import { addDays } from '../../../lib/bookings';
import { useBookings } from '../api/get-bookings';
import { BookingStateChip, bookingTitle } from './booking-words';

/** An asset's bookings from 90 days back onwards, and "Book this item" for those who may book. */
export function AssetBookings({ assetId, today, canBook, className }: { assetId: string; today: string; canBook: boolean; className?: string }) {
  const bookings = useBookings({ assetId, from: addDays(today, -90), state: ['reserved', 'out', 'returned'] });
  const items = bookings.data ? [...bookings.data.items].sort((a, b) => (a.startsOn < b.startsOn ? 1 : -1)) : [];
  return (
    <Panel
      title="Bookings"
      className={className}
      actions={
        canBook ? (
          <Link to={`/bookings/new?assetId=${encodeURIComponent(assetId)}`} className={buttonClasses('secondary', 'sm')}>
            Book this item
          </Link>
        ) : null
      }
    >
      {bookings.isPending ? <LoadingPanel label="Looking for bookings…" /> : null}
      {bookings.isError ? <Notice tone="error">{bookings.error.message}</Notice> : null}
      {bookings.data && items.length === 0 ? <p className="text-sm text-ink-700">No bookings in the last 90 days or ahead.</p> : null}
      {items.length ? (
        <ul className="flex flex-col divide-y divide-paper-line">
          {items.map((b) => (
            <li key={b.id}>
              <Link to={`/bookings/${b.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
                <span className="text-sm text-ink-700">{formatDateRange(b.startsOn, b.endsOn)}</span>
                <span className="font-semibold text-ink-900">{bookingTitle(b)}</span>
                <span className="ml-auto">
                  <BookingStateChip state={b.state} />
                </span>
              </Link>
            </li>
          ))}
        </ul>
      ) : null}
    </Panel>
  );
}
