import { Form, Formik, useFormikContext, type FormikHelpers } from 'formik';
import { useId, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field, SelectField } from '../../../components/field';
import { AlertIcon, CrossIcon, PlusIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import type { AssetView } from '../../../lib/assets';
import { assetTypeTitles } from '../../../lib/assets';
import { bookingDays } from '../../../lib/bookings';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateBooking } from '../api/create-booking';
import { useBookings } from '../api/get-bookings';
import type { Alternative, Booking, BookingInput, BookingTroubleDetails } from '../api/types';
import { bookingProblems } from './booking-problems';
import { blockSentence, dayRange, shortDay } from './booking-words';

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
  startsOn: Yup.string().required('Pick the first day.'),
  endsOn: Yup.string()
    .required('Pick the last day.')
    .test('after-start', 'The last day cannot be before the first.', function (value) {
      const { startsOn } = this.parent as BookValues;
      return !value || !startsOn || value >= startsOn;
    })
    .test('not-too-long', `A booking may span at most ${MAX_DAYS} days.`, function (value) {
      const { startsOn } = this.parent as BookValues;
      return !value || !startsOn || value < startsOn || bookingDays(startsOn, value) <= MAX_DAYS;
    }),
  jobId: Yup.string(),
  note: Yup.string().max(2000, 'Keep the note to 2000 characters.'),
});

/** The server's refusal, per troubled item, with the free alternatives it offered. */
interface Trouble {
  message: string;
  items: { assetId: string; assetTag: string; why: string; bookingId?: string; alternatives: Alternative[] }[];
}

function troubleFrom(error: unknown): Trouble | null {
  if (!isApiError(error) || (error.code !== 'conflict' && error.code !== 'booking_blocked')) return null;
  const details = (error.details ?? {}) as BookingTroubleDetails;
  const alternatives = details.alternatives ?? {};
  const items: Trouble['items'] = [];
  for (const b of details.blocked ?? []) {
    items.push({ assetId: b.assetId, assetTag: b.assetTag, why: blockSentence(b.assetTag, b.reason), alternatives: alternatives[b.assetId] ?? [] });
  }
  for (const c of details.conflicts ?? []) {
    if (items.some((i) => i.assetId === c.assetId)) continue;
    items.push({
      assetId: c.assetId,
      assetTag: c.assetTag,
      why: `${c.assetTag} is already booked ${dayRange(c.startsOn, c.endsOn)}.`,
      bookingId: c.bookingId,
      alternatives: alternatives[c.assetId] ?? [],
    });
  }
  return { message: error.message, items };
}

export interface BookFormProps {
  kits: { id: string; name: string }[];
  /** Every asset of the firm (retired ones too: a kit books all its members). */
  assets: AssetView[];
  jobs: JobChoice[];
  initial: Partial<BookValues>;
  /** The inline "New job" form (from the jobs feature); calls `onCreated` with the new job's id. */
  renderNewJob?: (props: { startsOn: string; endsOn: string; onCreated: (jobId: string) => void; onCancel: () => void }) => ReactNode;
  onBooked: (booking: Booking) => void;
}

export function BookForm({ kits, assets, jobs, initial, renderNewJob, onBooked }: BookFormProps) {
  const create = useCreateBooking();
  const [formError, setFormError] = useState<string>();
  const [trouble, setTrouble] = useState<Trouble | null>(null);
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
    const input: BookingInput = {
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
      const t = troubleFrom(error);
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
  trouble: Trouble | null;
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

        <fieldset className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-4">
          <legend className="px-1 font-semibold text-ink-900">What goes</legend>
          <SelectField name="kitId" label="Kit" options={kitOptions} hint="A kit books every item on its packing list." />
          {kitMembers.length ? (
            <p className="text-sm text-ink-700">
              <span className="font-semibold text-ink-800">Packing list: </span>
              <span className="font-mono">{kitMembers.map((m) => m.assetTag).join(', ')}</span>
            </p>
          ) : null}
          <ItemPicker assets={assets} chosen={extras} kitId={values.kitId} onChange={(ids) => void setFieldValue('assetIds', ids)} />
        </fieldset>

        <fieldset className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-4">
          <legend className="px-1 font-semibold text-ink-900">When</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            <Field name="startsOn" label="Starts on" type="date" />
            <Field name="endsOn" label="Ends on" type="date" min={values.startsOn || undefined} />
          </div>
          <p className="text-sm text-ink-700" aria-live="polite">
            {datesValid
              ? `${bookingDays(values.startsOn, values.endsOn)} ${bookingDays(values.startsOn, values.endsOn) === 1 ? 'day' : 'days'}, ${dayRange(values.startsOn, values.endsOn)}, both days included.`
              : 'Whole days; the first and the last day are both included.'}
          </p>
        </fieldset>

        <fieldset className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-4">
          <legend className="px-1 font-semibold text-ink-900">For</legend>
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
        </fieldset>

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

        {trouble ? <TroublePanel trouble={trouble} onSwap={swap} /> : null}

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

function TroublePanel({ trouble, onSwap }: { trouble: Trouble; onSwap: (troubledId: string, alternative: Alternative) => void }) {
  return (
    <div role="alert" className="rounded-md border border-bad/50 bg-bad-wash px-3 py-2 text-ink-900">
      <p className="flex items-start gap-2 font-semibold">
        <AlertIcon size={18} className="mt-0.5 shrink-0 text-bad" />
        {trouble.message}
      </p>
      <ul className="mt-2 flex flex-col gap-2">
        {trouble.items.map((item) => (
          <li key={item.assetId} className="rounded border border-paper-line bg-card px-3 py-2">
            <p className="text-sm">
              {item.why}{' '}
              {item.bookingId ? (
                <Link to={`/bookings/${item.bookingId}`} className="font-semibold text-brass-deep underline">
                  See that booking
                </Link>
              ) : null}
            </p>
            {item.alternatives.length ? (
              <div className="mt-2 flex flex-wrap gap-2">
                {item.alternatives.map((alt) => (
                  <Button
                    key={alt.id}
                    size="sm"
                    onClick={() => onSwap(item.assetId, alt)}
                    title={[alt.model, alt.dueOn ? `calibration due ${shortDay(alt.dueOn, true)}` : null].filter(Boolean).join(', ') || undefined}
                  >
                    Use {alt.assetTag} instead
                  </Button>
                ))}
              </div>
            ) : (
              <p className="mt-1 text-sm text-ink-700">No item of the same type is free and in calibration for these dates.</p>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Search the fleet and add separate items (beyond the kit's packing list). */
function ItemPicker({ assets, chosen, kitId, onChange }: { assets: AssetView[]; chosen: AssetView[]; kitId: string; onChange: (ids: string[]) => void }) {
  const [q, setQ] = useState('');
  const searchId = useId();
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
      {chosen.length ? (
        <ul aria-label="Separate items" className="flex flex-wrap gap-2">
          {chosen.map((a) => (
            <li key={a.id} className="inline-flex items-center gap-1 rounded-full border border-paper-line bg-paper px-2 py-0.5 text-sm">
              <span className="font-mono font-semibold">{a.assetTag}</span>
              <span className="text-ink-700">{assetTypeTitles[a.type]}</span>
              <button
                type="button"
                aria-label={`Remove ${a.assetTag}`}
                onClick={() => onChange(chosen.filter((c) => c.id !== a.id).map((c) => c.id))}
                className="rounded p-0.5 text-ink-700 hover:bg-paper-deep"
              >
                <CrossIcon size={14} />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      <div className="flex flex-col gap-1">
        <label htmlFor={searchId} className="text-sm font-semibold text-ink-800">
          Add separate items
        </label>
        <input
          id={searchId}
          type="search"
          value={q}
          onChange={(e) => setQ(e.target.value)}
          placeholder="Tag, type or model, e.g. SMR"
          autoComplete="off"
          className="min-h-10 rounded-md border border-paper-line bg-card px-3 text-base"
        />
      </div>
      {needle ? (
        matches.length ? (
          <ul className="flex flex-col divide-y divide-paper-line rounded-md border border-paper-line">
            {matches.map((a) => (
              <li key={a.id} className="flex items-center gap-2 px-2 py-1">
                <span className="font-mono text-sm font-semibold">{a.assetTag}</span>
                <span className="min-w-0 flex-1 truncate text-sm text-ink-700">
                  {assetTypeTitles[a.type]}
                  {a.model ? ` · ${a.model}` : ''}
                  {a.kit ? ` · in ${a.kit.name}` : ''}
                </span>
                <Button size="sm" onClick={() => onChange([...chosen.map((c) => c.id), a.id])}>
                  Add {a.assetTag}
                </Button>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-ink-700">No item matches “{q.trim()}”.</p>
        )
      ) : null}
    </div>
  );
}
