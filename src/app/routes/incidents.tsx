import { useSearchParams } from 'react-router-dom';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useIncidents } from '../../features/incidents/api/get-incidents';
import type { IncidentState } from '../../../shared/incidents/vocabulary';
import { IncidentsGrid } from '../../features/incidents/components/incidents-grid';
import { incidentStateChoices, incidentStateWords } from '../../features/incidents/components/incident-words';

const filters: { value: string; label: string; states?: IncidentState[] }[] = [
  { value: 'open', label: 'Open (reported or under review)', states: ['reported', 'reviewing'] },
  ...incidentStateChoices.map((s) => ({ value: s, label: incidentStateWords[s], states: [s] })),
  { value: 'all', label: 'All' },
];

/** Every damage and loss report; the state filter lives in the address (?state=open). */
export default function IncidentsRoute() {
  const [params, setParams] = useSearchParams();
  const chosen = filters.find((f) => f.value === params.get('state')) ?? filters[0];
  const incidents = useIncidents({ state: chosen.states, limit: 500, offset: 0 });
  return (
    <>
      <PageHeader title="Incidents" description="Damage and loss reports. Each one holds its item until the item is released on evidence." />
      <div className="mb-3 flex flex-col gap-1 sm:max-w-xs">
        <label htmlFor="incident-state-filter" className="text-sm font-semibold text-ink-800">
          Show
        </label>
        <select
          id="incident-state-filter"
          value={chosen.value}
          onChange={(e) => setParams(e.target.value === 'open' ? {} : { state: e.target.value }, { replace: true })}
          className="min-h-10 rounded-md border border-paper-line bg-card px-3"
        >
          {filters.map((f) => (
            <option key={f.value} value={f.value}>
              {f.label}
            </option>
          ))}
        </select>
      </div>
      {incidents.isError ? <Notice tone="error">{incidents.error.message}</Notice> : null}
      <IncidentsGrid rows={incidents.data?.items} loading={incidents.isFetching && !incidents.data} />
      {incidents.data && incidents.data.total > incidents.data.items.length ? (
        <p className="mt-2 text-sm text-ink-700">
          Showing the latest {incidents.data.items.length} of {incidents.data.total}.
        </p>
      ) : null}
    </>
  );
}
