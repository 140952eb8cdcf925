import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatCount, useFirmFormat } from '../../../lib/format';
import { useIncidents } from '../api/get-incidents';
import type { IncidentListParams } from '../api/keys';
import { IncidentStateChip, incidentKindWords } from './incident-words';

/** A short list of incidents (home pages, the asset page), each a link to its page. */
export function IncidentList({
  params,
  empty,
  showAsset = true,
  moreLink,
}: {
  params: IncidentListParams;
  empty: string;
  showAsset?: boolean;
  moreLink?: { to: string; label: (total: number) => string };
}) {
  const incidents = useIncidents(params);
  const { dateTime } = useFirmFormat();
  if (incidents.isPending) return <LoadingPanel label="Loading incidents…" />;
  if (incidents.isError) return <Notice tone="error">{incidents.error.message}</Notice>;
  const { items, total } = incidents.data;
  if (!items.length) return <p className="text-sm text-ink-700">{empty}</p>;
  return (
    <>
      <ul className="flex flex-col divide-y divide-paper-line">
        {items.map((i) => (
          <li key={i.id}>
            <Link to={`/incidents/${i.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-1 py-1.5 hover:bg-brass-wash">
              {showAsset ? <span className="font-mono font-semibold">{i.asset?.assetTag ?? '—'}</span> : null}
              <span className="font-semibold">{incidentKindWords[i.kind]}</span>
              <span className="text-sm text-ink-700">{dateTime(i.occurredAt)}</span>
              <span className="ml-auto flex items-center gap-2">
                {i.photos.length ? (
                  <span className="text-sm text-ink-700">
                    {i.photos.length} photo{i.photos.length === 1 ? '' : 's'}
                  </span>
                ) : null}
                <IncidentStateChip state={i.state} />
              </span>
            </Link>
          </li>
        ))}
      </ul>
      {moreLink && total > items.length ? (
        <Link to={moreLink.to} className="mt-2 inline-block text-sm font-semibold text-brass-deep underline">
          {moreLink.label(total)}
        </Link>
      ) : null}
      {!moreLink && total > items.length ? (
        <p className="mt-2 text-sm text-ink-700">
          Showing {items.length} of {formatCount(total)}.
        </p>
      ) : null}
    </>
  );
}
