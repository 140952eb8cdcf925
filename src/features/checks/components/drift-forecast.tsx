import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { formatCalendarDate } from '../../../lib/format';
import { MIN_VALIDATIONS_FOR_FORECAST } from '../../../../shared/checks/drift-forecast';
import type { TipForecastView } from '../../../../shared/checks/views';
import { useForecastsSoon } from '../api/get-forecasts-soon';
import { positionWords, um } from './check-words';

/** The forecast in plain words: "reaches its limit of 54.0 µm about 12 Jan 2027 (between … and …)". */
export function forecastWords({ forecast: f }: TipForecastView): string {
  switch (f.state) {
    case 'not_enough_history':
      return `Not enough history for a forecast: ${f.validations} of the ${MIN_VALIDATIONS_FOR_FORECAST} passing validations it needs since the last failure.`;
    case 'no_drift':
      return `No drift toward its limit of ${um(f.limitUm)}: its trend is flat or falling, or reaches the limit more than five years ahead.`;
    case 'past_limit':
      return `Its trend line is already past its limit of ${um(f.limitUm)}${f.reachedOn ? ` (since about ${formatCalendarDate(f.reachedOn)})` : ''}: validate it again soon.`;
    case 'forecast':
      return `Forecast to reach its limit of ${um(f.limitUm)} about ${formatCalendarDate(f.reachesOn)} (likely between ${formatCalendarDate(f.earliestOn)} and ${
        f.latestOn ? formatCalendarDate(f.latestOn) : 'no later day in sight'
      }).`;
  }
}

/** Under the chart: one line per position; the forecast advises and holds nothing. */
export function TipForecastNotes({ forecasts }: { forecasts: TipForecastView[] }) {
  if (!forecasts.length) return null;
  return (
    <div className="flex flex-col gap-1 text-sm" aria-label="Drift forecast">
      <ul className="flex flex-col gap-1">
        {forecasts.map((f) => (
          <li key={f.position} className="flex flex-wrap items-start gap-2">
            <span className="font-semibold">{positionWords[f.position]}:</span>
            <span className="min-w-0 flex-1">{forecastWords(f)}</span>
            {f.failsSoon ? <StatusChip tone="warn" label="Forecast to fail soon" /> : null}
          </li>
        ))}
      </ul>
      <p className="text-ink-700">
        A straight robust line (Theil–Sen) through the passing validations since the last failure. It advises when to validate again; it never holds or releases
        the tip.
      </p>
    </div>
  );
}

/** Tips forecast to reach their limit within the due-soon window: the owner's review and home. */
export function TipsForecastToFail({ level = 2 }: { level?: 2 | 3 }) {
  const soon = useForecastsSoon();
  const items = soon.data?.items ?? [];
  return (
    <CountedSection
      id={`tips-forecast-heading-${level}`}
      level={level}
      title="Tips forecast to fail soon"
      count={soon.data ? items.length : undefined}
      empty={`No tip is forecast to reach its limit within ${soon.data?.dueSoonDays ?? 30} days.`}
      status={
        soon.isPending ? <LoadingPanel label="Reading the validation trends…" /> : soon.isError ? <Notice tone="error">{soon.error.message}</Notice> : null
      }
    >
      {items.map((f) => (
        <li key={`${f.assetId}-${f.position}`}>
          <Link to={`/fleet/${f.assetId}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-1 py-1.5 hover:bg-brass-wash">
            <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{f.assetTag}</span>
            <span className="text-sm text-ink-700">{positionWords[f.position].toLowerCase()} position</span>
            <span className="ml-auto shrink-0">
              {f.forecast.state === 'forecast' ? (
                <StatusChip tone="warn" label={`Limit about ${formatCalendarDate(f.forecast.reachesOn)}`} />
              ) : (
                <StatusChip tone="bad" label="Trend past its limit" />
              )}
            </span>
          </Link>
        </li>
      ))}
    </CountedSection>
  );
}
