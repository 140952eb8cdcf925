import { Form, Formik, useField } from 'formik';
import { useId, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { AssetStatusChip } from '../../../components/asset-status';
import { Button, buttonClasses } from '../../../components/button';
import { AlertIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import { BatteryCaution, LaserCaution } from '../../../components/safety-cautions';
import type { AssetView } from '../../../../shared/assets/views';
import { assetTypeTitles } from '../../../lib/assets';
import { applyServerErrors } from '../../../lib/form-errors';
import { useReportIncident } from '../api/report-incident';
import type { IncidentKind } from '../../../../shared/incidents/vocabulary';
import type { IncidentView } from '../../../../shared/incidents/views';
import { incidentKindChoices, incidentKindWords } from './incident-words';
import { PhotoPicker } from './photo-picker';
import { MAX_PHOTOS, photoProblem } from './photo-rules';

export interface IncidentFormValues {
  kind: IncidentKind | '';
  description: string;
  occurredAt: string;
  location: string;
}

/** "Now" as a datetime-local value in the phone's own time. */
function localNow(): string {
  const d = new Date();
  d.setSeconds(0, 0);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A datetime-local value (the phone's time) as an ISO instant the server reads with its offset. */
const toIso = (local: string) => new Date(local).toISOString();

const schema = Yup.object({
  kind: Yup.string().required('Choose what happened to it.'),
  description: Yup.string()
    .trim()
    .required('Say in a few words what happened.')
    .min(3, 'Say in a few words what happened.')
    .max(4000, 'Keep it under 4,000 characters.'),
  occurredAt: Yup.string()
    .required('Say when it happened.')
    .test('date', 'Enter a date and time.', (v) => !!v && !Number.isNaN(new Date(v).getTime()))
    .test('past', 'That is in the future. Enter when it happened.', (v) => !v || new Date(v).getTime() <= Date.now() + 5 * 60_000),
  location: Yup.string().max(200, 'Keep the place under 200 characters.'),
});

function ErrorLine({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1 text-base font-semibold text-bad">
      <AlertIcon size={18} className="mt-0.5 shrink-0" />
      <span>{children}</span>
    </p>
  );
}

function useShownError(name: string) {
  const [, meta] = useField(name);
  return (meta.touched || meta.value !== meta.initialValue) && meta.error ? meta.error : undefined;
}

function KindChoices() {
  const [field] = useField('kind');
  const error = useShownError('kind');
  const errorId = useId();
  return (
    <fieldset aria-describedby={error ? errorId : undefined}>
      <legend className="mb-2 text-lg font-bold text-ink-900">What happened to it?</legend>
      <div className="grid gap-2 sm:grid-cols-2">
        {incidentKindChoices.map((kind) => (
          <label
            key={kind}
            className={`flex min-h-14 cursor-pointer items-center gap-3 rounded-lg border-2 px-4 text-lg font-semibold ${
              field.value === kind ? 'border-ink-900 bg-brass-wash' : 'border-ink-300 bg-card'
            }`}
          >
            <input type="radio" {...field} value={kind} checked={field.value === kind} className="size-6 shrink-0 accent-ink-900" />
            {incidentKindWords[kind]}
          </label>
        ))}
      </div>
      {error ? <ErrorLine id={errorId}>{error}</ErrorLine> : null}
    </fieldset>
  );
}

function BigField({ name, label, hint, type = 'text', multiline = false }: { name: string; label: string; hint?: string; type?: string; multiline?: boolean }) {
  const [field] = useField(name);
  const error = useShownError(name);
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  const classes = `w-full rounded-md border-2 bg-card px-3 py-2 text-lg text-ink-950 focus:outline-3 focus:outline-brass-deep ${error ? 'border-bad' : 'border-ink-700'}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-lg font-bold text-ink-900">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-base text-ink-700">
          {hint}
        </p>
      ) : null}
      {multiline ? (
        <textarea id={id} {...field} rows={4} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={classes} />
      ) : (
        <input id={id} type={type} {...field} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`min-h-12 ${classes}`} />
      )}
      {error ? <ErrorLine id={`${id}-error`}>{error}</ErrorLine> : null}
    </div>
  );
}

/** A report the server refused, opened again as it was written, photos included (same id: the server stored nothing under it). */
export type IncidentCorrection = { id: string; values: IncidentFormValues; photos: File[] };

/**
 * Report damage or loss from a phone: big targets, high contrast. The report is saved on the phone first and sent
 * at once when there is signal, or by itself later.
 */
export function ReportIncidentForm({
  asset,
  bookingId,
  userId,
  correcting,
}: {
  asset: AssetView;
  bookingId?: string | null;
  /** Who reports it: the outbox sends a person's records only while they are signed in. */
  userId: string;
  correcting?: IncidentCorrection;
}) {
  const report = useReportIncident();
  const [photos, setPhotos] = useState<File[]>(correcting?.photos ?? []);
  const [problem, setProblem] = useState<string>();
  const [sent, setSent] = useState<IncidentView | null>(null);
  const [waiting, setWaiting] = useState(false);
  // The report's id is made when the form opens: pressing Send twice, or the outbox sending again, cannot make two.
  const [recordId] = useState(() => correcting?.id ?? crypto.randomUUID());

  const photoProblems = [
    ...photos.map(photoProblem).filter((p): p is string => p !== null),
    ...(photos.length > MAX_PHOTOS ? [`Choose at most ${MAX_PHOTOS} photos; remove ${photos.length - MAX_PHOTOS}.`] : []),
  ];

  if (sent) {
    return (
      <section aria-labelledby="sent-heading" className="flex flex-col gap-4 rounded-lg border-2 border-ink-900 bg-card p-4 text-lg">
        <h2 id="sent-heading" className="text-xl font-bold">
          Report sent
        </h2>
        <p>
          <strong className="font-mono whitespace-nowrap">{asset.assetTag}</strong> is now on hold: it cannot be booked or sent out until it has been checked or
          recalibrated and released.
        </p>
        <p>
          The shop manager and the owner have been told by e-mail
          {sent.photos.length ? `, with your ${sent.photos.length} photo${sent.photos.length === 1 ? '' : 's'}` : ''}.
        </p>
        {asset.type === 'battery' && sent.kind !== 'missing' && sent.kind !== 'other' ? <BatteryCaution /> : null}
        <p className="text-base text-ink-700">Until then, keep the item apart and do not use it.</p>
        <div className="flex flex-col gap-2 sm:flex-row">
          <Link to={`/fleet/${asset.id}`} className={buttonClasses('primary', 'md', 'min-h-12 text-lg')}>
            Back to {asset.assetTag}
          </Link>
          <Link to={`/incidents/${sent.id}`} className={buttonClasses('secondary', 'md', 'min-h-12 text-lg')}>
            See the report
          </Link>
        </div>
      </section>
    );
  }

  if (waiting) {
    return (
      <section aria-labelledby="queued-heading" className="flex flex-col gap-4 rounded-lg border-2 border-ink-900 bg-card p-4 text-lg">
        <h2 id="queued-heading" className="text-xl font-bold">
          Saved on this phone — waiting for signal
        </h2>
        <p>
          The report{photos.length ? ` and its ${photos.length} photo${photos.length === 1 ? '' : 's'}` : ''} stay on this phone and are sent by themselves when
          there is signal. Then <strong className="font-mono whitespace-nowrap">{asset.assetTag}</strong> goes on hold and the shop manager and the owner are
          e-mailed.
        </p>
        {asset.type === 'battery' ? <BatteryCaution /> : null}
        <p className="text-base text-ink-700">Until then, keep the item apart and do not use it.</p>
        <Link to={`/fleet/${asset.id}`} className={buttonClasses('primary', 'md', 'min-h-12 text-lg')}>
          Back to {asset.assetTag}
        </Link>
      </section>
    );
  }

  return (
    <Formik<IncidentFormValues>
      initialValues={correcting?.values ?? { kind: '', description: '', occurredAt: localNow(), location: asset.location ?? '' }}
      validationSchema={schema}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        if (photoProblems.length) {
          setProblem('Fix the photos first (see under “Photos”).');
          return;
        }
        try {
          const outcome = await report.mutateAsync({
            id: recordId,
            userId,
            title: `${incidentKindWords[values.kind as IncidentKind]} · ${asset.assetTag}`,
            draft: values,
            assetId: asset.id,
            kind: values.kind as IncidentKind,
            description: values.description.trim(),
            occurredAt: toIso(values.occurredAt),
            location: values.location.trim() || undefined,
            bookingId: bookingId ?? undefined,
            photos,
          });
          if (outcome.state === 'sent') setSent(outcome.incident);
          else setWaiting(true);
          window.scrollTo({ top: 0 });
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: ['kind', 'description', 'occurredAt', 'location'],
              labels: { description: 'What happened:', occurredAt: 'When:', location: 'Where:' },
            }),
          );
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Report damage" className="flex flex-col gap-5">
          <section aria-label="The item" className="flex flex-wrap items-center gap-x-3 gap-y-1 rounded-lg border-2 border-ink-900 bg-card px-4 py-3">
            <span className="font-mono text-2xl font-bold whitespace-nowrap">{asset.assetTag}</span>
            <span className="text-lg">{assetTypeTitles[asset.type]}</span>
            <AssetStatusChip status={asset.status} />
            {asset.model || asset.manufacturer ? (
              <span className="w-full text-base text-ink-700">{[asset.manufacturer, asset.model].filter(Boolean).join(' · ')}</span>
            ) : null}
          </section>
          {asset.type === 'battery' ? <BatteryCaution /> : null}
          {asset.type === 'tracker' ? (
            <LaserCaution laserClass={typeof asset.specs.laserClass === 'string' ? `Class ${asset.specs.laserClass}` : null} />
          ) : null}
          {problem ? (
            <Notice tone="error" title="Not sent yet">
              {problem}
            </Notice>
          ) : null}
          <KindChoices />
          <BigField name="description" label="What happened" multiline hint="E.g. slipped off the nest onto concrete, about 1 m; the tip looks bent." />
          <BigField name="occurredAt" label="When" type="datetime-local" />
          <BigField name="location" label="Where" hint="Site, building or room." />
          <PhotoPicker files={photos} onChange={setPhotos} problems={photoProblems} />
          <Button type="submit" variant="primary" busy={isSubmitting} className="min-h-14 w-full text-xl sm:w-auto sm:px-10">
            Send report
          </Button>
          <p className="text-base text-ink-700">
            Sending holds the item at once and e-mails the shop manager and the owner. If anyone is hurt, or a battery is hot, swelling or smoking, get clear
            and follow your site&rsquo;s emergency rules first.
          </p>
        </Form>
      )}
    </Formik>
  );
}
