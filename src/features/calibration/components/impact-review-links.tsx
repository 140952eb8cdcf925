import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { StatusChip } from '../../../components/status-chip';
import { formatCalendarDate, formatCount } from '../../../lib/format';
import { useImpactReviews } from '../api/get-impact-reviews';
import type { ImpactReviewSummary } from '../../../../shared/calibration/views';

/** Open impact reviews as links, with how far each has got. */
export function ImpactReviewLinks({ reviews }: { reviews: (ImpactReviewSummary & { remeasure?: number })[] }) {
  if (!reviews.length) return <p className="text-sm text-ink-700">No impact review is open.</p>;
  return (
    <ul className="flex flex-col divide-y divide-paper-line">
      {reviews.map((r) => (
        <li key={r.id}>
          <Link to={`/calibration/impact/${r.assetId}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-1 py-1.5 hover:bg-brass-wash">
            <span className="font-mono font-semibold text-ink-900">Impact review: {r.assetTag}</span>
            <span className="text-sm text-ink-700">found {formatCalendarDate(r.foundOn)}</span>
            <span className="ml-auto flex flex-wrap gap-1">
              {r.remeasure ? <StatusChip tone="bad" label={`${r.remeasure} to re-measure`} /> : null}
              <StatusChip tone={r.assessed === r.bookings ? 'ok' : 'warn'} label={`${r.assessed} of ${r.bookings} assessed`} />
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

/** The owner's home: how many impact reviews are open, links to each with how many bookings need a re-measure; `children` go below in the same panel. */
export function OpenImpactReviews({ title = 'Open impact reviews', children }: { title?: string; children?: ReactNode }) {
  const open = useImpactReviews('open');
  const count = open.data?.items.length;
  return (
    <section aria-labelledby="open-impact-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="open-impact-heading" className="text-base font-semibold text-ink-900">
          {title}
        </h2>
        {count !== undefined ? <span className="text-sm text-ink-700">{count === 0 ? 'none' : formatCount(count)}</span> : null}
      </div>
      {open.isPending ? <LoadingPanel label="Looking for impact reviews…" /> : null}
      {open.isError ? <Notice tone="error">{open.error.message}</Notice> : null}
      {open.data ? (
        open.data.items.length ? (
          <ImpactReviewLinks
            reviews={open.data.items.map((r) => ({
              id: r.id,
              assetId: r.assetId,
              assetTag: r.asset?.assetTag ?? 'item',
              foundOn: r.foundOn,
              bookings: r.bookings.length,
              assessed: r.assessedCount,
              remeasure: r.remeasureCount,
            }))}
          />
        ) : (
          <p className="text-sm text-ink-700">
            Nothing found out of tolerance is waiting. When a calibration comes back out of tolerance as found, the jobs to re-assess are listed here.
          </p>
        )
      ) : null}
      {children}
    </section>
  );
}
