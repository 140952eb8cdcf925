import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatCalendarDate, formatMoney, useDateFormat } from '../../../lib/format';
import { useInvoices } from '../api/get-invoices';
import { useRentals } from '../api/get-rentals';
import type { RentalListView, RentalSummary } from '../api/types';
import { DepositStateChip, HoldLapse, lapsesSoon, RentalStateChip } from './billing-words';

const holdNearLapse = (r: RentalSummary) => r.depositState === 'authorized' && lapsesSoon(r.authorizationCaptureBefore);

/** One home panel: a short list of rentals, each a link to its page. */
function RentalsPanel({ id, title, view, pick, empty, chip }: { id: string; title: string; view: RentalListView; pick: (r: RentalSummary) => boolean; empty: string; chip: (r: RentalSummary) => React.ReactNode }) {
  const rentals = useRentals(view);
  const rows = rentals.data?.items.filter(pick) ?? [];
  return (
    <CountedSection
      id={id}
      title={title}
      count={rentals.data ? rows.length : undefined}
      empty={empty}
      status={rentals.isPending ? <LoadingPanel label="Looking for rentals…" /> : rentals.isError ? <Notice tone="error">{rentals.error.message}</Notice> : null}
    >
      {rows.slice(0, 8).map((r) => (
        <li key={r.id}>
          <Link to={`/rentals/${r.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
            <span className="font-mono font-semibold text-ink-900">{r.number}</span>
            <span className="min-w-0 truncate text-sm text-ink-700">{r.customerCompany}</span>
            <span className="ml-auto shrink-0">{chip(r)}</span>
          </Link>
        </li>
      ))}
    </CountedSection>
  );
}

/** The billing clerk's home: holds near lapse, deposits to settle, rentals to invoice, invoices to chase. */
export function BillingDeskPanels() {
  const { dateTime } = useDateFormat();
  return (
    <>
      <RentalsPanel id="lapsing-heading" title="Holds lapsing within two days" view="open" pick={holdNearLapse} empty="No card hold lapses within two days." chip={(r) => <HoldLapse at={r.authorizationCaptureBefore} dateTime={dateTime} />} />
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
      <UnpaidInvoices />
    </>
  );
}

/** Invoices with money still outstanding, oldest first: what to chase. */
function UnpaidInvoices() {
  const invoices = useInvoices('invoice');
  const rows = (invoices.data?.items ?? []).filter((i) => i.outstandingMinor > 0).sort((a, b) => a.issuedOn.localeCompare(b.issuedOn));
  return (
    <CountedSection
      id="unpaid-heading"
      title="Invoices not yet paid"
      count={invoices.data ? rows.length : undefined}
      empty="Every invoice is paid."
      status={invoices.isPending ? <LoadingPanel label="Looking at invoices…" /> : invoices.isError ? <Notice tone="error">{invoices.error.message}</Notice> : null}
    >
      {rows.slice(0, 8).map((i) => (
        <li key={i.id}>
          <Link to={`/rentals/${i.rentalId}`} className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash">
            <span className="font-mono font-semibold text-ink-900">{i.number}</span>
            <span className="min-w-0 truncate text-sm text-ink-700">{i.customerCompany}</span>
            <span className="ml-auto shrink-0 text-sm">
              {formatMoney(i.outstandingMinor, i.currency)} since {formatCalendarDate(i.issuedOn)}
            </span>
          </Link>
        </li>
      ))}
    </CountedSection>
  );
}
