import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { Panel } from '../../../components/panel';
import type { AssetView } from '../../../../shared/assets/views';
import { formatCount, useFirmFormat } from '../../../lib/format';
import { useChecks } from '../api/get-checks';
import { useTipValidation } from '../api/get-tip-validation';
import { useTipForecast } from '../api/get-tip-forecast';
import { TipForecastNotes } from './drift-forecast';
import type { CheckView } from '../../../../shared/checks/views';
import { checkKindWords, positionWords, um } from './check-words';
import { DecisionMark } from './decision-mark';
import { TipValidationStates } from './tip-validation-states';
import { ValidationHistoryChart } from './validation-history-chart';

export const judgedUm = (c: CheckView) => (c.kind === 'tip_validation' ? c.result.maxDeviationUm : c.result.errorUm);

/** The asset page's field checks: state per position and trend for tips, then every check, newest first. */
export function AssetChecks({ asset, className = '' }: { asset: AssetView; className?: string }) {
  const { dateTime } = useFirmFormat();
  const isTip = asset.type === 'tip';
  const checks = useChecks({ assetId: asset.id, limit: 100, offset: 0 });
  const tipStatus = useTipValidation(asset.id, { enabled: isTip });
  const forecast = useTipForecast(asset.id, { enabled: isTip });
  const tipChecks = (checks.data?.items ?? []).filter((c): c is Extract<CheckView, { kind: 'tip_validation' }> => c.kind === 'tip_validation');

  return (
    <Panel title="Field checks" className={className}>
      {isTip ? (
        <div className="mb-4 flex flex-col gap-3">
          <h3 className="font-semibold">Validation by position</h3>
          {tipStatus.data ? <TipValidationStates status={tipStatus.data} dateTime={(v) => dateTime(v)} /> : null}
          {tipStatus.isError ? <Notice tone="error">{tipStatus.error.message}</Notice> : null}
          <h3 className="font-semibold">Largest deviation over time</h3>
          {checks.data ? <ValidationHistoryChart checks={tipChecks} forecasts={forecast.data?.items} /> : null}
          {forecast.data ? <TipForecastNotes forecasts={forecast.data.items} /> : null}
          {forecast.isError ? <Notice tone="error">{forecast.error.message}</Notice> : null}
        </div>
      ) : null}
      {checks.isPending ? <LoadingPanel label="Loading checks…" /> : null}
      {checks.isError ? <Notice tone="error">{checks.error.message}</Notice> : null}
      {checks.data && checks.data.items.length === 0 ? (
        <p className="text-sm text-ink-700">
          {isTip || asset.type === 'tracker'
            ? 'No field checks recorded yet.'
            : 'Field checks are recorded for probe tips and laser trackers; this item is kept in check by calibration.'}
        </p>
      ) : null}
      {checks.data && checks.data.items.length ? (
        <>
          <ul className="flex flex-col divide-y divide-paper-line" aria-label="Recorded checks">
            {checks.data.items.map((c) => (
              <li key={c.id}>
                <Link to={`/checks/${c.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-1 py-1.5 hover:bg-brass-wash">
                  <span className="font-semibold">
                    {checkKindWords[c.kind]}
                    {c.kind === 'tip_validation' ? ` · ${positionWords[c.position]}` : ''}
                  </span>
                  <span className="text-sm text-ink-700">{dateTime(c.performedAt)}</span>
                  <span className="ml-auto flex items-center gap-2">
                    <span className="font-mono text-sm">
                      {um(judgedUm(c))} / {um(c.result.toleranceUm)}
                    </span>
                    <DecisionMark decision={c.result.decision} />
                  </span>
                </Link>
              </li>
            ))}
          </ul>
          {checks.data.total > checks.data.items.length ? (
            <p className="mt-2 text-sm text-ink-700">
              Showing the latest {checks.data.items.length} of {formatCount(checks.data.total)}.
            </p>
          ) : null}
        </>
      ) : null}
    </Panel>
  );
}
