import { Link } from 'react-router-dom';
import type { AtLabRow } from '../../../../shared/calibration/views';
import { formatCalendarDate } from '../../../lib/format';
import { LateChip, TripStateChip } from './calibration-words';

/** What is at the lab now, one entry per trip; a trip past its expected day back is flagged late. */
export function AtLabList({ rows, canRecord }: { rows: AtLabRow[]; canRecord: boolean }) {
  if (!rows.length) return <p className="text-sm text-ink-700">Nothing is at the lab.</p>;
  const trips = new Map<string, AtLabRow[]>();
  for (const row of rows) trips.set(row.tripId, [...(trips.get(row.tripId) ?? []), row]);
  return (
    <ul className="flex flex-col gap-2" aria-label="Lab trips out now">
      {[...trips.values()].map((items) => {
        const trip = items[0];
        return (
          <li key={trip.tripId} className={`rounded-md border px-3 py-2 ${trip.late ? 'border-bad/50 bg-bad-wash/40' : 'border-paper-line'}`}>
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <span className="font-semibold">{trip.provider}</span>
              {trip.late ? <LateChip /> : <TripStateChip state="at_lab" />}
              <span className="text-sm text-ink-700">
                Sent {formatCalendarDate(trip.sentOn)} · expected back {formatCalendarDate(trip.expectedBackOn)}
              </span>
            </div>
            <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
              {items.map((item) => (
                <li key={item.assetId} className="flex items-center gap-2">
                  <Link to={`/fleet/${item.assetId}`} className="font-mono font-semibold underline decoration-brass-deep whitespace-nowrap">
                    {item.assetTag}
                  </Link>
                  {canRecord ? (
                    <Link to={`/fleet/${item.assetId}/calibrate`} className="text-sm font-semibold text-brass-deep underline">
                      Record its certificate
                    </Link>
                  ) : null}
                </li>
              ))}
            </ul>
          </li>
        );
      })}
    </ul>
  );
}
