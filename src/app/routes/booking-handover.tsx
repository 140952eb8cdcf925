import { formatDateRange } from '../../lib/format';
import { useState } from 'react';
import { Link, useLocation, useNavigate, useParams } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useBooking } from '../../features/bookings/api/get-booking';
import type { ReturnView } from '../../../shared/bookings/views';
import { bookingStateWords, bookingTitle } from '../../features/bookings/components/booking-words';
import { HandoverForm, ReturnOutcome, type CounterpartSuggestion } from '../../features/bookings/components/handover-form';
import { PhotoPicker } from '../../features/incidents/components/photo-picker';
import { photoProblem } from '../../features/incidents/components/photo-rules';
import { useSiteJob } from '../../features/site-jobs/api/get-site-job';
import { useStaff } from '../../features/users/api/get-staff';
import { todayIn } from '../../lib/bookings';

/** Checkout (`/bookings/:id/checkout`) and return (`/bookings/:id/return`) against the packing list. */
export default function BookingHandoverRoute() {
  const { id = '' } = useParams();
  const { pathname } = useLocation();
  const mode = pathname.endsWith('/return') ? 'return' : 'checkout';
  const { user, organization } = useSession();
  const staff = useStaff(['technician', 'manager', 'owner']);
  const navigate = useNavigate();
  const booking = useBooking(id);
  const job = useSiteJob(booking.data?.jobId);
  const [returned, setReturned] = useState<ReturnView | null>(null);

  const back = (
    <Link to={`/bookings/${id}`} className="mb-2 inline-flex min-h-9 print:hidden items-center gap-1 text-sm font-semibold text-brass-deep">
      <ArrowLeftIcon size={14} />
      The booking
    </Link>
  );
  if (booking.isPending) return <LoadingPanel label="Loading the packing list…" />;
  if (booking.isError) {
    return (
      <>
        {back}
        <PageHeader title={mode === 'checkout' ? 'Check out' : 'Take back'} />
        <Notice tone="error">{booking.error.message}</Notice>
      </>
    );
  }
  const b = booking.data;
  const title = `${mode === 'checkout' ? 'Check out' : 'Take back'}: ${bookingTitle(b)}`;

  if (returned) {
    return (
      <>
        {back}
        <PageHeader title={`Taken back: ${bookingTitle(b)}`} description={formatDateRange(b.startsOn, b.endsOn)} />
        <ReturnOutcome result={returned} />
        <Link to={`/bookings/${b.id}`} className={`${buttonClasses('secondary')} mt-4`}>
          See the booking
        </Link>
      </>
    );
  }

  const wanted = mode === 'checkout' ? ['reserved', 'not_collected'] : ['out'];
  if (!wanted.includes(b.state)) {
    return (
      <>
        {back}
        <PageHeader title={title} />
        <Notice tone="info">
          {mode === 'checkout' ? 'Only a reserved or not collected booking can be checked out.' : 'Only a booking that is out can be taken back.'} This one is{' '}
          {bookingStateWords[b.state].toLowerCase()}.
        </Notice>
      </>
    );
  }

  const suggestions: CounterpartSuggestion[] = [];
  if (mode === 'return' && b.takenBy) {
    suggestions.push({ label: `${b.takenBy} (took it out)`, name: b.takenBy, userId: b.takenByUserId });
  }
  if (!suggestions.some((s) => s.userId === user.id)) suggestions.push({ label: `Me (${user.name})`, name: user.name, userId: user.id });
  const lead = job.data?.leadTechnicianId;
  const leadName = staff.data?.items.find((p) => p.id === lead)?.name;
  if (lead && !suggestions.some((s) => s.userId === lead)) {
    suggestions.push({
      label: `${leadName ?? 'Lead technician'} (leads ${job.data?.reference})`,
      name: leadName ?? `Lead technician of ${job.data?.reference}`,
      userId: lead,
    });
  }
  // Then the firm's technicians, by name.
  for (const person of staff.data?.items.filter((p) => p.role === 'technician') ?? [])
    if (!suggestions.some((s) => s.userId === person.id)) suggestions.push({ label: person.name, name: person.name, userId: person.id });

  return (
    <>
      {back}
      <PageHeader
        title={title}
        description={`${formatDateRange(b.startsOn, b.endsOn)}${b.kit ? ` · ${b.kit.name}` : ''}. ${mode === 'checkout' ? 'Walk the packing list with the person taking the kit.' : 'Walk the packing list as the kit comes back.'}`}
      />
      <HandoverForm
        booking={b}
        mode={mode}
        suggestions={suggestions}
        today={todayIn(organization.timeZone)}
        photoPicker={({ assetTag, files, onChange }) => (
          <PhotoPicker
            label={`Photos of ${assetTag}`}
            files={files}
            onChange={onChange}
            problems={files.map(photoProblem).filter((p): p is string => p !== null)}
          />
        )}
        onDone={(result) => {
          if (mode === 'return') setReturned(result as ReturnView);
          else navigate(`/bookings/${b.id}`, { state: { notice: `Handed over to ${result.takenBy ?? 'the taker'}.` } });
        }}
      />
    </>
  );
}
