import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CalibrationChip } from '../../../components/asset-status';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { assetTypeTitles } from '../../../lib/assets';
import { formatCalendarDate, formatCount } from '../../../lib/format';
import { useAssets } from '../api/get-assets';

const dueParams = { calibration: ['overdue', 'due_soon'], sort: 'dueOn', limit: 8, offset: 0 } as const;

/** The first few overdue and due-soon recalibrations, soonest first, with the full count; `footer` adds a way on (the owner's review). */
export function RecalibrationsDue({ footer }: { footer?: ReactNode } = {}) {
  const due = useAssets({ ...dueParams, calibration: [...dueParams.calibration] });
  return (
    <section aria-labelledby="recal-due-heading" className="rounded-lg border border-paper-line bg-card p-4 md:col-span-2">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="recal-due-heading" className="text-base font-semibold text-ink-900">
          Recalibrations due
        </h2>
        {due.data ? (
          <span className="text-sm text-ink-700">
            {due.data.total === 0 ? 'none' : `${formatCount(due.data.total)} ${due.data.total === 1 ? 'item' : 'items'}`}
          </span>
        ) : null}
      </div>
      {due.isPending ? <LoadingPanel label="Looking at due dates…" /> : null}
      {due.isError ? <Notice tone="error">{due.error.message}</Notice> : null}
      {due.data && due.data.items.length === 0 ? (
        <p className="text-sm text-ink-700">Nothing is overdue or due soon. Everything in the fleet is in calibration.</p>
      ) : null}
      {due.data && due.data.items.length ? (
        <>
          <ul className="flex flex-col divide-y divide-paper-line">
            {due.data.items.map((asset) => (
              <li key={asset.id}>
                <Link to={`/fleet/${asset.id}`} className="flex min-h-11 items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
                  <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{asset.assetTag}</span>
                  <span className="min-w-0 truncate text-sm text-ink-700">{assetTypeTitles[asset.type]}</span>
                  <span className="ml-auto flex shrink-0 items-center gap-2">
                    <span className="text-sm text-ink-700">{asset.calibration.dueOn ? formatCalendarDate(asset.calibration.dueOn) : 'never calibrated'}</span>
                    <CalibrationChip state={asset.calibration.state} dueOn={asset.calibration.dueOn} />
                  </span>
                </Link>
              </li>
            ))}
          </ul>
          {due.data.total > due.data.items.length ? (
            <Link to="/fleet?calibration=overdue,due_soon" className="mt-2 inline-block text-sm font-semibold text-brass-deep underline">
              See all {formatCount(due.data.total)} overdue and due soon
            </Link>
          ) : null}
        </>
      ) : null}
      {footer ? <div className="mt-2">{footer}</div> : null}
    </section>
  );
}
