import { useEffect, useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { Panel } from '../../../components/panel';
import { StatusChip } from '../../../components/status-chip';
import { formatCalendarDate, formatDateRange, formatDateTime, formatUm } from '../../../lib/format';
import { useAssessImpactBooking } from '../api/assess-impact-booking';
import { useCloseImpactReview } from '../api/close-impact-review';
import type { ImpactAssessment, ImpactBookingView, ImpactReviewView } from '../../../../shared/calibration/views';
import { assessmentForSuggestion, allowanceWords, type TriageFacts } from '../../../../shared/calibration/triage';
import { useAcceptImpactSuggestions } from '../api/accept-impact-suggestions';
import { assessmentChoices, assessmentWords, noticeGroupWords, SuggestionChip } from './calibration-words';
import { ImpactNoticesPanel } from './impact-notices-panel';

/** "Every job that used TRK-001 between its last passing evidence on … and the finding on …" */
export function impactScope(review: ImpactReviewView, tag: string): string {
  const found = formatCalendarDate(review.foundOn);
  const how = review.trigger === 'calibration' ? 'the lab found it out of tolerance as found' : 'a field check failed';
  return review.since
    ? `Every job that used ${tag} between its last passing evidence on ${formatCalendarDate(review.since)} and the finding on ${found} (${how}) is listed below.`
    : `Every job that used ${tag} up to the finding on ${found} (${how}) is listed below: no earlier passing evidence is on record.`;
}

/** The suggestion and its numbers; once assessed, the triage kept with the assessment. */
function Triage({ booking }: { booking: ImpactBookingView }) {
  const shown: TriageFacts = booking.triage ?? booking.suggestion;
  const followed = booking.assessment && booking.triage ? assessmentForSuggestion[booking.triage.suggestion] === booking.assessment : null;
  return (
    <div className="flex flex-col gap-1 text-sm">
      <p className="flex flex-wrap items-center gap-2">
        <SuggestionChip suggestion={shown.suggestion} prefix={booking.triage ? 'Suggested then' : 'Suggested'} />
        {followed === false ? <span className="text-ink-700">changed by a person</span> : null}
      </p>
      <p className="text-ink-700">
        {shown.toleranceNote ? <span className="font-semibold text-ink-900">{shown.toleranceNote}. </span> : null}
        {shown.reason}
      </p>
    </div>
  );
}

function BookingAssessment({ review, booking, canAssess }: { review: ImpactReviewView; booking: ImpactBookingView; canAssess: boolean }) {
  const assess = useAssessImpactBooking();
  const selectId = useId();
  const noteId = useId();
  const [note, setNote] = useState(booking.note ?? '');
  useEffect(() => setNote(booking.note ?? ''), [booking.note]);
  const ref = booking.jobReference ?? formatDateRange(booking.startsOn, booking.endsOn);
  const save = (assessment: ImpactAssessment, nextNote: string) =>
    assess.mutate({ reviewId: review.id, bookingId: booking.bookingId, assessment, note: nextNote.trim() || undefined });
  const editable = canAssess && review.state === 'open';

  return (
    <li className="grid gap-3 rounded-lg border border-paper-line bg-card p-3 md:grid-cols-[minmax(0,1fr)_minmax(0,16rem)_minmax(0,18rem)]">
      <div className="min-w-0">
        <p className="flex flex-wrap items-center gap-2">
          <Link to={`/bookings/${booking.bookingId}`} className="font-mono font-semibold text-brass-deep underline">
            {booking.jobReference ?? 'Booking'}
          </Link>
          {booking.assessment ? <StatusChip tone="ok" label="Assessed" /> : <StatusChip tone="warn" label="To assess" />}
        </p>
        <p>{booking.customerName ?? (booking.rentalId ? 'Rental customer' : 'In-house')}</p>
        <p className="text-sm text-ink-700">{formatDateRange(booking.startsOn, booking.endsOn)}</p>
        <Triage booking={booking} />
        <p className="text-sm text-ink-700">
          {booking.contactEmail ? `Contact: ${booking.contactEmail}` : 'No contact e-mail on the job: tell the customer another way.'}
          {booking.noticeSentAt
            ? ` · Notice sent ${formatDateTime(booking.noticeSentAt)}`
            : booking.noticeQueuedAt
              ? ` · Notice queued ${formatDateTime(booking.noticeQueuedAt)}, waiting to send`
              : ''}
        </p>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={selectId} className="text-sm font-semibold text-ink-800">
          Assessment: {ref}
        </label>
        <select
          id={selectId}
          value={booking.assessment ?? ''}
          disabled={!editable || assess.isPending}
          onChange={(e) => e.target.value && save(e.target.value as ImpactAssessment, note)}
          className="min-h-10 rounded-md border border-paper-line bg-card px-3 text-base"
        >
          <option value="" disabled>
            Not assessed yet
          </option>
          {assessmentChoices.map((a) => (
            <option key={a} value={a}>
              {assessmentWords[a]}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={noteId} className="text-sm font-semibold text-ink-800">
          Note: {ref}
        </label>
        <textarea
          id={noteId}
          rows={2}
          value={note}
          maxLength={2000}
          disabled={!editable}
          onChange={(e) => setNote(e.target.value)}
          onBlur={() => booking.assessment && note.trim() !== (booking.note ?? '') && save(booking.assessment, note)}
          className="rounded-md border border-paper-line bg-card px-3 py-1 text-base"
        />
        {editable && !booking.assessment ? <p className="text-sm text-ink-500">Saved with the assessment.</p> : null}
        {assess.isError ? <p className="text-sm text-bad">{assess.error.message}</p> : null}
      </div>
    </li>
  );
}

/** What the triage weighs and by which rule, so the owner (and later an auditor) reads why each suggestion was made. */
function TriageRule({ review }: { review: ImpactReviewView }) {
  const { errorUm, source } = review.asFound;
  const from = source === 'certificate' ? "the certificate's as-found value" : "the failing check's result";
  return (
    <div className="mb-3 rounded-md border border-paper-line bg-paper p-3 text-sm">
      <p>
        <span className="font-semibold">As-found error: </span>
        {errorUm === null ? `not recorded (${from} is missing), so no booking can be judged from the records.` : `${formatUm(errorUm)}, from ${from}.`}
      </p>
      <p>
        <span className="font-semibold">Rule: </span>
        an error within {allowanceWords(review.triageRatio)} of a job&apos;s tightest tolerance (a {review.triageRatio}:1 ratio, set in Settings) suggests no
        effect; more suggests a re-measure; without a tolerance or an as-found value we cannot judge. Both figures are taken to 0.1 µm, half to even. The
        suggestion advises: you decide each booking.
      </p>
      {review.remeasureCount > 0 ? (
        <p className="mt-1 font-semibold">
          {review.remeasureCount} {review.remeasureCount === 1 ? 'booking needs' : 'bookings need'} a re-measure.
        </p>
      ) : null}
    </div>
  );
}

/** Work through an impact review: assess each booking, draft and send the customer notices, close. */
export function ImpactReviewWorkspace({ review, tag, canAssess }: { review: ImpactReviewView; tag: string; canAssess: boolean }) {
  const close = useCloseImpactReview();
  const accept = useAcceptImpactSuggestions();
  const unassessed = review.bookings.filter((b) => !b.assessment).length;
  const total = review.bookings.length;
  const done = review.assessedCount;
  const open = review.state === 'open';

  return (
    <div className="flex flex-col gap-4">
      <Panel title="Bookings to assess" actions={<StatusChip tone={done === total ? 'ok' : 'warn'} label={`${done} of ${total} assessed`} />}>
        <div
          className="mb-3 h-2 w-full max-w-md overflow-hidden rounded-full border border-ink-300 bg-card"
          role="progressbar"
          aria-label="Assessed"
          aria-valuemin={0}
          aria-valuemax={total}
          aria-valuenow={done}
        >
          <div className="h-full bg-ok" style={{ width: `${total ? (done / total) * 100 : 100}%` }} />
        </div>
        <TriageRule review={review} />
        {canAssess && open && unassessed > 0 ? (
          <div className="mb-3 flex flex-wrap items-center gap-3">
            <Button variant="primary" busy={accept.isPending} onClick={() => accept.mutate(review.id)}>
              Accept the suggested triage
            </Button>
            <span className="text-sm text-ink-700">
              For the {unassessed} {unassessed === 1 ? 'booking' : 'bookings'} not yet assessed. You can change any of them afterwards.
            </span>
            {accept.isError ? (
              <Notice tone="error" className="w-full">
                {accept.error.message}
              </Notice>
            ) : null}
          </div>
        ) : null}
        {total === 0 ? <p className="text-ink-700">No job or rental used it in that time: nothing to assess.</p> : null}
        <ul className="flex flex-col gap-2">
          {review.bookings.map((b) => (
            <BookingAssessment key={b.bookingId} review={review} booking={b} canAssess={canAssess} />
          ))}
        </ul>
      </Panel>

      {canAssess ? <ImpactNoticesPanel review={review} /> : null}

      {canAssess && open ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="primary" disabled={done < total} busy={close.isPending} onClick={() => close.mutate(review.id)}>
            Close review
          </Button>
          <span className="text-sm text-ink-700">
            {done < total ? `Assess the ${total - done} remaining ${total - done === 1 ? 'booking' : 'bookings'} first.` : 'Every booking is assessed.'}
          </span>
          {close.isError ? (
            <Notice tone="error" className="w-full">
              {close.error.message}
            </Notice>
          ) : null}
        </div>
      ) : null}
      {!open ? (
        <Notice tone="success" title="Review closed">
          Every booking that used {tag} in that time has been assessed.
        </Notice>
      ) : null}
    </div>
  );
}
