import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { CalibrationChip } from '../../components/asset-status';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { FactList, Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { useLabTrips } from '../../features/calibration/api/get-lab-trips';
import { useLabWindows } from '../../features/calibration/api/get-lab-windows';
import type { LabTripView } from '../../../shared/calibration/views';
import { days } from '../../features/calibration/components/calibration-words';
import { LabTripCard } from '../../features/calibration/components/lab-trip-card';
import { LabWindowFinder } from '../../features/calibration/components/lab-window-finder';
import { useAsset } from '../../features/fleet/api/get-asset';
import { isApiError } from '../../lib/api-client';
import { assetTypeTitles } from '../../lib/assets';
import { todayIn } from '../../lib/calibration';
import { formatCalendarDate } from '../../lib/format';
import { can } from '../../lib/roles';

/** The window finder: when can this item go to the lab without breaking a booking? Plan the trip, then send it. */
export default function CalibrationPlanRoute() {
  const { assetId = '' } = useParams();
  const { user, organization } = useSession();
  const asset = useAsset(assetId);
  const windows = useLabWindows(assetId);
  const trips = useLabTrips();
  const [planned, setPlanned] = useState<string | null>(null);
  const canPlan = can(user.role, 'calibration.record');
  const today = todayIn(organization.timeZone);

  if (asset.isPending || windows.isPending) return <LoadingPanel label="Looking for free windows…" />;
  if (asset.isError || windows.isError) {
    const error = asset.error ?? windows.error;
    const notFound = isApiError(error) && error.status === 404;
    return (
      <>
        <PageHeader title={notFound ? 'Asset not found' : 'The windows could not be worked out'} />
        <Notice tone="error">{notFound ? 'No asset in your fleet has this address.' : error?.message}</Notice>
      </>
    );
  }
  const a = asset.data;
  const w = windows.data;
  // This item's trips that are not back yet; the one just planned first.
  const open: LabTripView[] = (trips.data?.items ?? [])
    .filter((t) => t.state !== 'back' && t.items.some((i) => i.assetId === a.id))
    .sort((x, y) => (x.id === planned ? -1 : y.id === planned ? 1 : x.sentOn.localeCompare(y.sentOn)));

  return (
    <>
      <Link to={`/fleet/${a.id}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        {a.assetTag}
      </Link>
      <PageHeader
        title={`Plan a lab trip: ${a.assetTag}`}
        description="When the item can go to the lab without breaking a booking. Planning reserves the window on the booking board."
        actions={
          <Link to="/calibration/trips" className="font-semibold text-brass-deep underline">
            All lab trips
          </Link>
        }
      />
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,22rem)_1fr]">
        <Panel title="The item">
          <FactList
            items={[
              { term: 'Asset', value: `${a.assetTag} · ${assetTypeTitles[a.type]}` },
              { term: 'Calibration', value: <CalibrationChip state={a.calibration.state} dueOn={a.calibration.dueOn} /> },
              { term: 'Due date', value: w.dueOn ? formatCalendarDate(w.dueOn) : 'No calibration on record' },
              { term: 'Lab', value: w.provider ?? 'No lab named on its plan' },
              { term: 'Lab turnaround', value: days(w.turnaroundDays) },
            ]}
          />
        </Panel>
        <div className="flex flex-col gap-4">
          {open.length ? (
            <section aria-labelledby="trips-heading" className="flex flex-col gap-2">
              <h2 id="trips-heading" className="text-lg font-bold">
                {open.some((t) => t.id === planned) ? 'Trip planned' : 'Trips already planned for this item'}
              </h2>
              {open.map((t) => (
                <LabTripCard key={t.id} trip={t} today={today} canSend={canPlan} />
              ))}
            </section>
          ) : null}
          {a.status === 'at_lab' ? (
            <Notice tone="info" title="At the lab now">
              {a.assetTag} is at the lab.{' '}
              <Link to={`/fleet/${a.id}/calibrate`} className="font-semibold underline">
                Record its calibration
              </Link>{' '}
              when the certificate arrives.
            </Notice>
          ) : (
            <LabWindowFinder windows={w} canPlan={canPlan && a.status !== 'retired'} onPlanned={(t) => setPlanned(t.id)} />
          )}
        </div>
      </div>
    </>
  );
}
