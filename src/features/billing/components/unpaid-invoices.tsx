import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { formatCalendarDate, formatMoney } from '../../../lib/format';
import { useInvoices } from '../api/get-invoices';

/** Invoices with money still outstanding, oldest first: what to chase. */
export function UnpaidInvoices() {
  const invoices = useInvoices('invoice');
  const rows = (invoices.data?.items ?? []).filter((i) => i.outstandingMinor > 0).sort((a, b) => a.issuedOn.localeCompare(b.issuedOn));
  return (
    <CountedSection
      id="unpaid-heading"
      title="Invoices not yet paid"
      count={invoices.data ? rows.length : undefined}
      empty="Every invoice is paid."
      status={
        invoices.isPending ? <LoadingPanel label="Looking at invoices…" /> : invoices.isError ? <Notice tone="error">{invoices.error.message}</Notice> : null
      }
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
