import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { formatCalendarDate } from '../../../lib/format';
import { useChecksToDo } from '../api/get-checks-to-do';

/** The technician's home panel: tip positions to validate before the kit may go (or go on) out, and ones whose trend says validate again soon. */
export function ChecksToDo() {
  const todo = useChecksToDo();
  const items = todo.data?.items ?? [];
  return (
    <CountedSection
      id="checks-to-do-heading"
      title="Checks to do"
      count={todo.data ? items.length : undefined}
      empty="Every tip in the kit you carry now and next has a passing validation in each of its positions."
      status={todo.isPending ? <LoadingPanel label="Looking at your tips…" /> : todo.isError ? <Notice tone="error">{todo.error.message}</Notice> : null}
    >
      {items.map((c) => (
        <li key={`${c.assetId}-${c.position}`}>
          <Link
            to={`/checks/new?assetId=${c.assetId}&kind=tip_validation`}
            className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash"
          >
            <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{c.assetTag}</span>
            <span className="text-sm text-ink-700">{c.position} position</span>
            <span className="ml-auto shrink-0">
              {c.reason === 'forecast' ? (
                <StatusChip tone="info" label={c.forecastOn ? `Forecast to fail about ${formatCalendarDate(c.forecastOn)}` : 'Trend past its limit'} />
              ) : c.lastDecision === 'fail' ? (
                <StatusChip tone="bad" label="Failed last time" />
              ) : (
                <StatusChip tone="warn" label="Never validated" />
              )}
            </span>
          </Link>
        </li>
      ))}
    </CountedSection>
  );
}
