import { formatCalendarDate } from '../../../lib/format';
import { Form, Formik, useField, useFormikContext, type FormikHelpers } from 'formik';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { Button, buttonClasses } from '../../../components/button';
import { DateField } from '../../../components/date-field';
import { Field } from '../../../components/field';
import { PrintIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { BatteryCaution, HeavyCaseCaution, LaserCaution } from '../../../components/safety-cautions';
import { isApiError } from '../../../lib/api-client';
import { assetTypeTitles } from '../../../lib/assets';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCheckOutBooking } from '../api/check-out-booking';
import { useReturnBooking, type ReturnPhoto } from '../api/return-booking';
import type { BookingView, ItemCondition, ReturnView } from '../../../../shared/bookings/views';
import { conditionWords } from './booking-words';

export type HandoverMode = 'checkout' | 'return';

interface Line {
  assetId: string;
  assetTag: string;
  present: boolean;
  condition: ItemCondition;
  note: string;
}

interface HandoverValues {
  lines: Line[];
  counterpart: string;
  /** Set when a suggestion names one of the firm's people: sent instead of the typed name. */
  counterpartUserId: string;
  /** Asked for once the server says checkout has not opened yet. */
  earlyReason: string;
  /** A reservation not collected goes late: why, and the new last day. */
  lateNote: string;
  lateEndsOn: string;
}

/** A person to offer as the one who takes or brings back the kit. */
export interface CounterpartSuggestion {
  label: string;
  name: string;
  userId: string | null;
}

const words = {
  checkout: { who: 'Taken by', submit: 'Hand over', list: 'Packing list to hand over' },
  return: { who: 'Brought back by', submit: 'Take back', list: 'Packing list to take back' },
} as const;

function schemaFor(mode: HandoverMode, late: boolean, early: boolean) {
  return Yup.object({
    lateNote: late ? Yup.string().trim().required('Say why the kit goes late.').min(3, 'Say a little more.') : Yup.string(),
    lateEndsOn: late ? Yup.string().required('Pick the new last day.') : Yup.string(),
    earlyReason: early ? Yup.string().trim().required('Say why the kit goes before its checkout opens.').min(3, 'Say a little more.') : Yup.string(),
    counterpart: Yup.string()
      .trim()
      .required(mode === 'checkout' ? 'Say who takes the kit.' : 'Say who brings the kit back.')
      .min(2, 'Write at least two letters of the name.'),
    lines:
      mode === 'checkout'
        ? Yup.array().test('all-present', '', function (lines) {
            const list = (lines ?? []) as Line[];
            const missing = list.filter((l) => !l.present).map((l) => l.assetTag);
            if (missing.length)
              return this.createError({
                message: `Tick every item present to hand over. Not ticked: ${missing.join(', ')}. If something is missing, change the booking first.`,
              });
            const damaged = list.filter((l) => l.condition === 'damaged').map((l) => l.assetTag);
            if (damaged.length)
              return this.createError({
                message: `Damaged items must not go out: ${damaged.join(', ')}. Report the damage from the item's page and book a replacement.`,
              });
            return true;
          })
        : Yup.array(),
  });
}

/** The photo picker for one damaged item at return (the incidents feature's, handed in by the screen). */
export type ReturnPhotoPicker = (props: { assetTag: string; files: File[]; onChange: (files: File[]) => void }) => ReactNode;

/**
 * Checkout or return against the booking's packing list: each item present?, its condition, a note; who takes or brings it.
 * At return, an item marked damaged takes photos (`photoPicker`) that go with its incident.
 */
export function HandoverForm({
  booking,
  mode,
  suggestions,
  today,
  photoPicker,
  onDone,
}: {
  booking: BookingView;
  mode: HandoverMode;
  suggestions: CounterpartSuggestion[];
  /** The firm's calendar day: a reservation whose days passed goes out late. */
  today: string;
  photoPicker?: ReturnPhotoPicker;
  onDone: (result: BookingView | ReturnView) => void;
}) {
  const checkout = useCheckOutBooking();
  const giveBack = useReturnBooking();
  const [formError, setFormError] = useState<string>();
  /** Photos of damage per item, kept outside Formik (files are not form values). */
  const [photos, setPhotos] = useState<Record<string, File[]>>({});
  /** The server's word that checkout has not opened yet: the form then asks for a reason. */
  const [earlyAsk, setEarlyAsk] = useState<string>();
  const w = words[mode];
  const late = mode === 'checkout' && (booking.state === 'not_collected' || booking.endsOn < today);

  const initialValues: HandoverValues = {
    lines: booking.items.map((item) => ({ assetId: item.id, assetTag: item.assetTag, present: false, condition: 'good', note: '' })),
    counterpart: '',
    counterpartUserId: '',
    earlyReason: '',
    lateNote: '',
    lateEndsOn: '',
  };

  async function submit(values: HandoverValues, helpers: FormikHelpers<HandoverValues>) {
    setFormError(undefined);
    const input = {
      id: booking.id,
      counterpart: values.counterpartUserId || values.counterpart.trim(),
      checklist: values.lines.map((l) => ({
        assetId: l.assetId,
        present: l.present,
        condition: l.condition,
        ...(l.note.trim() ? { note: l.note.trim() } : {}),
      })),
      ...(earlyAsk && values.earlyReason.trim() ? { earlyReason: values.earlyReason.trim() } : {}),
      ...(late ? { late: { note: values.lateNote.trim(), endsOn: values.lateEndsOn } } : {}),
    };
    // Only the photos of items still marked damaged when the form is sent.
    const damagePhotos: ReturnPhoto[] = values.lines
      .filter((l) => l.present && l.condition === 'damaged')
      .flatMap((l) => (photos[l.assetId] ?? []).map((file) => ({ assetId: l.assetId, file })));
    try {
      onDone(mode === 'checkout' ? await checkout.mutateAsync(input) : await giveBack.mutateAsync({ ...input, photos: damagePhotos }));
    } catch (error) {
      if (isApiError(error) && error.code === 'checkout_early') {
        setEarlyAsk(error.message);
        return;
      }
      setFormError(applyServerErrors(error, helpers, { fields: ['counterpart'], labels: { counterpart: w.who } }));
    }
  }

  const types = new Set(booking.items.map((i) => i.type));
  return (
    <Formik initialValues={initialValues} validationSchema={schemaFor(mode, late, !!earlyAsk)} onSubmit={submit}>
      {({ isSubmitting, values, errors, submitCount }) => (
        <>
          <Form noValidate className="flex flex-col gap-4 print:hidden" aria-label={mode === 'checkout' ? 'Check out' : 'Take back'}>
            {formError ? <Notice tone="error">{formError}</Notice> : null}
            <section aria-labelledby="handover-list" className="rounded-lg border border-paper-line bg-card p-4">
              <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                <h2 id="handover-list" className="text-lg font-bold">
                  {w.list}
                </h2>
                <TickAll />
              </div>
              <ul className="flex flex-col divide-y divide-paper-line">
                {booking.items.map((item, i) => (
                  <ChecklistRow key={item.id} index={i} assetTag={item.assetTag} type={assetTypeTitles[item.type]} />
                ))}
              </ul>
              {typeof errors.lines === 'string' && (submitCount > 0 || values.lines.every((l) => l.present)) ? (
                <Notice tone="error" className="mt-3">
                  {errors.lines}
                </Notice>
              ) : null}
              {mode === 'return' ? <ReturnPreview lines={values.lines} /> : null}
            </section>

            {mode === 'return' && photoPicker ? (
              <DamagePhotos
                lines={values.lines}
                photos={photos}
                onChange={(assetId, files) => setPhotos((now) => ({ ...now, [assetId]: files }))}
                picker={photoPicker}
              />
            ) : null}

            {mode === 'checkout' ? <NotReady booking={booking} /> : null}

            {late ? (
              <section aria-labelledby="late-heading" className="flex flex-col gap-3 rounded-lg border border-warn/50 bg-card p-4">
                <h2 id="late-heading" className="text-lg font-bold">
                  Not collected: check out late
                </h2>
                <p className="text-sm text-ink-700">
                  This reservation&rsquo;s days ended on {formatCalendarDate(booking.endsOn)} without checkout. It goes out from today to a new last day, if
                  every item is free and in calibration for those days.
                </p>
                <Field name="lateNote" label="Why it goes late" autoComplete="off" />
                <DateField name="lateEndsOn" label="New last day" min={today} />
              </section>
            ) : null}

            <CounterpartField label={w.who} suggestions={suggestions} />

            {mode === 'checkout' ? <Cautions types={types} /> : null}

            {earlyAsk ? (
              <section aria-labelledby="early-heading" className="flex flex-col gap-3 rounded-lg border border-warn/50 bg-card p-4">
                <h2 id="early-heading" className="text-lg font-bold">
                  Hand over before checkout opens?
                </h2>
                <p className="text-sm text-ink-800">{earlyAsk}</p>
                <p className="text-sm text-ink-700">The booking will then start today, and the reason is kept on its record.</p>
                <Field name="earlyReason" label="Why it goes early" autoComplete="off" />
              </section>
            ) : null}

            <div className="flex flex-wrap gap-2">
              <Button type="submit" variant="primary" busy={isSubmitting}>
                {earlyAsk ? 'Hand over early' : late ? 'Hand over late' : w.submit}
              </Button>
              {mode === 'checkout' ? (
                <a href={`/api/bookings/${booking.id}/handover-sheet.pdf`} target="_blank" rel="noreferrer" className={buttonClasses()}>
                  <PrintIcon size={16} />
                  Hand-over sheet (PDF)
                </a>
              ) : null}
            </div>
          </Form>
        </>
      )}
    </Formik>
  );
}

/**
 * What taking back will do, for the items marked so far: damaged ones open an incident each. Items not yet
 * ticked are named as such (not called missing) until someone has started ticking.
 */
function ReturnPreview({ lines }: { lines: Line[] }) {
  const started = lines.some((l) => l.present || l.condition !== 'good' || l.note.trim());
  if (!started) return null;
  const damaged = lines.filter((l) => l.present && l.condition === 'damaged').map((l) => l.assetTag);
  const unticked = lines.filter((l) => !l.present).map((l) => l.assetTag);
  if (!damaged.length && !unticked.length) return null;
  return (
    <Notice tone="caution" className="mt-3" title="What taking back will do">
      {damaged.length ? <p>Damaged: {damaged.join(', ')}. Each gets an incident report and goes on hold until someone releases it on evidence.</p> : null}
      {unticked.length ? (
        <p>
          Not ticked present yet: {unticked.join(', ')}. If you take back now, each counts as missing and gets an incident report; tick the ones that came back.
        </p>
      ) : null}
    </Notice>
  );
}

/** A photo picker for each item marked damaged: the photos go with the incident its return opens. */
function DamagePhotos({
  lines,
  photos,
  onChange,
  picker,
}: {
  lines: Line[];
  photos: Record<string, File[]>;
  onChange: (assetId: string, files: File[]) => void;
  picker: ReturnPhotoPicker;
}) {
  const damaged = lines.filter((l) => l.present && l.condition === 'damaged');
  if (!damaged.length) return null;
  return (
    <section aria-labelledby="damage-photos" className="flex flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
      <div>
        <h2 id="damage-photos" className="text-lg font-bold">
          Photos of the damage
        </h2>
        <p className="text-sm text-ink-700">They go with each item&rsquo;s incident report, with the booking and its customer.</p>
      </div>
      {damaged.map((l) => (
        <div key={l.assetId}>{picker({ assetTag: l.assetTag, files: photos[l.assetId] ?? [], onChange: (files) => onChange(l.assetId, files) })}</div>
      ))}
    </section>
  );
}

/** Items that cannot go out as things stand (the server refuses the hand-over too). */
function NotReady({ booking }: { booking: BookingView }) {
  const stillOut = booking.items.filter((i) => i.status === 'out').map((i) => i.assetTag);
  const blocked = booking.items.filter((i) => i.status === 'held' || i.status === 'at_lab' || i.status === 'retired');
  if (!stillOut.length && !blocked.length) return null;
  return (
    <Notice tone="caution" title="Not everything can go yet">
      {stillOut.length ? <p>Still out on an earlier booking: {stillOut.join(', ')}. Take them back in first.</p> : null}
      {blocked.map((i) => (
        <p key={i.id}>
          {i.assetTag} is {i.status === 'held' ? 'on hold' : i.status === 'at_lab' ? 'at the calibration lab' : 'retired'}: it cannot go. Change the booking to
          swap it.
        </p>
      ))}
    </Notice>
  );
}

function TickAll() {
  const { values, setFieldValue } = useFormikContext<HandoverValues>();
  const all = values.lines.every((l) => l.present);
  return (
    <Button
      size="sm"
      variant="quiet"
      onClick={() =>
        void setFieldValue(
          'lines',
          values.lines.map((l) => ({ ...l, present: !all })),
        )
      }
    >
      {all ? 'Untick all' : 'Tick all present'}
    </Button>
  );
}

function ChecklistRow({ index, assetTag, type }: { index: number; assetTag: string; type: string }) {
  const [present] = useField({ name: `lines.${index}.present`, type: 'checkbox' });
  const [condition] = useField(`lines.${index}.condition`);
  const [note] = useField(`lines.${index}.note`);
  const base = `line-${index}`;
  return (
    <li className="grid items-center gap-2 py-2 sm:grid-cols-[minmax(10rem,1fr)_auto_10rem_minmax(10rem,1.5fr)]">
      <span className="min-w-0">
        <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{assetTag}</span>
        <span className="ml-2 text-sm text-ink-700">{type}</span>
      </span>
      <label htmlFor={`${base}-present`} className="flex min-h-10 items-center gap-2">
        <input id={`${base}-present`} type="checkbox" {...present} aria-label={`Present: ${assetTag}`} className="size-5 accent-brass-deep" />
        <span aria-hidden="true">Present</span>
      </label>
      <select {...condition} aria-label={`Condition: ${assetTag}`} className="min-h-10 rounded-md border border-paper-line bg-card px-2">
        {(Object.keys(conditionWords) as ItemCondition[]).map((c) => (
          <option key={c} value={c}>
            {conditionWords[c]}
          </option>
        ))}
      </select>
      <input
        {...note}
        aria-label={`Note: ${assetTag}`}
        placeholder="Note (optional)"
        autoComplete="off"
        className="min-h-10 rounded-md border border-paper-line bg-card px-2"
      />
    </li>
  );
}

function CounterpartField({ label, suggestions }: { label: string; suggestions: CounterpartSuggestion[] }) {
  const { setFieldValue, values } = useFormikContext<HandoverValues>();
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4">
      <Field
        name="counterpart"
        label={label}
        autoComplete="off"
        hint="A name, or pick one of your people below."
        onChange={(e) => {
          void setFieldValue('counterpart', e.target.value);
          if (values.counterpartUserId) void setFieldValue('counterpartUserId', '');
        }}
      />
      {suggestions.length ? (
        <div className="flex flex-wrap gap-2" role="group" aria-label="Suggested people">
          {suggestions.map((s) => (
            <Button
              key={s.label}
              size="sm"
              variant={values.counterpartUserId && values.counterpartUserId === s.userId ? 'primary' : 'secondary'}
              onClick={() => {
                void setFieldValue('counterpart', s.name);
                void setFieldValue('counterpartUserId', s.userId ?? '');
              }}
            >
              {s.label}
            </Button>
          ))}
        </div>
      ) : null}
    </div>
  );
}

/** DESIGN.md §6: the cautions that apply to what goes out. */
function Cautions({ types }: { types: Set<string> }) {
  const laser = types.has('tracker');
  const heavy = types.has('tracker') || types.has('case');
  const battery = types.has('battery');
  return (
    <section aria-label="Safety cautions" className="flex flex-col gap-2">
      {laser ? <LaserCaution /> : null}
      {heavy ? <HeavyCaseCaution /> : null}
      {battery ? <BatteryCaution /> : null}
      {!laser && !heavy && !battery ? (
        <Notice tone="caution" title="Before it goes">
          Follow local codes, the carrier&rsquo;s rules and the instrument maker&rsquo;s instructions for what is handed over.
        </Notice>
      ) : null}
    </section>
  );
}

/** After a return: which items opened incidents (and are on hold), with links. */
export function ReturnOutcome({ result }: { result: ReturnView }) {
  const tagOf = (assetId: string) => result.items.find((i) => i.id === assetId)?.assetTag ?? 'An item';
  if (!result.incidents.length) {
    return (
      <Notice tone="success" title="Taken back">
        Everything on the packing list came back present and usable.
      </Notice>
    );
  }
  return (
    <Notice tone="caution" title="Taken back, with incidents">
      <p>These items came back missing or damaged. Each has an incident report and is on hold until released on evidence:</p>
      <ul className="mt-1 list-disc pl-5">
        {result.incidents.map((i) => (
          <li key={i.incidentId}>
            <span className="font-mono font-semibold">{tagOf(i.assetId)}</span> is on hold:{' '}
            <Link to={`/incidents/${i.incidentId}`} className="font-semibold text-brass-deep underline">
              open its incident
            </Link>
          </li>
        ))}
      </ul>
    </Notice>
  );
}
