import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { FactList, Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { useLabTrips } from '../../features/calibration/api/get-lab-trips';
import { useTripWindows } from '../../features/calibration/api/get-trip-windows';
import { days } from '../../features/calibration/components/calibration-words';
import { LabTripCard } from '../../features/calibration/components/lab-trip-card';
import { LabWindowFinder } from '../../features/calibration/components/lab-window-finder';
import { isApiError } from '../../lib/api-client';
import { todayIn } from '../../lib/calibration';
import { formatCalendarDate } from '../../lib/format';
import { can } from '../../lib/roles';

/** Several items chosen in the calibration review, one lab trip: one window free for all of them, one lab booking holding them all. */
export default function CalibrationTripRoute() {
  const [params] = useSearchParams();
  const ids = (params.get('assets') ?? '').split(',').filter(Boolean);
  const { user, organization } = useSession();
  const windows = useTripWindows(ids);
  const trips = useLabTrips();
  const [planned, setPlanned] = useState<string | null>(null);
  const canPlan = can(user.role, 'calibration.record');
  const back = (
    <Link to="/calibration" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
      <ArrowLeftIcon size={14} />
      Calibration review
    </Link>
  );

  if (!ids.length)
    return (
      <>
        {back}
        <PageHeader title="Plan one lab trip" />
        <Notice tone="info">Tick the items in the calibration review that should go to the lab together, then choose “Plan one trip”.</Notice>
      </>
    );
  if (windows.isPending) return <LoadingPanel label="Looking for a window free for every item…" />;
  if (windows.isError) {
    const notFound = isApiError(windows.error) && windows.error.status === 404;
    return (
      <>
        {back}
        <PageHeader title="The windows could not be worked out" />
        <Notice tone="error">{notFound ? 'One of these items is not in your fleet.' : windows.error.message}</Notice>
      </>
    );
  }
  const w = windows.data;
  const trip = (trips.data?.items ?? []).find((t) => t.id === planned);
  const without = (id: string) => `/calibration/plan?assets=${ids.filter((x) => x !== id).join(',')}`;

  return (
    <>
      {back}
      <PageHeader
        title={`Plan one lab trip: ${w.assets.length === 1 ? '1 item' : `${w.assets.length} items`}`}
        description="One window when none of the items is booked, long enough for the lab. Planning reserves it on the booking board for all of them."
        actions={
          <Link to="/calibration/trips" className="font-semibold text-brass-deep underline">
            All lab trips
          </Link>
        }
      />
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,22rem)_1fr]">
        <Panel title="The items">
          <ul className="mb-3 flex flex-col gap-1" aria-label="Items on this trip">
            {w.assets.map((a) => (
              <li key={a.id} className="flex min-h-9 items-center justify-between gap-2">
                <Link to={`/fleet/${a.id}`} className="font-mono font-semibold underline decoration-brass-deep whitespace-nowrap">
                  {a.assetTag}
                </Link>
                {w.assets.length > 1 && !trip ? (
                  <Link to={without(a.id)} className="text-sm font-semibold text-brass-deep underline" aria-label={`Take ${a.assetTag} off this trip`}>
                    Take off
                  </Link>
                ) : null}
              </li>
            ))}
          </ul>
          <FactList
            items={[
              { term: 'Earliest due date', value: w.dueOn ? formatCalendarDate(w.dueOn) : 'No calibration on record' },
              { term: 'Lab', value: w.provider ?? 'Name it below' },
              { term: 'Lab turnaround', value: days(w.turnaroundDays) },
            ]}
          />
        </Panel>
        <div className="flex flex-col gap-4">
          {trip ? (
            <section aria-labelledby="trip-heading" className="flex flex-col gap-2">
              <h2 id="trip-heading" className="text-lg font-bold">
                Trip planned
              </h2>
              <LabTripCard trip={trip} today={todayIn(organization.timeZone)} canSend={canPlan} />
            </section>
          ) : null}
          <LabWindowFinder windows={w} canPlan={canPlan} onPlanned={(t) => setPlanned(t.id)} />
        </div>
      </div>
    </>
  );
}
