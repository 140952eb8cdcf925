import { formatDateRange } from '../../lib/format';
import { Link, useParams } from 'react-router-dom';
import { ArrivalNotice } from '../../components/arrival-notice';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon, PrintIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { FactList, Panel } from '../../components/panel';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useBooking } from '../../features/bookings/api/get-booking';
import { BookingFacts, CancelBookingButton, MoveDatesButton, PackingList } from '../../features/bookings/components/booking-summary';
import { bookingTitle } from '../../features/bookings/components/booking-words';
import { ChangeItemsButton } from '../../features/bookings/components/change-items';
import { assetsQueryOptions } from '../../features/fleet/api/get-assets';
import { useSiteJob } from '../../features/site-jobs/api/get-site-job';
import { can } from '../../lib/roles';

export default function BookingRoute() {
  const { id = '' } = useParams();
  const { user } = useSession();
  const booking = useBooking(id);
  const job = useSiteJob(booking.data?.jobId);

  if (booking.isPending) return <LoadingPanel label="Loading the booking…" />;
  if (booking.isError)
    return (
      <LoadFailure
        error={booking.error}
        thing="booking"
        notFound="No booking of your firm has this address."
        back={{ to: '/board', label: 'Back to the booking board' }}
      />
    );

  const b = booking.data;
  const handOver = can(user.role, 'bookings.hand_over');
  const write = can(user.role, 'bookings.write');
  const actions = [
    (b.state === 'reserved' || b.state === 'not_collected') && handOver ? (
      <Link key="out" to={`/bookings/${b.id}/checkout`} className={buttonClasses('primary')}>
        {b.state === 'not_collected' ? 'Check out late' : 'Check out'}
      </Link>
    ) : null,
    b.state === 'out' && handOver ? (
      <Link key="back" to={`/bookings/${b.id}/return`} className={buttonClasses('primary')}>
        Take back
      </Link>
    ) : null,
    b.state === 'reserved' && write ? <MoveDatesButton key="move" booking={b} /> : null,
    b.state === 'reserved' && write ? <ChangeItemsButton key="items" booking={b} fleet={assetsQueryOptions} /> : null,
    (b.state === 'reserved' || b.state === 'not_collected') && write ? <CancelBookingButton key="cancel" booking={b} /> : null,
    b.purpose !== 'lab' && !b.history ? (
      <a key="sheet" href={`/api/bookings/${b.id}/handover-sheet.pdf`} target="_blank" rel="noreferrer" className={buttonClasses()}>
        <PrintIcon size={16} />
        Hand-over sheet (PDF)
      </a>
    ) : null,
  ].filter(Boolean);

  return (
    <>
      <Link to={`/board?from=${b.startsOn}`} className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        Booking board
      </Link>
      <PageHeader title={bookingTitle(b)} description={formatDateRange(b.startsOn, b.endsOn)} actions={actions.length ? actions : undefined} />
      <ArrivalNotice />
      {b.state === 'not_collected' ? (
        <Notice tone="caution" className="mb-3" title="Not collected">
          This reservation&rsquo;s days passed without checkout, so it no longer holds its items. Cancel it, or check it out late with a note and a new last
          day.
        </Notice>
      ) : null}
      {b.history ? (
        <Notice tone="info" className="mb-3" title="History">
          Past use recorded by the owner; it was never reserved or handed over in Nestkeeper.
        </Notice>
      ) : null}
      <div className="grid gap-4 lg:grid-cols-2">
        <BookingFacts booking={b} rentalLinks={can(user.role, 'reports.read')} />
        {job.data ? (
          <Panel title="Job">
            <FactList
              items={[
                { term: 'Reference', value: job.data.reference, mono: true },
                { term: 'Customer', value: job.data.customerName },
                { term: 'Site', value: job.data.siteAddress },
                { term: 'Contact', value: [job.data.contactName, job.data.contactEmail].filter(Boolean).join(', ') },
                { term: 'On site', value: formatDateRange(job.data.startsOn, job.data.endsOn) },
              ]}
            />
          </Panel>
        ) : null}
        <div className="lg:col-span-2">
          <PackingList booking={b} />
        </div>
      </div>
    </>
  );
}
