import { Form, Formik, useField, useFormikContext } from 'formik';
import { useId, useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { DateField } from '../../../components/date-field';
import { Field, SelectField } from '../../../components/field';
import { AlertIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import type { AssetView } from '../../../../shared/assets/views';
import { dueDate } from '../../../lib/calibration';
import { applyServerErrors } from '../../../lib/form-errors';
import { formatCalendarDate } from '../../../lib/format';
import { useRecordCalibration } from '../api/record-calibration';
import type { AsFound } from '../../../../shared/calibration/interval-review';
import type { CalibrationEventView } from '../../../../shared/calibration/views';
import { resultChoices, resultWords } from './calibration-words';
import { UploadProgress } from '../../../components/upload-progress';

const MAX_CERTIFICATE_BYTES = 20 * 1024 * 1024;

interface Values {
  performedOn: string;
  provider: string;
  certificateNumber: string;
  asFound: AsFound | '';
  asFoundErrorUm: string;
  asLeft: AsFound | '';
  intervalMonths: string;
  note: string;
  certificate: File | null;
}

const resultOptions = [{ value: '', label: 'Choose the lab’s result…' }, ...resultChoices.map((r) => ({ value: r, label: resultWords[r] }))];

const isDate = (v: string | undefined) => !!v && /^\d{4}-\d{2}-\d{2}$/.test(v) && !Number.isNaN(Date.parse(v));
const isInterval = (v: string | undefined) => !!v && /^\d+$/.test(v.trim()) && Number(v) >= 1 && Number(v) <= 120;

function schemaFor(today: string) {
  return Yup.object({
    performedOn: Yup.string()
      .required('Enter the day the lab calibrated it.')
      .test('date', 'Enter a date.', isDate)
      .test('past', 'That is in the future. Enter the day on the certificate.', (v) => !isDate(v) || v! <= today),
    provider: Yup.string().trim().required('Name the lab that calibrated it.').max(120, 'Keep the lab’s name under 120 characters.'),
    certificateNumber: Yup.string().trim().required('Enter the number printed on the certificate.').max(80, 'Keep the number under 80 characters.'),
    asFound: Yup.string().required('Choose what the lab found before adjusting it.'),
    asFoundErrorUm: Yup.string().test(
      'micrometres',
      'Enter the error in micrometres, e.g. 9.5, or leave it empty.',
      (v) => !v?.trim() || (Number.isFinite(Number(v)) && Number(v) >= 0),
    ),
    asLeft: Yup.string().required('Choose how the lab left it.'),
    intervalMonths: Yup.string().test('months', 'Enter whole months from 1 to 120, or leave it empty to keep the plan’s.', (v) => !v?.trim() || isInterval(v)),
    note: Yup.string().max(2000, 'Keep the note under 2,000 characters.'),
    certificate: Yup.mixed<File>()
      .nullable()
      .test('present', 'Attach the certificate as a PDF.', (f) => !!f)
      .test('pdf', 'Choose a PDF file.', (f) => !f || f.type === 'application/pdf' || /\.pdf$/i.test(f.name))
      .test('size', 'A certificate may be at most 20 MB.', (f) => !f || f.size <= MAX_CERTIFICATE_BYTES),
  });
}

function CertificateInput() {
  const [, meta, helpers] = useField<File | null>('certificate');
  const id = useId();
  const error = meta.touched && meta.error ? meta.error : undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        Certificate (PDF)
      </label>
      <input
        id={id}
        type="file"
        accept="application/pdf,.pdf"
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : `${id}-hint`}
        onChange={(e) => {
          void helpers.setValue(e.currentTarget.files?.[0] ?? null);
          void helpers.setTouched(true, false);
        }}
        className="min-h-10 rounded-md border border-paper-line bg-card px-2 py-1.5 text-base file:mr-3 file:rounded file:border file:border-paper-line file:bg-paper-deep file:px-3 file:py-1 file:font-semibold"
      />
      {error ? (
        <p id={`${id}-error`} className="flex items-start gap-1 text-sm text-bad">
          <AlertIcon size={14} className="mt-0.5 shrink-0" />
          <span>{error}</span>
        </p>
      ) : (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          The lab&rsquo;s certificate, as a PDF of at most 20 MB. It is kept with the item&rsquo;s record.
        </p>
      )}
    </div>
  );
}

/** The due date this calibration will set, worked out the way the server does (last calibration + interval, month ends clamp). */
function DuePreview({ fallbackMonths }: { fallbackMonths: number }) {
  const { values } = useFormikContext<Values>();
  const monthsText = values.intervalMonths.trim();
  const intervalMonths = monthsText ? (isInterval(monthsText) ? Number(monthsText) : null) : fallbackMonths;
  const due = isDate(values.performedOn) && intervalMonths ? dueDate(values.performedOn, intervalMonths) : null;
  return (
    <p role="status" className="rounded-md border border-brass/60 bg-brass-wash px-3 py-2">
      {due ? (
        <>
          New due date: <strong>{formatCalendarDate(due)}</strong>{' '}
          <span className="text-sm text-ink-700">
            ({formatCalendarDate(values.performedOn)} + {intervalMonths} {intervalMonths === 1 ? 'month' : 'months'}; valid through that day)
          </span>
        </>
      ) : (
        <span className="text-ink-700">The new due date appears once the date and interval are filled in.</span>
      )}
    </p>
  );
}

/** Record the lab's certificate: live due-date preview, upload progress, server errors back on their fields. */
export function RecordCalibrationForm({ asset, today, onSaved }: { asset: AssetView; today: string; onSaved: (event: CalibrationEventView) => void }) {
  const [progress, setProgress] = useState<number | null>(null);
  const record = useRecordCalibration((f) => setProgress(f));
  const [problem, setProblem] = useState<string>();
  const planMonths = asset.calibration.intervalMonths ?? 12;

  return (
    <Formik<Values>
      initialValues={{
        performedOn: today,
        provider: asset.calibration.provider ?? '',
        certificateNumber: '',
        asFound: '',
        asFoundErrorUm: '',
        asLeft: '',
        intervalMonths: String(planMonths),
        note: '',
        certificate: null,
      }}
      validationSchema={schemaFor(today)}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        setProgress(0);
        try {
          const event = await record.mutateAsync({
            assetId: asset.id,
            performedOn: values.performedOn,
            provider: values.provider.trim(),
            certificateNumber: values.certificateNumber.trim(),
            asFound: values.asFound as AsFound,
            asFoundErrorUm: values.asFoundErrorUm.trim() ? Number(values.asFoundErrorUm) : undefined,
            asLeft: values.asLeft as AsFound,
            intervalMonths: values.intervalMonths.trim() ? Number(values.intervalMonths) : undefined,
            note: values.note.trim() || undefined,
            certificate: values.certificate!,
          });
          onSaved(event);
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: ['performedOn', 'provider', 'certificateNumber', 'asFound', 'asFoundErrorUm', 'asLeft', 'intervalMonths', 'note', 'certificate'],
              byCode: {
                unsupported_type: 'certificate',
                too_large: 'certificate',
                certificate_active_content: 'certificate',
                certificate_encrypted: 'certificate',
              },
              labels: {
                performedOn: 'Performed on',
                provider: 'Provider',
                certificateNumber: 'Certificate number',
                intervalMonths: 'Interval',
                certificate: 'Certificate',
              },
            }),
          );
        } finally {
          setProgress(null);
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Record a calibration" className="flex max-w-3xl flex-col gap-4">
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            <DateField name="performedOn" label="Performed on" max={today} hint="The calibration date on the certificate." />
            <Field name="provider" label="Provider" hint="The lab that calibrated it." />
            <Field name="certificateNumber" label="Certificate number" mono />
            <Field name="intervalMonths" label="Interval (months)" inputMode="numeric" hint={`The plan says ${planMonths} months.`} />
            <SelectField name="asFound" label="As found" options={resultOptions} hint="Its state when it reached the lab, before any adjustment." />
            <SelectField name="asLeft" label="As left" options={resultOptions} hint="Its state when it left the lab." />
            <Field
              name="asFoundErrorUm"
              label="Largest as-found error (µm)"
              inputMode="decimal"
              hint="If the certificate states one. An impact review weighs it against each job's tolerance."
            />
          </div>
          <div className="flex flex-col gap-1">
            <NoteField />
          </div>
          <CertificateInput />
          <DuePreview fallbackMonths={planMonths} />
          <AsFoundWarning tag={asset.assetTag} />
          {progress !== null ? <UploadProgress progress={progress} sending="Uploading the certificate…" sent="Uploaded, saving…" /> : null}
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Save calibration
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}

function NoteField() {
  const [field, meta] = useField<string>('note');
  const id = useId();
  const error = meta.touched && meta.error ? meta.error : undefined;
  return (
    <>
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        Note
      </label>
      <textarea
        id={id}
        {...field}
        rows={3}
        aria-invalid={error ? true : undefined}
        className="w-full rounded-md border border-paper-line bg-card px-3 py-1.5 text-base focus:border-brass-deep focus:outline-2 focus:outline-brass-deep"
      />
      {error ? <p className="text-sm text-bad">{error}</p> : null}
    </>
  );
}

function AsFoundWarning({ tag }: { tag: string }) {
  const { values } = useFormikContext<Values>();
  if (values.asFound !== 'out_of_tolerance') return null;
  return (
    <Notice tone="caution" title="Saving opens an impact review">
      Found out of tolerance: every job that used {tag} since its last passing evidence will be listed for you to assess (ISO 9001:2015 §7.1.5.2).
    </Notice>
  );
}
