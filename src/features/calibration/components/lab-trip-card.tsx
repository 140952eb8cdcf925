import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { formatCalendarDate } from '../../../lib/format';
import { useSendLabTrip } from '../api/send-lab-trip';
import type { LabTripView } from '../../../../shared/calibration/views';
import { TripStateChip } from './calibration-words';

/** One lab trip: where, when, which items; "Send to the lab" while it is planned. */
export function LabTripCard({ trip, today, canSend, headingLevel = 3 }: { trip: LabTripView; today: string; canSend: boolean; headingLevel?: 2 | 3 }) {
  const send = useSendLabTrip();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const late = trip.state === 'at_lab' && trip.expectedBackOn < today;
  return (
    <article className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4" aria-label={`Lab trip to ${trip.provider}`}>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <Heading className="text-base font-bold">Lab trip to {trip.provider}</Heading>
        <TripStateChip state={trip.state} />
        {late ? <span className="text-sm font-semibold text-bad">Late: expected back {formatCalendarDate(trip.expectedBackOn)}</span> : null}
      </div>
      <p className="text-sm text-ink-700">
        {trip.state === 'planned' ? 'Leaves' : 'Left'} {formatCalendarDate(trip.sentOn)} · expected back {formatCalendarDate(trip.expectedBackOn)}
        {trip.bookingId ? (
          <>
            {' · '}
            <Link to={`/bookings/${trip.bookingId}`} className="font-semibold text-brass-deep underline">
              its booking on the board
            </Link>
          </>
        ) : null}
      </p>
      <ul className="flex flex-wrap gap-x-4 gap-y-1">
        {trip.items.map((item) => (
          <li key={item.assetId} className="flex items-center gap-2">
            <Link to={`/fleet/${item.assetId}`} className="font-mono font-semibold underline decoration-brass-deep whitespace-nowrap">
              {item.assetTag}
            </Link>
            {item.receivedOn ? (
              <span className="text-sm text-ink-700">back {formatCalendarDate(item.receivedOn)}</span>
            ) : trip.state === 'at_lab' && canSend ? (
              <Link to={`/fleet/${item.assetId}/calibrate`} className="text-sm font-semibold text-brass-deep underline">
                Record its certificate
              </Link>
            ) : null}
          </li>
        ))}
      </ul>
      {trip.state === 'planned' && canSend ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="primary" busy={send.isPending} onClick={() => send.mutate(trip.id)}>
            Send to the lab
          </Button>
          <span className="text-sm text-ink-700">
            {trip.sentOn > today
              ? `Planned to leave ${formatCalendarDate(trip.sentOn)}: send it on the day it leaves.`
              : 'Marks the items as at the lab and the booking as out.'}
          </span>
        </div>
      ) : null}
      {trip.state === 'at_lab' ? <p className="text-sm text-ink-700">Each item comes back when its certificate is recorded.</p> : null}
      {send.isError ? <Notice tone="error">{send.error.message}</Notice> : null}
    </article>
  );
}
