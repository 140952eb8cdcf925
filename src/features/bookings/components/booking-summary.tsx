import { Form, Formik, type FormikHelpers } from 'formik';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { AssetRowHeader } from '../../../components/asset-row-header';
import { AssetStatusChip } from '../../../components/asset-status';
import { Button } from '../../../components/button';
import { DayRangeFields } from '../../../components/day-range-fields';
import { Dialog } from '../../../components/dialog';
import { Notice } from '../../../components/notice';
import { FactList, Panel } from '../../../components/panel';
import { assetTypeTitles } from '../../../lib/assets';
import { bookingDays } from '../../../lib/bookings';
import { formatDateTime } from '../../../lib/format';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCancelBooking } from '../api/cancel-booking';
import { useMoveBooking } from '../api/move-booking';
import type { BookingView, ChecklistLine } from '../../../../shared/bookings/views';
import { BookingStateChip, conditionWords, dayCount, dayRange, purposeWords } from './booking-words';

/** Dates, job, state and who handed what over. */
/** `rentalLinks`: whether the reader may open rental pages (the billing desk); others see the number only. */
export function BookingFacts({ booking, timeZone, rentalLinks = false }: { booking: BookingView; timeZone?: string; rentalLinks?: boolean }) {
  return (
    <Panel title="Booking">
      <FactList
        items={[
          {
            term: 'State',
            value: (
              <span className="inline-flex flex-wrap items-center gap-2">
                <BookingStateChip state={booking.state} />
                {booking.history ? <span className="rounded border border-dashed border-ink-500 px-1.5 text-sm">History</span> : null}
              </span>
            ),
          },
          { term: 'Dates', value: `${dayRange(booking.startsOn, booking.endsOn)} (${dayCount(booking.startsOn, booking.endsOn)}, both included)` },
          {
            term: 'For',
            value: booking.job ? (
              <span>
                <span className="font-mono font-semibold">{booking.job.reference}</span> {booking.job.customerName}
              </span>
            ) : booking.rental ? (
              <span>
                {rentalLinks ? (
                  <Link to={`/rentals/${booking.rental.id}`} className="font-mono font-semibold text-brass-deep underline">
                    {booking.rental.number}
                  </Link>
                ) : (
                  <span className="font-mono font-semibold">{booking.rental.number}</span>
                )}{' '}
                {booking.rental.customerCompany} (rental)
              </span>
            ) : (
              purposeWords[booking.purpose]
            ),
          },
          {
            term: 'Kit',
            value: booking.kit ? (
              <Link to={`/kits/${booking.kit.id}`} className="text-brass-deep underline">
                {booking.kit.name}
              </Link>
            ) : (
              'Separate items'
            ),
          },
          { term: 'Note', value: booking.note },
          ...(booking.checkedOutAt ? [{ term: 'Checked out', value: `${formatDateTime(booking.checkedOutAt)}, taken by ${booking.takenBy ?? '—'}` }] : []),
          ...(booking.checkoutNote ? [{ term: 'Checkout note', value: booking.checkoutNote }] : []),
          ...(booking.returnedAt
            ? [{ term: 'Returned', value: `${formatDateTime(booking.returnedAt)}, brought back by ${booking.broughtBackBy ?? '—'}` }]
            : []),
        ]}
      />
    </Panel>
  );
}

function lineWords(line: ChecklistLine | undefined): string {
  if (!line) return '—';
  return `${line.present ? 'present' : 'missing'}, ${conditionWords[line.condition].toLowerCase()}${line.note ? ` (${line.note})` : ''}`;
}

/** The packing list: every item with its status now, and what each hand-over recorded. */
export function PackingList({ booking }: { booking: BookingView }) {
  const out = new Map(booking.checkoutChecklist?.map((l) => [l.assetId, l]));
  const back = new Map(booking.returnChecklist?.map((l) => [l.assetId, l]));
  return (
    <Panel title={`Packing list (${booking.items.length})`}>
      <table className="w-full text-left text-sm">
        <thead className="border-b border-paper-line text-ink-700">
          <tr>
            <th scope="col" className="py-1 pr-2 font-semibold">
              Item
            </th>
            <th scope="col" className="py-1 pr-2 font-semibold">
              Type
            </th>
            <th scope="col" className="py-1 pr-2 font-semibold">
              Status now
            </th>
            {booking.checkoutChecklist ? (
              <th scope="col" className="py-1 pr-2 font-semibold">
                At checkout
              </th>
            ) : null}
            {booking.returnChecklist ? (
              <th scope="col" className="py-1 pr-2 font-semibold">
                At return
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-line">
          {booking.items.map((item) => (
            <tr key={item.id}>
              <AssetRowHeader id={item.id} tag={item.assetTag} />
              <td className="py-1.5 pr-2">{assetTypeTitles[item.type]}</td>
              <td className="py-1.5 pr-2">
                <AssetStatusChip status={item.status} />
              </td>
              {booking.checkoutChecklist ? <td className="py-1.5 pr-2">{lineWords(out.get(item.id))}</td> : null}
              {booking.returnChecklist ? <td className="py-1.5 pr-2">{lineWords(back.get(item.id))}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </Panel>
  );
}

interface MoveValues {
  startsOn: string;
  endsOn: string;
}

const moveSchema = Yup.object({
  startsOn: Yup.string().required('Pick the first day.'),
  endsOn: Yup.string()
    .required('Pick the last day.')
    .test('after-start', 'The last day cannot be before the first.', function (value) {
      const { startsOn } = this.parent as MoveValues;
      return !value || !startsOn || value >= startsOn;
    }),
});

/** "Move dates": new dates for a reserved booking; the same rules as booking apply. */
export function MoveDatesButton({ booking }: { booking: BookingView }) {
  const [open, setOpen] = useState(false);
  const move = useMoveBooking();
  const [formError, setFormError] = useState<string>();

  async function submit(values: MoveValues, helpers: FormikHelpers<MoveValues>) {
    setFormError(undefined);
    try {
      await move.mutateAsync({ id: booking.id, ...values });
      setOpen(false);
    } catch (error) {
      setFormError(applyServerErrors(error, helpers, { fields: ['startsOn', 'endsOn'], labels: { startsOn: 'Starts on', endsOn: 'Ends on' } }));
    }
  }

  return (
    <>
      <Button
        onClick={() => {
          setFormError(undefined);
          setOpen(true);
        }}
      >
        Move dates
      </Button>
      <Dialog open={open} onClose={() => setOpen(false)} title="Move dates" description="Every item must be free and in calibration for the new days.">
        <Formik initialValues={{ startsOn: booking.startsOn, endsOn: booking.endsOn }} validationSchema={moveSchema} onSubmit={submit}>
          {({ isSubmitting, values }) => (
            <Form noValidate className="flex flex-col gap-3">
              {formError ? <Notice tone="error">{formError}</Notice> : null}
              <DayRangeFields />
              {values.startsOn && values.endsOn && values.startsOn <= values.endsOn ? (
                <p className="text-sm text-ink-700">{bookingDays(values.startsOn, values.endsOn)} days, both included.</p>
              ) : null}
              <div className="flex gap-2">
                <Button type="submit" variant="primary" busy={isSubmitting}>
                  Save new dates
                </Button>
                <Button variant="quiet" onClick={() => setOpen(false)}>
                  Keep the dates
                </Button>
              </div>
            </Form>
          )}
        </Formik>
      </Dialog>
    </>
  );
}

/** "Cancel booking", after a confirmation. */
export function CancelBookingButton({ booking }: { booking: BookingView }) {
  const [open, setOpen] = useState(false);
  const cancel = useCancelBooking();
  return (
    <>
      <Button
        variant="danger"
        onClick={() => {
          cancel.reset();
          setOpen(true);
        }}
      >
        Cancel booking
      </Button>
      <Dialog
        open={open}
        onClose={() => setOpen(false)}
        title="Cancel this booking?"
        description="The items become free for these days again. The booking stays on record as cancelled."
      >
        {cancel.isError ? (
          <Notice tone="error" className="mb-3">
            {cancel.error.message}
          </Notice>
        ) : null}
        <div className="flex gap-2">
          <Button variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate(booking.id, { onSuccess: () => setOpen(false) })}>
            Yes, cancel it
          </Button>
          <Button variant="quiet" onClick={() => setOpen(false)}>
            Keep it
          </Button>
        </div>
      </Dialog>
    </>
  );
}
