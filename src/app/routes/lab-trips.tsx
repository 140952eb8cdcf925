import { useState } from 'react';
import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useLabTrips } from '../../features/calibration/api/get-lab-trips';
import type { LabTripState } from '../../../shared/calibration/views';
import { tripStateWords } from '../../features/calibration/components/calibration-words';
import { LabTripCard } from '../../features/calibration/components/lab-trip-card';
import { todayIn } from '../../lib/calibration';
import { can } from '../../lib/roles';

const filters: { value: LabTripState | 'all'; label: string }[] = [
  { value: 'planned', label: tripStateWords.planned },
  { value: 'at_lab', label: tripStateWords.at_lab },
  { value: 'back', label: tripStateWords.back },
  { value: 'all', label: 'All' },
];

/** Every lab trip by state, with "Send to the lab" on planned ones. */
export default function LabTripsRoute() {
  const { user, organization } = useSession();
  const [state, setState] = useState<LabTripState | 'all'>('planned');
  const trips = useLabTrips(state === 'all' ? undefined : state);
  const today = todayIn(organization.timeZone);
  return (
    <>
      <PageHeader
        title="Lab trips"
        description="Trips planned, at the lab and back. Plan a new one from an item's page or the calibration review."
        actions={
          can(user.role, 'reports.read') ? (
            <Link to="/calibration" className="font-semibold text-brass-deep underline">
              Calibration review
            </Link>
          ) : undefined
        }
      />
      <div role="group" aria-label="Show trips" className="mb-4 flex flex-wrap gap-2">
        {filters.map((f) => (
          <button
            key={f.value}
            type="button"
            aria-pressed={state === f.value}
            onClick={() => setState(f.value)}
            className={`min-h-9 rounded-full border px-3 text-sm font-semibold ${state === f.value ? 'border-ink-900 bg-ink-900 text-card' : 'border-paper-line bg-card text-ink-800 hover:bg-paper-deep'}`}
          >
            {f.label}
          </button>
        ))}
      </div>
      {trips.isPending ? <LoadingPanel label="Loading lab trips…" /> : null}
      {trips.isError ? <Notice tone="error">{trips.error.message}</Notice> : null}
      {trips.data && trips.data.items.length === 0 ? <p className="text-ink-700">No lab trips here.</p> : null}
      <div className="grid gap-3 lg:grid-cols-2">
        {trips.data?.items.map((t) => (
          <LabTripCard key={t.id} trip={t} today={today} canSend={can(user.role, 'calibration.record')} headingLevel={2} />
        ))}
      </div>
    </>
  );
}
