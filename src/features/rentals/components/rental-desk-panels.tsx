import { Link } from 'react-router-dom';
import { CountedSection } from '../../../components/counted-section';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import type { RentalSummary } from '../../../../shared/billing/views';
import { DepositStateChip, AuthorizationLapse, lapsesSoon } from '../../../components/deposit-state';
import { formatMoney, useFirmFormat } from '../../../lib/format';
import { useRentals } from '../api/get-rentals';
import type { RentalListView } from '../api/keys';
import { RentalStateChip } from './rental-words';

const authorizationNearLapse = (r: RentalSummary) => r.depositState === 'authorized' && lapsesSoon(r.authorizationCaptureBefore);

/** One home panel: a short list of rentals, each a link to its page. */
function RentalsPanel({
  id,
  title,
  view,
  pick,
  empty,
  chip,
}: {
  id: string;
  title: string;
  view: RentalListView;
  pick: (r: RentalSummary) => boolean;
  empty: string;
  chip: (r: RentalSummary) => React.ReactNode;
}) {
  const rentals = useRentals(view);
  const rows = rentals.data?.items.filter(pick) ?? [];
  return (
    <CountedSection
      id={id}
      title={title}
      count={rentals.data ? rows.length : undefined}
      empty={empty}
      status={
        rentals.isPending ? <LoadingPanel label="Looking for rentals…" /> : rentals.isError ? <Notice tone="error">{rentals.error.message}</Notice> : null
      }
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

/** The billing clerk's home, as to rentals: holds near lapse, deposits to settle, rentals to invoice. */
export function RentalDeskPanels() {
  const { dateTime } = useFirmFormat();
  return (
    <>
      <RentalsPanel
        id="lapsing-heading"
        title="Card authorizations lapsing within two days"
        view="open"
        pick={authorizationNearLapse}
        empty="No card authorization lapses within two days."
        chip={(r) => <AuthorizationLapse at={r.authorizationCaptureBefore} dateTime={dateTime} />}
      />
      <RentalsPanel
        id="settle-heading"
        title="Deposits to settle at return"
        view="to_settle"
        pick={(r) => r.depositState === 'authorized'}
        empty="No returned rental is waiting on its deposit."
        chip={(r) => <DepositStateChip state={r.depositState} />}
      />
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
