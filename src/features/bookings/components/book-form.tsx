import { formatDateRange } from '../../../lib/format';
import { Form, Formik, useFormikContext, type FormikHelpers } from 'formik';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import type { AssetView } from '../../../../shared/assets/views';
import type { AlternativeItem, BookingView } from '../../../../shared/bookings/views';
import type { BookingPayload } from '../../../../shared/schemas/bookings';
import { BookingRefusalPanel, bookingRefusalFrom, type BookingRefusal } from '../../../components/booking-refusal';
import { Button } from '../../../components/button';
import { DayRangeFields } from '../../../components/day-range-fields';
import { Dialog } from '../../../components/dialog';
import { Field, SelectField } from '../../../components/field';
import { FormSection } from '../../../components/form-section';
import { PlusIcon } from '../../../components/icons';
import { readFromFleet, type ChosenItem, type FleetPages } from '../../../components/item-picker';
import { KitAndItemsFields, swapIn, useKitMembers } from '../../../components/kit-and-items';
import { Notice } from '../../../components/notice';
import { bookingDays } from '../../../lib/bookings';
import { dayRangeRules } from '../../../lib/day-range';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateBooking } from '../api/create-booking';
import { useBookings } from '../api/get-bookings';
import { bookingProblems } from './booking-problems';

export interface BookValues {
  kitId: string;
  items: ChosenItem[];
  startsOn: string;
  endsOn: string;
  jobId: string;
  note: string;
}

export interface JobChoice {
  id: string;
  reference: string;
  customerName: string;
  startsOn: string;
  endsOn: string;
}

const fields = ['kitId', 'items', 'startsOn', 'endsOn', 'jobId', 'note'];
const labels = { startsOn: 'Starts on', endsOn: 'Ends on', items: 'Items', kitId: 'Kit', jobId: 'Job' };
const aliases = { assetIds: 'items' };
const MAX_DAYS = 400;

const schema = Yup.object({
  kitId: Yup.string(),
  items: Yup.array().test('something', 'Choose a kit or add at least one item.', function (value) {
    return (value?.length ?? 0) > 0 || !!(this.parent as BookValues).kitId;
  }),
  ...dayRangeRules({ first: 'Pick the first day.', last: 'Pick the last day.', what: 'A booking' }, MAX_DAYS),
  jobId: Yup.string(),
  note: Yup.string().max(2000, 'Keep the note to 2000 characters.'),
});

export interface BookFormProps {
  kits: { id: string; name: string }[];
  /** The fleet a page at a time (the fleet feature's list): the item search, and the chosen kit's packing list. */
  fleet: FleetPages<AssetView>;
  jobs: JobChoice[];
  initial: Partial<BookValues>;
  /** The inline "New job" form (from the jobs feature); calls `onCreated` with the new job's id. */
  renderNewJob?: (props: { startsOn: string; endsOn: string; onCreated: (jobId: string) => void; onCancel: () => void }) => ReactNode;
  onBooked: (booking: BookingView) => void;
}

export function BookForm({ kits, fleet, jobs, initial, renderNewJob, onBooked }: BookFormProps) {
  const create = useCreateBooking();
  const [formError, setFormError] = useState<string>();
  const [trouble, setTrouble] = useState<BookingRefusal | null>(null);
  const [swapNote, setSwapNote] = useState<string>();

  const initialValues: BookValues = {
    kitId: initial.kitId ?? '',
    items: initial.items ?? [],
    startsOn: initial.startsOn ?? '',
    endsOn: initial.endsOn ?? initial.startsOn ?? '',
    jobId: initial.jobId ?? '',
    note: initial.note ?? '',
  };

  async function submit(values: BookValues, helpers: FormikHelpers<BookValues>) {
    setFormError(undefined);
    setTrouble(null);
    const input: BookingPayload = {
      startsOn: values.startsOn,
      endsOn: values.endsOn,
      ...(values.kitId ? { kitId: values.kitId } : {}),
      ...(values.items.length ? { assetIds: values.items.map((i) => i.id) } : {}),
      ...(values.jobId ? { jobId: values.jobId } : {}),
      ...(values.note.trim() ? { note: values.note.trim() } : {}),
    };
    try {
      onBooked(await create.mutateAsync(input));
    } catch (error) {
      const t = bookingRefusalFrom(error, formatDateRange);
      if (t) setTrouble(t);
      else setFormError(applyServerErrors(error, helpers, { fields, labels, aliases }));
    }
  }

  return (
    <Formik initialValues={initialValues} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <BookFormBody
          kits={kits}
          fleet={fleet}
          jobs={jobs}
          renderNewJob={renderNewJob}
          formError={formError}
          trouble={trouble}
          swapNote={swapNote}
          busy={isSubmitting}
          onSwapped={(note) => {
            setSwapNote(note);
            setTrouble(null);
          }}
        />
      )}
    </Formik>
  );
}

function BookFormBody({
  kits,
  fleet,
  jobs,
  renderNewJob,
  formError,
  trouble,
  swapNote,
  busy,
  onSwapped,
}: Pick<BookFormProps, 'kits' | 'fleet' | 'jobs' | 'renderNewJob'> & {
  formError?: string;
  trouble: BookingRefusal | null;
  swapNote?: string;
  busy: boolean;
  onSwapped: (note: string) => void;
}) {
  const { values, setFieldValue, setValues, submitForm } = useFormikContext<BookValues>();
  const [newJobOpen, setNewJobOpen] = useState(false);
  const { members, error: membersError } = useKitMembers(fleet, values.kitId);
  const items = [...members, ...values.items.filter((i) => !members.some((m) => m.id === i.id))];

  const datesValid = !!values.startsOn && !!values.endsOn && values.startsOn <= values.endsOn;
  const others = useBookings({ from: values.startsOn, to: values.endsOn, state: ['reserved', 'out'] }, { enabled: datesValid });
  const problems = datesValid ? bookingProblems(items.filter(readFromFleet), values.startsOn, values.endsOn, others.data?.items ?? []) : [];

  const jobOptions = [
    { value: '', label: 'No job (the firm’s own use)' },
    ...[...jobs]
      .sort((a, b) => (a.startsOn < b.startsOn ? 1 : -1))
      .map((j) => ({ value: j.id, label: `${j.reference} · ${j.customerName} (${formatDateRange(j.startsOn, j.endsOn)})` })),
  ];

  function swap(troubledId: string, alternative: AlternativeItem) {
    const { items: swapped, from = 'the item' } = swapIn(members, values, troubledId, alternative);
    const kitName = kits.find((k) => k.id === values.kitId)?.name;
    void setValues({ ...values, kitId: '', items: swapped }, true);
    onSwapped(`${alternative.assetTag} replaces ${from}.${kitName ? ` The booking now lists ${kitName}’s items one by one, with the swap.` : ''}`);
    // Try again with the swap.
    setTimeout(() => void submitForm(), 0);
  }

  return (
    <>
      <Form noValidate className="flex flex-col gap-4" aria-label="Book kit">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        {swapNote && !trouble ? <Notice tone="info">{swapNote}</Notice> : null}

        <FormSection legend="What goes">
          <KitAndItemsFields kits={kits} fleet={fleet} members={members} membersError={membersError} kitHint="A kit books every item on its packing list." />
        </FormSection>

        <FormSection legend="When">
          <DayRangeFields />
          <p className="text-sm text-ink-700" aria-live="polite">
            {datesValid
              ? `${bookingDays(values.startsOn, values.endsOn)} ${bookingDays(values.startsOn, values.endsOn) === 1 ? 'day' : 'days'}, ${formatDateRange(values.startsOn, values.endsOn)}, both days included.`
              : 'Whole days; the first and the last day are both included.'}
          </p>
        </FormSection>

        <FormSection legend="For">
          <div className="flex flex-wrap items-end gap-2">
            <SelectField
              name="jobId"
              label="Job"
              options={jobOptions}
              className="min-w-64 flex-1"
              onChange={(e) => {
                const job = jobs.find((j) => j.id === e.target.value);
                void setFieldValue('jobId', e.target.value);
                if (job && !values.startsOn && !values.endsOn) {
                  void setFieldValue('startsOn', job.startsOn);
                  void setFieldValue('endsOn', job.endsOn);
                }
              }}
            />
            {renderNewJob ? (
              <Button icon={<PlusIcon size={16} />} onClick={() => setNewJobOpen(true)}>
                New job
              </Button>
            ) : null}
          </div>
          <Field name="note" label="Note" hint="Anything the person at the counter should know." autoComplete="off" />
        </FormSection>

        {problems.length && !trouble ? (
          <Notice tone="caution" title="This booking would be refused as it stands">
            <ul className="mt-1 list-disc pl-5">
              {problems.map((p) => (
                <li key={p.key}>
                  {p.sentence}{' '}
                  {p.bookingId ? (
                    <Link to={`/bookings/${p.bookingId}`} className="font-semibold text-brass-deep underline">
                      See that booking
                    </Link>
                  ) : null}
                </li>
              ))}
            </ul>
            <p className="mt-1">Remove or swap these items, or change the dates. Pressing Book shows free items of the same type to swap in.</p>
          </Notice>
        ) : null}

        {trouble ? <BookingRefusalPanel refusal={trouble} onSwap={swap} /> : null}

        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="primary" busy={busy}>
            Book
          </Button>
        </div>
      </Form>

      {renderNewJob ? (
        <Dialog open={newJobOpen} onClose={() => setNewJobOpen(false)} title="New job" size="lg">
          {renderNewJob({
            startsOn: values.startsOn,
            endsOn: values.endsOn,
            onCreated: (jobId) => {
              void setFieldValue('jobId', jobId);
              setNewJobOpen(false);
            },
            onCancel: () => setNewJobOpen(false),
          })}
        </Dialog>
      ) : null}
    </>
  );
}
