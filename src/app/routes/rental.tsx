import { Link, useParams } from 'react-router-dom';
import { ArrivalNotice } from '../../components/arrival-notice';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon, DownloadIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { FactList, Panel } from '../../components/panel';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { rentalDocumentUrl, useRental } from '../../features/rentals/api/get-rental';
import { DepositPanel } from '../../features/billing/components/deposit-panel';
import { InvoicePanel } from '../../features/billing/components/invoice-panel';
import { QuoteLines } from '../../features/rentals/components/quote-lines';
import { ChargesEditor } from '../../features/rentals/components/charges-editor';
import { HandoverReadiness } from '../../features/rentals/components/handover-readiness';
import { RenterCautions, RentalItems } from '../../features/rentals/components/rental-items';
import { RentalStateChip } from '../../features/rentals/components/rental-words';
import { formatCalendarDate, useFirmFormat } from '../../lib/format';
import { can } from '../../lib/roles';
import type { RentalView } from '../../../shared/billing/views';

/** The renter has a live link (their acceptance and the provider's event can arrive any moment), or a mail to the customer waits to go. */
const renterAtWork = (r: RentalView) =>
  (r.state === 'reserved' && (r.deposit.request?.state === 'waiting' || r.deposit.request?.state === 'declined' || (!!r.deposit.request && !r.agreement))) ||
  r.moneyMails.some((m) => m.mail === 'waiting');

/** One rental: what went out, its price, the agreement, the deposit's card authorization and the invoice. */
export default function RentalRoute() {
  const { id = '' } = useParams();
  const { user } = useSession();
  const { dateTime } = useFirmFormat();
  const rental = useRental(id, renterAtWork);

  if (rental.isPending) return <LoadingPanel label="Loading the rental…" />;
  if (rental.isError) {
    return (
      <LoadFailure
        error={rental.error}
        thing="rental"
        notFound="No rental of your firm has this address."
        back={{ to: '/rentals', label: 'Back to rentals' }}
      />
    );
  }

  const r = rental.data;
  const canCharge = can(user.role, 'rentals.write');
  const charges = <ChargesEditor rental={r} canCharge={canCharge} />;
  const pdf = (document: 'agreement' | 'certificate-pack', label: string) => (
    <a key={document} href={rentalDocumentUrl(r.id, document)} target="_blank" rel="noopener" className={buttonClasses('secondary', 'sm')}>
      <DownloadIcon size={14} />
      {label}
    </a>
  );

  return (
    <>
      <Link to="/rentals" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        Rentals
      </Link>
      <PageHeader
        title={`Rental ${r.number}`}
        description={`${r.customer.company}, ${formatCalendarDate(r.startsOn)} – ${formatCalendarDate(r.endsOn)}`}
        actions={[pdf('agreement', 'Rental agreement (PDF)'), pdf('certificate-pack', 'Certificate pack (PDF)')]}
      />
      {/* "Rental … is reserved" holds only while it is: the words came with the navigation and outlive a reload. */}
      {r.state === 'reserved' ? <ArrivalNotice /> : null}
      <div className="grid gap-4 lg:grid-cols-2">
        <Panel title="Rental">
          <FactList
            items={[
              { term: 'Number', value: r.number, mono: true },
              { term: 'State', value: <RentalStateChip state={r.state} /> },
              { term: 'Customer', value: `${r.customer.company}${r.customer.billingContact ? `, ${r.customer.billingContact}` : ''}` },
              { term: 'Invoices to', value: r.customer.billingEmail, mono: true },
              {
                term: 'Dates',
                value: `${formatCalendarDate(r.startsOn)} – ${formatCalendarDate(r.endsOn)} (${r.quote.days} ${r.quote.days === 1 ? 'day' : 'days'}, both included)`,
              },
              {
                term: 'Kit',
                value: r.kit ? (
                  <Link to={`/kits/${r.kit.id}`} className="text-brass-deep underline">
                    {r.kit.name}
                  </Link>
                ) : (
                  'Separate items'
                ),
              },
              {
                term: 'Booking',
                value: (
                  <Link to={`/bookings/${r.bookingId}`} className="text-brass-deep underline">
                    Packing list and hand-over
                  </Link>
                ),
              },
              { term: 'Checked out', value: r.checkedOutAt ? dateTime(r.checkedOutAt) : null },
              { term: 'Returned', value: r.returnedAt ? dateTime(r.returnedAt) : null },
              { term: 'Note', value: r.note },
            ]}
          />
        </Panel>
        <Panel title="Price">
          <QuoteLines quote={r.quote} />
        </Panel>
        <div className="flex flex-col gap-3 lg:col-span-2">
          {r.state === 'reserved' || r.state === 'out' ? <RenterCautions items={r.items} /> : null}
          <RentalItems items={r.items} />
        </div>
        {r.state === 'reserved' || r.agreement || r.handoverOverride ? <HandoverReadiness rental={r} canOverride={can(user.role, 'settings.manage')} /> : null}
        <DepositPanel rental={r} canManage={can(user.role, 'deposits.manage')} charges={charges} />
        <InvoicePanel rental={r} canCharge={canCharge} charges={charges} />
      </div>
    </>
  );
}
