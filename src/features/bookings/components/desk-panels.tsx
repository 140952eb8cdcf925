import { differenceInCalendarDays, parseISO } from 'date-fns';
import { useContext, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { useCounterDay } from '../api/get-counter-day';
import { useMyKit } from '../api/get-my-kit';
import type { BookingView } from '../../../../shared/bookings/views';
import { blockReasonText, todayIn } from '../../../lib/bookings';
import { useFirmFormat, formatDateRange } from '../../../lib/format';
import { BookingStateChip, bookingContents, bookingTitle } from './booking-words';

const lateWords = (days: number) => `${days} ${days === 1 ? 'day' : 'days'} late`;

function BookingLine({ booking, extra }: { booking: BookingView; extra?: ReactNode }) {
  return (
    <li>
      <Link to={`/bookings/${booking.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-0.5 px-1 py-1.5 hover:bg-brass-wash">
        <span className="font-semibold text-ink-900">{bookingTitle(booking)}</span>
        <span className="text-sm text-ink-700">
          {formatDateRange(booking.startsOn, booking.endsOn)} · {bookingContents(booking)}
        </span>
        {extra ? <span className="ml-auto text-sm">{extra}</span> : null}
      </Link>
    </li>
  );
}

/** Manager's and owner's "Today at the counter": what goes out, comes back, is late, or can no longer go. */
export function TodayAtCounter() {
  const day = useCounterDay();
  if (day.isPending) return <LoadingPanel label="Looking at today's bookings…" className="md:col-span-2 xl:col-span-3" />;
  if (day.isError)
    return (
      <Notice tone="error" className="md:col-span-2 xl:col-span-3">
        {day.error.message}
      </Notice>
    );
  const { today, checkouts, returns, late, notCollected, blocked } = day.data;
  return (
    <section aria-labelledby="counter-heading" className="flex flex-col gap-2 md:col-span-2 xl:col-span-3">
      <h2 id="counter-heading" className="text-lg font-bold text-ink-900">
        Today at the counter
      </h2>
      <div className="grid items-start gap-3 md:grid-cols-2">
        <CountedSection level={3} id="counter-out" title="Going out today" count={checkouts.length} empty="Nothing is due to be checked out.">
          {checkouts.map((b) => (
            <BookingLine key={b.id} booking={b} extra={<span className="font-semibold text-brass-deep">Check out</span>} />
          ))}
        </CountedSection>
        <CountedSection level={3} id="counter-back" title="Coming back today" count={returns.length} empty="Nothing is due back today.">
          {returns.map((b) => (
            <BookingLine key={b.id} booking={b} extra={<BookingStateChip state={b.state} />} />
          ))}
        </CountedSection>
        <CountedSection level={3} id="counter-late" title="Late returns" count={late.length} empty="Nothing is overdue back.">
          {late.map((b) => {
            const daysLate = differenceInCalendarDays(parseISO(today), parseISO(b.endsOn));
            return (
              <BookingLine
                key={b.id}
                booking={b}
                extra={<span className="nk-hatch rounded border border-bad/50 px-1.5 font-semibold text-bad">{lateWords(daysLate)}</span>}
              />
            );
          })}
        </CountedSection>
        <CountedSection
          level={3}
          id="counter-not-collected"
          title="Not collected"
          count={notCollected.length}
          empty="Every reservation whose days have passed was collected or cancelled."
        >
          {notCollected.map((b) => (
            <BookingLine key={b.id} booking={b} extra={<span className="font-semibold text-brass-deep">Cancel, or check out late</span>} />
          ))}
        </CountedSection>
        <CountedSection level={3} id="counter-blocked" title="Blocked bookings" count={blocked.length} empty="Every reserved item can still go.">
          {blocked.map((b) => (
            <BookingLine
              key={b.id}
              booking={b}
              extra={<span className="text-ink-800">{b.blocked.map((x) => `${x.assetTag}: ${blockReasonText[x.reason]}`).join('; ')}</span>}
            />
          ))}
        </CountedSection>
      </div>
    </section>
  );
}

/** Technician's "Kit I carry now" and "Next". */
export function MyKitPanels() {
  const mine = useMyKit();
  const today = todayIn(useFirmFormat().timeZone);
  if (mine.isPending) return <LoadingPanel label="Looking for your kit…" />;
  if (mine.isError) return <Notice tone="error">{mine.error.message}</Notice>;
  return (
    <>
      <CountedSection id="kit-now" title="Kit I carry now" count={mine.data.now.length} empty="No kit is checked out to you.">
        {mine.data.now.map((b) => (
          <BookingLine
            key={b.id}
            booking={b}
            extra={
              <>
                {b.endsOn < today ? (
                  <span className="nk-hatch mr-2 rounded border border-bad/50 px-1.5 font-semibold text-bad">
                    {lateWords(differenceInCalendarDays(parseISO(today), parseISO(b.endsOn)))}
                  </span>
                ) : null}
                <span className="font-mono text-ink-700">{b.items.map((i) => i.assetTag).join(', ')}</span>
              </>
            }
          />
        ))}
      </CountedSection>
      <CountedSection id="kit-next" title="Next" count={mine.data.next.length} empty="Nothing is booked for you next.">
        {mine.data.next.map((b) => (
          <BookingLine key={b.id} booking={b} extra={<BookingStateChip state={b.state} />} />
        ))}
      </CountedSection>
    </>
  );
}
