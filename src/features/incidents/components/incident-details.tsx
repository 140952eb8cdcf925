import { Link } from 'react-router-dom';
import { AssetStatusChip } from '../../../components/asset-status';
import { DownloadIcon } from '../../../components/icons';
import { FactList, Panel } from '../../../components/panel';
import { assetTypeTitles } from '../../../lib/assets';
import { formatFileSize, formatMoney, useFirmFormat } from '../../../lib/format';
import type { IncidentView } from '../../../../shared/incidents/views';
import { IncidentStateChip, incidentKindWords } from './incident-words';

export function IncidentFacts({ incident, currency }: { incident: IncidentView; currency: string }) {
  const { dateTime } = useFirmFormat();
  return (
    <Panel title="Report">
      <FactList
        items={[
          {
            term: 'Item',
            value: incident.asset ? (
              <span className="flex flex-wrap items-center gap-2">
                <Link to={`/fleet/${incident.assetId}`} className="font-mono font-semibold text-brass-deep underline whitespace-nowrap">
                  {incident.asset.assetTag}
                </Link>
                <span>{assetTypeTitles[incident.asset.type]}</span>
                <AssetStatusChip status={incident.asset.status} />
              </span>
            ) : (
              <Link to={`/fleet/${incident.assetId}`}>Open the item</Link>
            ),
          },
          { term: 'What happened', value: incidentKindWords[incident.kind] },
          { term: 'State', value: <IncidentStateChip state={incident.state} /> },
          { term: 'Description', value: <span className="whitespace-pre-wrap">{incident.description}</span> },
          { term: 'When', value: dateTime(incident.occurredAt) },
          { term: 'Where', value: incident.location },
          ...(incident.bookingId
            ? [
                {
                  term: 'Booking',
                  value: (
                    <Link to={`/bookings/${incident.bookingId}`} className="font-semibold text-brass-deep underline">
                      The booking it came back from
                    </Link>
                  ),
                },
              ]
            : []),
          ...(incident.customerName ? [{ term: 'Customer', value: incident.customerName }] : []),
          { term: 'Reported', value: dateTime(incident.createdAt) },
          ...(incident.resolution ? [{ term: 'Resolution', value: <span className="whitespace-pre-wrap">{incident.resolution}</span> }] : []),
          ...(incident.chargeAmountMinor !== null ? [{ term: 'Charge', value: formatMoney(incident.chargeAmountMinor, currency) }] : []),
        ]}
      />
    </Panel>
  );
}

/** The photos as thumbnails; a click opens the full image. A photo without a thumbnail (one that could not be decoded) gets a file link instead. */
export function IncidentPhotos({ incident }: { incident: IncidentView }) {
  return (
    <Panel title="Photos">
      {incident.photos.length === 0 ? <p className="text-sm text-ink-700">No photos were sent with this report.</p> : null}
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        {incident.photos.map((p, i) => (
          <li key={p.id}>
            <a
              href={p.url}
              target="_blank"
              rel="noopener"
              className="flex flex-col gap-1 rounded-md border border-paper-line p-1 hover:border-brass-deep"
              download={p.thumbnailUrl ? undefined : p.fileName}
            >
              {p.thumbnailUrl ? (
                <img
                  src={p.thumbnailUrl}
                  alt={`Photo ${i + 1} of the damage (${p.fileName}), opens full size`}
                  loading="lazy"
                  className="aspect-square w-full rounded object-cover"
                />
              ) : (
                <span className="flex aspect-square w-full flex-col items-center justify-center gap-1 rounded bg-paper-deep text-ink-700">
                  <DownloadIcon size={28} />
                  <span className="text-sm">Download (HEIC)</span>
                </span>
              )}
              <span className="truncate text-xs text-ink-700">
                {p.fileName} · {formatFileSize(p.sizeBytes)}
              </span>
            </a>
          </li>
        ))}
      </ul>
    </Panel>
  );
}
