import { Form, Formik, useFormikContext, type FormikHelpers } from 'formik';
import { useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { BookingRefusalPanel, bookingRefusalFrom, type Alternative, type BookingRefusal } from '../../../components/booking-refusal';
import { Button } from '../../../components/button';
import { DayRangeFields } from '../../../components/day-range-fields';
import { Dialog } from '../../../components/dialog';
import { Field, SelectField } from '../../../components/field';
import { FormSection } from '../../../components/form-section';
import { PlusIcon } from '../../../components/icons';
import { ItemMatches } from '../../../components/item-matches';
import { Notice } from '../../../components/notice';
import { PackingListLine } from '../../../components/packing-list-line';
import { RemovableTags } from '../../../components/removable-tags';
import { SearchBox } from '../../../components/search-box';
import type { AssetView } from '../../../lib/assets';
import { assetTypeTitles } from '../../../lib/assets';
import { bookingDays } from '../../../lib/bookings';
import { dayRangeRules } from '../../../lib/day-range';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateBooking } from '../api/create-booking';
import { useBookings } from '../api/get-bookings';
import type { BookingView } from '../../../../shared/bookings/views';
import type { BookingPayload } from '../../../../shared/schemas/bookings';
import { bookingProblems } from './booking-problems';
import { dayRange } from './booking-words';

export interface BookValues {
  kitId: string;
  assetIds: string[];
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

const fields = ['kitId', 'assetIds', 'startsOn', 'endsOn', 'jobId', 'note'];
const labels = { startsOn: 'Starts on', endsOn: 'Ends on', assetIds: 'Items', kitId: 'Kit', jobId: 'Job' };
const MAX_DAYS = 400;

const schema = Yup.object({
  kitId: Yup.string(),
  assetIds: Yup.array(Yup.string().required()).test('something', 'Choose a kit or add at least one item.', function (value) {
    return (value?.length ?? 0) > 0 || !!(this.parent as BookValues).kitId;
  }),
  ...dayRangeRules({ first: 'Pick the first day.', last: 'Pick the last day.', what: 'A booking' }, MAX_DAYS),
  jobId: Yup.string(),
  note: Yup.string().max(2000, 'Keep the note to 2000 characters.'),
});

export interface BookFormProps {
  kits: { id: string; name: string }[];
  /** Every asset of the firm (retired ones too: a kit books all its members). */
  assets: AssetView[];
  jobs: JobChoice[];
  initial: Partial<BookValues>;
  /** The inline "New job" form (from the jobs feature); calls `onCreated` with the new job's id. */
  renderNewJob?: (props: { startsOn: string; endsOn: string; onCreated: (jobId: string) => void; onCancel: () => void }) => ReactNode;
  onBooked: (booking: BookingView) => void;
}

export function BookForm({ kits, assets, jobs, initial, renderNewJob, onBooked }: BookFormProps) {
  const create = useCreateBooking();
  const [formError, setFormError] = useState<string>();
  const [trouble, setTrouble] = useState<BookingRefusal | null>(null);
  const [swapNote, setSwapNote] = useState<string>();

  const initialValues: BookValues = {
    kitId: initial.kitId ?? '',
    assetIds: initial.assetIds ?? [],
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
      ...(values.assetIds.length ? { assetIds: values.assetIds } : {}),
      ...(values.jobId ? { jobId: values.jobId } : {}),
      ...(values.note.trim() ? { note: values.note.trim() } : {}),
    };
    try {
      onBooked(await create.mutateAsync(input));
    } catch (error) {
      const t = bookingRefusalFrom(error, dayRange);
      if (t) setTrouble(t);
      else setFormError(applyServerErrors(error, helpers, { fields, labels }));
    }
  }

  return (
    <Formik initialValues={initialValues} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <BookFormBody
          kits={kits}
          assets={assets}
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
  assets,
  jobs,
  renderNewJob,
  formError,
  trouble,
  swapNote,
  busy,
  onSwapped,
}: Pick<BookFormProps, 'kits' | 'assets' | 'jobs' | 'renderNewJob'> & {
  formError?: string;
  trouble: BookingRefusal | null;
  swapNote?: string;
  busy: boolean;
  onSwapped: (note: string) => void;
}) {
  const { values, setFieldValue, setValues, submitForm } = useFormikContext<BookValues>();
  const [newJobOpen, setNewJobOpen] = useState(false);
  const byId = useMemo(() => new Map(assets.map((a) => [a.id, a])), [assets]);

  const kitMembers = useMemo(() => (values.kitId ? assets.filter((a) => a.kit?.id === values.kitId) : []), [assets, values.kitId]);
  const extras = values.assetIds.map((id) => byId.get(id)).filter((a): a is AssetView => !!a && a.kit?.id !== values.kitId);
  const items = [...kitMembers, ...extras];

  const datesValid = !!values.startsOn && !!values.endsOn && values.startsOn <= values.endsOn;
  const others = useBookings({ from: values.startsOn, to: values.endsOn, state: ['reserved', 'out'] }, { enabled: datesValid });
  const problems = datesValid ? bookingProblems(items, values.startsOn, values.endsOn, others.data?.items ?? []) : [];

  const jobOptions = [
    { value: '', label: 'No job (the firm’s own use)' },
    ...[...jobs].sort((a, b) => (a.startsOn < b.startsOn ? 1 : -1)).map((j) => ({ value: j.id, label: `${j.reference} · ${j.customerName} (${dayRange(j.startsOn, j.endsOn)})` })),
  ];
  const kitOptions = [{ value: '', label: 'No kit: separate items only' }, ...kits.map((k) => ({ value: k.id, label: k.name }))];

  function swap(troubledId: string, alternative: Alternative) {
    const ids = values.kitId ? [...new Set([...kitMembers.map((m) => m.id), ...values.assetIds])] : values.assetIds;
    const replaced = ids.map((id) => (id === troubledId ? alternative.id : id));
    const from = byId.get(troubledId)?.assetTag ?? 'the item';
    const kitName = kits.find((k) => k.id === values.kitId)?.name;
    void setValues({ ...values, kitId: '', assetIds: [...new Set(replaced)] }, true);
    onSwapped(
      `${alternative.assetTag} replaces ${from}.${kitName ? ` The booking now lists ${kitName}’s items one by one, with the swap.` : ''}`,
    );
    // Try again with the swap.
    setTimeout(() => void submitForm(), 0);
  }

  return (
    <>
      <Form noValidate className="flex flex-col gap-4" aria-label="Book kit">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
        {swapNote && !trouble ? <Notice tone="info">{swapNote}</Notice> : null}

        <FormSection legend="What goes">
          <SelectField name="kitId" label="Kit" options={kitOptions} hint="A kit books every item on its packing list." />
          <PackingListLine tags={kitMembers.map((m) => m.assetTag)} />
          <ItemPicker assets={assets} chosen={extras} kitId={values.kitId} onChange={(ids) => void setFieldValue('assetIds', ids)} />
        </FormSection>

        <FormSection legend="When">
          <DayRangeFields />
          <p className="text-sm text-ink-700" aria-live="polite">
            {datesValid
              ? `${bookingDays(values.startsOn, values.endsOn)} ${bookingDays(values.startsOn, values.endsOn) === 1 ? 'day' : 'days'}, ${dayRange(values.startsOn, values.endsOn)}, both days included.`
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

/** Search the fleet and add separate items (beyond the kit's packing list). */
function ItemPicker({ assets, chosen, kitId, onChange }: { assets: AssetView[]; chosen: AssetView[]; kitId: string; onChange: (ids: string[]) => void }) {
  const [q, setQ] = useState('');
  const chosenIds = new Set(chosen.map((a) => a.id));
  const needle = q.trim().toLowerCase();
  const matches = needle
    ? assets
        .filter((a) => a.status !== 'retired' && !chosenIds.has(a.id) && a.kit?.id !== kitId)
        .filter((a) => [a.assetTag, a.model ?? '', assetTypeTitles[a.type], a.kit?.name ?? ''].some((s) => s.toLowerCase().includes(needle)))
        .slice(0, 8)
    : [];
  return (
    <div className="flex flex-col gap-2">
      <RemovableTags
        label="Separate items"
        items={chosen.map((a) => ({ id: a.id, tag: a.assetTag, detail: assetTypeTitles[a.type] }))}
        onRemove={(id) => onChange(chosen.filter((c) => c.id !== id).map((c) => c.id))}
      />
      <SearchBox label="Add separate items" value={q} onChange={setQ} placeholder="Tag, type or model, e.g. SMR" />
      {needle ? (
        <ItemMatches
          items={matches.map((a) => ({ id: a.id, tag: a.assetTag, detail: [assetTypeTitles[a.type], a.model].filter(Boolean).join(' · '), kitName: a.kit?.name }))}
          none={`No item matches “${q.trim()}”.`}
          onAdd={(id) => onChange([...chosen.map((c) => c.id), id])}
        />
      ) : null}
    </div>
  );
}
