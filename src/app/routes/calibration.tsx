import { useState } from 'react';
import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { DownloadIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { Panel } from '../../components/panel';
import { useSession } from '../../features/auth/components/session-context';
import { calibrationReviewCsvUrl, calibrationReviewPdfUrl, useCalibrationReview } from '../../features/calibration/api/get-calibration-review';
import type { DueRow } from '../../../shared/calibration/views';
import { AtLabList } from '../../features/calibration/components/at-lab-list';
import { DueGrid } from '../../features/calibration/components/due-grid';
import { DueSelectionProvider, PlanOneTripBar } from '../../features/calibration/components/due-selection';
import { DueTimeline } from '../../features/calibration/components/due-timeline';
import { ImpactReviewLinks } from '../../features/calibration/components/impact-review-links';
import { TipsForecastToFail } from '../../features/checks/components/drift-forecast';
import { formatCalendarDate } from '../../lib/format';
import { can } from '../../lib/roles';

/** Due rows per kit, then the items in no kit. */
function groupByKit(rows: DueRow[]) {
  const groups = new Map<string, { title: string; rows: DueRow[] }>();
  for (const row of rows) {
    const key = row.kitId ?? '';
    const group = groups.get(key) ?? { title: row.kitName ?? 'Not in a kit', rows: [] };
    group.rows.push(row);
    groups.set(key, group);
  }
  return [...groups.entries()].sort(([a, ga], [b, gb]) => (a === '' ? 1 : b === '' ? -1 : ga.title.localeCompare(gb.title))).map(([key, g]) => ({ key, ...g }));
}

/** The owner's calibration review: what is overdue or due soon, what it threatens, the year ahead, the lab and the impact reviews. */
export default function CalibrationReviewRoute() {
  const { user } = useSession();
  const review = useCalibrationReview();
  const [byKit, setByKit] = useState(false);
  const canPlan = can(user.role, 'calibration.record');

  const header = (
    <PageHeader
      title="Calibration review"
      description="Overdue and due-soon recalibrations with the bookings they threaten, the year ahead, what is at the lab and what was found out of tolerance."
      actions={
        <>
          <a href={calibrationReviewCsvUrl()} className={buttonClasses('secondary', 'md')} download>
            <DownloadIcon size={16} />
            Download CSV
          </a>
          <a href={calibrationReviewPdfUrl()} className={buttonClasses('secondary', 'md')} target="_blank" rel="noopener">
            <DownloadIcon size={16} />
            Download PDF
          </a>
          {canPlan ? (
            <Link to="/calibration/trips" className={buttonClasses('secondary', 'md')}>
              Lab trips
            </Link>
          ) : null}
        </>
      }
    />
  );
  if (review.isPending) {
    return (
      <>
        {header}
        <LoadingPanel label="Reading the calibration calendar…" />
      </>
    );
  }
  if (review.isError) {
    return (
      <>
        {header}
        <Notice tone="error" title="The review could not be loaded">
          {review.error.message}
        </Notice>
      </>
    );
  }
  const r = review.data;
  const all = [...r.overdue, ...r.dueSoon];

  const page = (
    <>
      {header}
      <p className="mb-4 text-sm text-ink-700">
        {r.firm} · today {formatCalendarDate(r.today)} · due soon means due within {r.dueSoonDays} days. An item is valid through its due date.
      </p>
      <div className="mb-4 flex flex-wrap items-center gap-3" role="group" aria-label="Arrange the due items">
        <label className="flex min-h-10 cursor-pointer items-center gap-2 font-semibold">
          <input type="checkbox" checked={byKit} onChange={(e) => setByKit(e.target.checked)} className="size-5 accent-brass-deep" />
          By kit
        </label>
        <span className="text-sm text-ink-700">
          {r.counts.overdue} overdue · {r.counts.dueSoon} due soon
          {r.counts.overdue + r.counts.dueSoon > r.listLimit ? ` · the ${r.listLimit} most urgent are listed; the CSV has them all` : ''}
        </span>
      </div>

      <div className="flex flex-col gap-4">
        {canPlan ? <PlanOneTripBar /> : null}
        {byKit ? (
          <Panel title="By kit">
            {all.length === 0 ? <p className="text-sm text-ink-700">Nothing is overdue or due soon.</p> : null}
            <div className="flex flex-col gap-5">
              {groupByKit(all).map((g) => (
                <section key={g.key} aria-labelledby={`kit-${g.key || 'none'}`}>
                  <h3 id={`kit-${g.key || 'none'}`} className="mb-1 font-semibold">
                    {g.key ? (
                      <Link to={`/kits/${g.key}`} className="underline decoration-brass-deep">
                        {g.title}
                      </Link>
                    ) : (
                      g.title
                    )}{' '}
                    <span className="text-sm font-normal text-ink-700">
                      ({g.rows.filter((x) => x.state === 'overdue').length} overdue, {g.rows.filter((x) => x.state === 'due_soon').length} due soon)
                    </span>
                  </h3>
                  <DueGrid
                    rows={g.rows}
                    label={`Due in ${g.title}`}
                    exportFileName={`due-${g.title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.csv`}
                    canPlan={canPlan}
                    emptyMessage="Nothing due."
                  />
                </section>
              ))}
            </div>
          </Panel>
        ) : (
          <>
            <Panel title="Overdue">
              <DueGrid rows={r.overdue} label="Overdue items" exportFileName="overdue.csv" canPlan={canPlan} emptyMessage="Nothing is overdue." />
            </Panel>
            <Panel title="Due soon">
              <DueGrid
                rows={r.dueSoon}
                label="Items due soon"
                exportFileName="due-soon.csv"
                canPlan={canPlan}
                emptyMessage={`Nothing falls due in the next ${r.dueSoonDays} days.`}
              />
            </Panel>
          </>
        )}

        <Panel title="Due dates in the year ahead">
          <DueTimeline weeks={r.timeline} today={r.today} dueSoonDays={r.dueSoonDays} />
        </Panel>

        <div className="grid items-start gap-4 lg:grid-cols-2">
          <Panel title="At the lab">
            <AtLabList rows={r.atLab} canRecord={canPlan} />
          </Panel>
          <Panel title="Open impact reviews">
            <ImpactReviewLinks reviews={r.impactReviews} />
          </Panel>
        </div>
        <TipsForecastToFail />
      </div>
    </>
  );
  // Items ticked in any of the tables go on one lab trip.
  return canPlan ? <DueSelectionProvider>{page}</DueSelectionProvider> : page;
}
