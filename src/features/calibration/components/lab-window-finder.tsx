import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { DateInput } from '../../../components/date-field';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { formatCalendarDate, formatDateRange } from '../../../lib/format';
import { usePlanLabTrip } from '../api/plan-lab-trip';
import type { LabTripView, LabWindowsView } from '../../../../shared/calibration/views';
import { isCalendarDate } from '../../../../shared/dates/calendar-date';
import { days } from './calibration-words';

const purposeWords: Record<string, string> = { job: 'Site job', rental: 'Rental', lab: 'Lab trip', internal: 'In-house use' };

/** "Free 12 Jan – 2 Feb (22 days) — back by 25 Jan", or open-ended when no booking follows. */
export function gapText(gap: LabWindowsView['gaps'][number]): string {
  const free = gap.endsOn
    ? `Free ${formatDateRange(gap.startsOn, gap.endsOn)} (${days(gap.freeDays ?? 0)})`
    : `Free from ${formatCalendarDate(gap.startsOn)} on, nothing booked after`;
  return `${free} — back by ${formatCalendarDate(gap.returnBy)}`;
}

function conflictText(error: unknown): string {
  if (!isApiError(error)) return 'The trip could not be planned. Try again.';
  if (error.code === 'conflict') return `${error.message} Pick a later window.`;
  return error.message;
}

/**
 * The window finder: which bookings sending the items today would break, and
 * the free gaps (free for every item) long enough for the lab's turnaround,
 * earliest first. "Plan this trip" reserves the gap on the board from its
 * first day, one lab booking for all the items.
 */
export function LabWindowFinder({ windows, onPlanned, canPlan }: { windows: LabWindowsView; onPlanned: (trip: LabTripView) => void; canPlan: boolean }) {
  const plan = usePlanLabTrip();
  const [provider, setProvider] = useState(windows.provider ?? '');
  const providerId = useId();
  const [planning, setPlanning] = useState<string | null>(null);
  const [own, setOwn] = useState({ sentOn: '', expectedBackOn: '' });
  const sentOnId = useId();
  const backOnId = useId();
  const ownSentOk = own.sentOn === '' || isCalendarDate(own.sentOn);
  const ownBackOk = own.expectedBackOn === '' || (isCalendarDate(own.expectedBackOn) && (!isCalendarDate(own.sentOn) || own.expectedBackOn >= own.sentOn));
  const assetIds = windows.assets.map((a) => a.id);
  const tags = windows.assets.map((a) => a.assetTag).join(', ');
  const several = windows.assets.length > 1;
  const trips = windows.plannedTrips;
  const offer = canPlan && trips.length === 0;

  return (
    <div className="flex flex-col gap-4">
      <section aria-labelledby="break-heading" className="rounded-lg border border-paper-line bg-card p-4">
        <h2 id="break-heading" className="mb-2 text-lg font-bold">
          Sending {several ? 'them' : 'it'} today would break:
        </h2>
        {windows.threatenedIfSentNow.length === 0 ? (
          <p className="text-ink-700">
            No booking — {several ? 'they' : 'it'} can go today and be back before anything needs {several ? 'them' : 'it'}.
          </p>
        ) : (
          <ul className="flex flex-col gap-1">
            {windows.threatenedIfSentNow.map((b) => (
              <li key={b.bookingId} className="flex flex-wrap items-baseline gap-x-2">
                <Link to={`/bookings/${b.bookingId}`} className="font-semibold text-brass-deep underline">
                  {b.jobReference ?? purposeWords[b.purpose] ?? 'Booking'}
                </Link>
                <span className="text-sm text-ink-700">
                  {purposeWords[b.purpose] ?? b.purpose} · {formatDateRange(b.startsOn, b.endsOn)}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="gaps-heading" className="flex flex-col gap-3">
        <h2 id="gaps-heading" className="text-lg font-bold">
          Free windows, earliest first
        </h2>
        <p className="text-sm text-ink-700">
          {several ? `Days when none of ${tags} is booked` : `Gaps between ${tags}’s bookings`}, at least {days(windows.turnaroundDays)} long: the lab&rsquo;s
          turnaround{several ? ' (the longest among their labs)' : ''}.
        </p>
        {trips.length ? (
          <Notice tone="info" title="Already planned">
            {trips.map((trip) => (
              <span key={trip.assetId} className="block">
                {trip.assetTag} is on a trip to {trip.provider}
                {trip.state === 'planned' ? `, going ${formatCalendarDate(trip.sentOn)}` : ', at the lab now'}, expected back{' '}
                {formatCalendarDate(trip.expectedBackOn)}.
              </span>
            ))}
            {several ? 'Take it off this trip (in the list of items) to plan one for the others. ' : null}
            <Link to="/calibration/trips" className="font-semibold text-brass-deep underline">
              See lab trips
            </Link>
          </Notice>
        ) : null}
        {windows.noneBeforeDue && windows.dueOn ? (
          <Notice tone="caution" title="No window before the due date">
            No free window of {days(windows.turnaroundDays)} starts on or before {formatCalendarDate(windows.dueOn)}. Every window below begins after it; until
            it is back {several ? 'that item' : 'the item'} cannot go out on a job. Pick your own dates below if a booking can move.
          </Notice>
        ) : null}
        {offer ? (
          <div className="flex max-w-sm flex-col gap-1">
            <label htmlFor={providerId} className="text-sm font-semibold text-ink-800">
              Lab
            </label>
            <input
              id={providerId}
              value={provider}
              onChange={(e) => setProvider(e.target.value)}
              maxLength={120}
              className="min-h-10 rounded-md border border-paper-line bg-card px-3 text-base"
            />
            {!provider.trim() ? <p className="text-sm text-bad">Name the lab before planning a trip.</p> : null}
          </div>
        ) : null}
        {plan.isError ? (
          <Notice tone="error" title="Not planned">
            {conflictText(plan.error)}
          </Notice>
        ) : null}
        {windows.gaps.length === 0 ? <p className="text-ink-700">No gap is long enough in the bookings ahead.</p> : null}
        <ul className="grid gap-3 md:grid-cols-2">
          {windows.gaps.map((gap) => (
            <li key={gap.startsOn} className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4">
              <p className="font-semibold">{gapText(gap)}</p>
              {windows.dueOn && gap.startsOn > windows.dueOn ? (
                <p className="text-sm text-warn">Past its due date ({formatCalendarDate(windows.dueOn)}): it cannot go out on a job until it is back.</p>
              ) : null}
              {offer ? (
                <Button
                  variant="primary"
                  className="self-start"
                  disabled={!provider.trim() || plan.isPending}
                  busy={plan.isPending && planning === gap.startsOn}
                  onClick={() => {
                    setPlanning(gap.startsOn);
                    plan.mutate({ provider: provider.trim(), assetIds, sentOn: gap.startsOn }, { onSuccess: onPlanned });
                  }}
                >
                  {several ? `Plan this trip for all ${windows.assets.length}` : 'Plan this trip'}
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
        {offer ? (
          <form
            aria-label="Plan for dates of my own"
            className="flex flex-wrap items-end gap-3 rounded-lg border border-paper-line bg-card p-4"
            onSubmit={(e) => {
              e.preventDefault();
              setPlanning('own');
              plan.mutate(
                { provider: provider.trim(), assetIds, sentOn: own.sentOn, ...(own.expectedBackOn ? { expectedBackOn: own.expectedBackOn } : {}) },
                { onSuccess: onPlanned },
              );
            }}
          >
            <h3 className="w-full font-semibold">Or pick your own dates</h3>
            <div className="flex flex-col gap-1">
              <label htmlFor={sentOnId} className="text-sm font-semibold text-ink-800">
                Goes to the lab on
              </label>
              <DateInput id={sentOnId} required value={own.sentOn} onValueChange={(sentOn) => setOwn({ ...own, sentOn })} invalid={!ownSentOk} />
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor={backOnId} className="text-sm font-semibold text-ink-800">
                Expected back (optional)
              </label>
              <DateInput
                id={backOnId}
                min={ownSentOk ? own.sentOn : undefined}
                value={own.expectedBackOn}
                onValueChange={(expectedBackOn) => setOwn({ ...own, expectedBackOn })}
                invalid={!ownBackOk}
              />
            </div>
            <Button
              type="submit"
              disabled={!provider.trim() || !ownSentOk || !own.sentOn || !ownBackOk || plan.isPending}
              busy={plan.isPending && planning === 'own'}
            >
              Plan for these dates
            </Button>
          </form>
        ) : null}
      </section>
    </div>
  );
}
