import { Link } from 'react-router-dom';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatMoney, useDateFormat } from '../../../lib/format';
import { useRentals } from '../api/get-rentals';
import type { RentalListView, RentalSummary } from '../api/types';
import { DepositStateChip, HoldLapse, lapsesSoon, RentalStateChip } from './billing-words';

const holdNearLapse = (r: RentalSummary) => r.depositState === 'authorized' && lapsesSoon(r.holdCaptureBefore);

/** One home panel: a short list of rentals, each a link to its page. */
function RentalsPanel({ id, title, view, pick, empty, chip }: { id: string; title: string; view: RentalListView; pick: (r: RentalSummary) => boolean; empty: string; chip: (r: RentalSummary) => React.ReactNode }) {
  const rentals = useRentals(view);
  const rows = rentals.data?.items.filter(pick) ?? [];
  return (
    <section aria-labelledby={id} className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id={id} className="text-base font-semibold text-ink-900">
          {title}
        </h2>
        {rentals.data ? <span className="text-sm text-ink-700">{rows.length === 0 ? 'none' : rows.length}</span> : null}
      </div>
      {rentals.isPending ? <LoadingPanel label="Looking for rentals…" /> : null}
      {rentals.isError ? <Notice tone="error">{rentals.error.message}</Notice> : null}
      {rentals.data && rows.length === 0 ? <p className="text-sm text-ink-700">{empty}</p> : null}
      <ul className="flex flex-col divide-y divide-paper-line">
        {rows.slice(0, 8).map((r) => (
          <li key={r.id}>
            <Link to={`/rentals/${r.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
              <span className="font-mono font-semibold text-ink-900">{r.number}</span>
              <span className="min-w-0 truncate text-sm text-ink-700">{r.customerCompany}</span>
              <span className="ml-auto shrink-0">{chip(r)}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** The billing clerk's home: holds near lapse, deposits to settle, rentals to invoice. */
export function BillingDeskPanels() {
  const { dateTime } = useDateFormat();
  return (
    <>
      <RentalsPanel id="lapsing-heading" title="Holds lapsing within two days" view="open" pick={holdNearLapse} empty="No card hold lapses within two days." chip={(r) => <HoldLapse at={r.holdCaptureBefore} dateTime={dateTime} />} />
      <RentalsPanel id="settle-heading" title="Deposits to settle at return" view="to_settle" pick={(r) => r.depositState === 'authorized'} empty="No returned rental is waiting on its deposit." chip={(r) => <DepositStateChip state={r.depositState} />} />
      <RentalsPanel
        id="invoice-heading"
        title="Back and ready to invoice"
        view="to_settle"
        pick={(r) => r.state === 'returned' && r.depositState !== 'authorized'}
        empty="Nothing is waiting for an invoice."
        chip={(r) => (
          <span className="inline-flex items-center gap-2 text-sm">
            {formatMoney(r.totalMinor, r.currency)} <RentalStateChip state={r.state} />
          </span>
        )}
      />
    </>
  );
}
