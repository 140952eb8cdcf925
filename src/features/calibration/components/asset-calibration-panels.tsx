import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { Panel } from '../../../components/panel';
import { StatusChip } from '../../../components/status-chip';
import { formatCalendarDate, formatUm } from '../../../lib/format';
import { useAssetImpact } from '../api/get-asset-impact';
import { useCalibrations } from '../api/get-calibrations';
import { effectiveDueOn, months, ResultChip } from './calibration-words';

const decisionWords = { accepted: 'accepted', declined: 'declined' } as const;

/** The asset page's list of certificates, newest first. */
export function CalibrationHistory({ assetId, className = '' }: { assetId: string; className?: string }) {
  const events = useCalibrations(assetId);
  return (
    <Panel title="Calibration history" className={className}>
      {events.isPending ? <LoadingPanel label="Loading calibrations…" /> : null}
      {events.isError ? <Notice tone="error">{events.error.message}</Notice> : null}
      {events.data && events.data.items.length === 0 ? <p className="text-sm text-ink-700">No calibration certificate is on record.</p> : null}
      {events.data && events.data.items.length ? (
        <ol className="flex flex-col divide-y divide-paper-line" aria-label="Calibrations, newest first">
          {events.data.items.map((e) => (
            <li key={e.id} className="flex flex-col gap-1 py-2">
              <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                <span className="font-semibold">{formatCalendarDate(e.performedOn)}</span>
                <span>{e.provider}</span>
                <span className="font-mono text-sm">{e.certificateNumber}</span>
                <a href={e.certificateUrl} target="_blank" rel="noopener" className="text-sm font-semibold text-brass-deep underline">
                  Certificate PDF
                </a>
              </div>
              <div className="flex flex-wrap items-center gap-2">
                <ResultChip stage="As found" result={e.asFound} />
                <ResultChip stage="As left" result={e.asLeft} />
                {e.asFoundErrorUm !== null ? <span className="font-mono text-sm">as-found error {formatUm(e.asFoundErrorUm)}</span> : null}
              </div>
              <p className="text-sm text-ink-700">
                Interval {months(e.intervalMonths)} · due {formatCalendarDate(effectiveDueOn(e))}
                {e.suggestedChange === 'outside_policy'
                  ? ' · outside the interval policy'
                  : e.suggestedChange !== 'keep'
                    ? ` · suggested ${months(e.suggestedIntervalMonths)}${e.intervalDecision ? `, ${decisionWords[e.intervalDecision]}` : ', not yet decided'}`
                    : ''}
              </p>
              {e.note ? <p className="whitespace-pre-line text-sm">{e.note}</p> : null}
            </li>
          ))}
        </ol>
      ) : null}
    </Panel>
  );
}

/** Shown on the asset page when the item has (or had) an out-of-tolerance impact review. */
export function AssetImpactPanel({ assetId, assetTag, className = '' }: { assetId: string; assetTag: string; className?: string }) {
  const impact = useAssetImpact(assetId);
  if (!impact.data || impact.data.state === 'none') return null;
  const r = impact.data;
  const total = r.bookings.length;
  return (
    <Panel title="Impact review" className={className}>
      <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
        <StatusChip tone={r.state === 'open' ? 'warn' : 'ok'} label={r.state === 'open' ? 'Open' : 'Closed'} />
        <span>
          Found out of tolerance on {formatCalendarDate(r.foundOn)} · {r.assessedCount} of {total} {total === 1 ? 'booking' : 'bookings'} assessed
        </span>
        <Link to={`/calibration/impact/${assetId}`} className="font-semibold text-brass-deep underline">
          {r.state === 'open' ? `Work through the review of ${assetTag}` : 'See the review'}
        </Link>
      </div>
    </Panel>
  );
}
