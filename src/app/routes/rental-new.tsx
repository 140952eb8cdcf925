import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { assetsQueryOptions } from '../../features/fleet/api/get-assets';
import { useKits } from '../../features/kits/api/get-kits';
import { RentalForm } from '../../features/rentals/components/rental-form';

const isDate = (s: string | null) => (s && /^\d{4}-\d{2}-\d{2}$/.test(s) ? s : undefined);

/** "New rental": a customer, a kit or items, whole days; the live price; then the rental's own page. */
export default function RentalNewRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const kits = useKits();
  const initial = {
    customerId: params.get('customerId') ?? undefined,
    kitId: params.get('kitId') ?? undefined,
    startsOn: isDate(params.get('startsOn')),
    endsOn: isDate(params.get('endsOn')),
  };
  return (
    <>
      <Link to="/rentals" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        Rentals
      </Link>
      <PageHeader
        title="New rental"
        description="Rent a kit or separate items to a customer for whole days. The price follows as you choose; creating the rental reserves the kit."
      />
      {kits.isError ? <Notice tone="error">{kits.error.message}</Notice> : null}
      {kits.isPending ? (
        <LoadingPanel label="Loading kits…" />
      ) : kits.data ? (
        <div className="max-w-3xl">
          <RentalForm
            kits={kits.data.items}
            fleet={assetsQueryOptions}
            initial={initial}
            onCreated={(rental) =>
              navigate(`/rentals/${rental.id}`, {
                state: { notice: `Rental ${rental.number} for ${rental.customer.company} is reserved. Take the deposit when the kit is handed over.` },
              })
            }
          />
        </div>
      ) : null}
    </>
  );
}
