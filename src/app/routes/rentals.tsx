import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { PlusIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useRentals } from '../../features/rentals/api/get-rentals';
import type { RentalListView } from '../../features/rentals/api/keys';
import { RentalsGrid } from '../../features/rentals/components/rentals-grid';
import { can } from '../../lib/roles';

const views: { value: RentalListView; label: string; empty: string }[] = [
  { value: 'open', label: 'Open rentals', empty: 'No open rentals: nothing is reserved or out with a renter.' },
  {
    value: 'to_settle',
    label: 'Deposits to settle at return',
    empty: 'Nothing to settle: every returned rental has its deposit settled and its invoice issued.',
  },
  { value: 'all', label: 'All rentals', empty: 'No rentals yet.' },
];

/** The billing desk's rentals: open ones with their deposits' card authorizations, and returns waiting to be settled. */
export default function RentalsRoute() {
  const { user } = useSession();
  const [params, setParams] = useSearchParams();
  const view = views.find((v) => v.value === params.get('view')) ?? views[0];
  const rentals = useRentals(view.value);
  return (
    <>
      <PageHeader
        title="Rentals"
        description="Kit rented to customers: the price, the deposit's card authorization and what is left to settle."
        actions={
          <>
            {can(user.role, 'rentals.write') ? (
              <Link to="/rentals/new" className={buttonClasses('primary')}>
                <PlusIcon size={16} />
                New rental
              </Link>
            ) : null}
            <Link to="/customers" className={buttonClasses('secondary')}>
              Customers and rates
            </Link>
          </>
        }
      />
      <div role="group" aria-label="Rental lists" className="mb-4 flex flex-wrap gap-1 border-b border-paper-line">
        {views.map((v) => (
          <button
            key={v.value}
            type="button"
            aria-pressed={v === view}
            onClick={() => setParams(v.value === 'open' ? {} : { view: v.value }, { replace: true })}
            className={`-mb-px min-h-10 border-b-4 px-3 font-semibold ${v === view ? 'border-brass text-ink-900' : 'border-transparent text-ink-700 hover:bg-paper-deep'}`}
          >
            {v.label}
          </button>
        ))}
      </div>
      {rentals.isError ? <Notice tone="error">{rentals.error.message}</Notice> : null}
      <RentalsGrid
        key={view.value}
        rows={rentals.data?.items}
        label={view.label}
        emptyMessage={view.empty}
        exportFileName={`nestkeeper-rentals-${view.value}.csv`}
      />
      {rentals.data && rentals.data.total > rentals.data.items.length ? (
        <p className="mt-2 text-sm text-ink-700">
          Showing {rentals.data.items.length} of {rentals.data.total}.
        </p>
      ) : null}
    </>
  );
}
