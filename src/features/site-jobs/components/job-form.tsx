import { Form, Formik, type FormikHelpers } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { DateField } from '../../../components/date-field';
import { Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateSiteJob } from '../api/create-site-job';
import type { SiteJobView } from '../../../../shared/bookings/views';
import type { SiteJobInput } from '../api/create-site-job';
import { useUpdateSiteJob } from '../api/update-site-job';

interface JobValues {
  reference: string;
  customerName: string;
  contactName: string;
  contactEmail: string;
  siteAddress: string;
  startsOn: string;
  endsOn: string;
  leadTechnicianId: string;
  notes: string;
  /** The tightest feature tolerance: none, ± µm, or A + B·L at a distance. */
  toleranceKind: '' | 'fixed' | 'range';
  toleranceUm: string;
  toleranceAUm: string;
  toleranceBUmPerM: string;
  toleranceDistanceM: string;
  toleranceNote: string;
}

const fields = Object.keys({
  reference: 0,
  customerName: 0,
  contactName: 0,
  contactEmail: 0,
  siteAddress: 0,
  startsOn: 0,
  endsOn: 0,
  leadTechnicianId: 0,
  notes: 0,
  toleranceKind: 0,
  toleranceUm: 0,
  toleranceAUm: 0,
  toleranceBUmPerM: 0,
  toleranceDistanceM: 0,
  toleranceNote: 0,
} satisfies Record<keyof JobValues, 0>);

const labels: Record<string, string> = {
  reference: 'Reference',
  customerName: 'Customer',
  contactEmail: 'E-mail',
  startsOn: 'Start',
  endsOn: 'End',
};

const isNumber = (v: string | undefined) => !!v?.trim() && Number.isFinite(Number(v));

const schema = Yup.object({
  reference: Yup.string().trim().required('Give the job a reference, e.g. J-2611.').max(40, 'Keep the reference to 40 characters.'),
  customerName: Yup.string().trim().required('Say who the customer is.').max(120, 'Keep the name to 120 characters.'),
  contactName: Yup.string().trim().max(120, 'Keep the name to 120 characters.'),
  contactEmail: Yup.string().trim().email('This is not an e-mail address.'),
  siteAddress: Yup.string().trim().max(400, 'Keep the address to 400 characters.'),
  startsOn: Yup.string().required('Pick the first day on site.'),
  endsOn: Yup.string()
    .required('Pick the last day on site.')
    .test('after-start', 'The last day cannot be before the first.', function (value) {
      const { startsOn } = this.parent as JobValues;
      return !value || !startsOn || value >= startsOn;
    }),
  notes: Yup.string().trim().max(4000, 'Keep the notes to 4000 characters.'),
  toleranceUm: Yup.string().when('toleranceKind', {
    is: 'fixed',
    then: (s) => s.test('um', 'Give the ± tolerance in micrometres, more than 0, e.g. 25.', (v) => isNumber(v) && Number(v) > 0),
  }),
  toleranceAUm: Yup.string().when('toleranceKind', {
    is: 'range',
    then: (s) => s.test('a', 'Give A in micrometres, 0 or more.', (v) => isNumber(v) && Number(v) >= 0),
  }),
  toleranceBUmPerM: Yup.string().when('toleranceKind', {
    is: 'range',
    then: (s) => s.test('b', 'Give B in micrometres per metre, 0 or more.', (v) => isNumber(v) && Number(v) >= 0),
  }),
  toleranceDistanceM: Yup.string().when('toleranceKind', {
    is: 'range',
    then: (s) => s.test('l', 'Say how far from the tracker the job measured (m).', (v) => isNumber(v) && Number(v) >= 0),
  }),
  toleranceNote: Yup.string().trim().max(200, 'Keep the note to 200 characters.'),
});

const toleranceKindOptions = [
  { value: '', label: 'Not recorded' },
  { value: 'fixed', label: '± value (µm)' },
  { value: 'range', label: 'A + B·L at a distance' },
];

function toleranceValues(job: SiteJobView | undefined): Pick<JobValues, Extract<keyof JobValues, `tolerance${string}`>> {
  const t = job?.tightestTolerance;
  return {
    toleranceKind: t?.tolerance.kind ?? '',
    toleranceUm: t?.tolerance.kind === 'fixed' ? String(t.tolerance.um) : '',
    toleranceAUm: t?.tolerance.kind === 'range' ? String(t.tolerance.aUm) : '',
    toleranceBUmPerM: t?.tolerance.kind === 'range' ? String(t.tolerance.bUmPerM) : '',
    toleranceDistanceM: t?.distanceM != null ? String(t.distanceM) : '',
    toleranceNote: t?.note ?? '',
  };
}

function tightestTolerance(values: JobValues): SiteJobInput['tightestTolerance'] {
  const note = orNull(values.toleranceNote);
  if (values.toleranceKind === 'fixed') return { tolerance: { kind: 'fixed', um: Number(values.toleranceUm) }, distanceM: null, note };
  if (values.toleranceKind === 'range')
    return {
      tolerance: { kind: 'range', aUm: Number(values.toleranceAUm), bUmPerM: Number(values.toleranceBUmPerM) },
      distanceM: Number(values.toleranceDistanceM),
      note,
    };
  return null;
}

function toValues(job: SiteJobView | undefined, defaults: Partial<JobValues>): JobValues {
  return {
    reference: job?.reference ?? '',
    customerName: job?.customerName ?? '',
    contactName: job?.contactName ?? '',
    contactEmail: job?.contactEmail ?? '',
    siteAddress: job?.siteAddress ?? '',
    startsOn: job?.startsOn ?? defaults.startsOn ?? '',
    endsOn: job?.endsOn ?? defaults.endsOn ?? '',
    leadTechnicianId: job?.leadTechnicianId ?? '',
    notes: job?.notes ?? '',
    ...toleranceValues(job),
  };
}

const orNull = (s: string) => (s.trim() ? s.trim() : null);

/** Add or change a customer site job. The lead technician is one of the firm's technicians (`technicians`), or me. */
export function JobForm({
  job,
  me,
  technicians,
  defaults = {},
  onSaved,
  onCancel,
  submitLabel,
}: {
  job?: SiteJobView;
  me: { id: string; name: string };
  technicians: { id: string; name: string }[];
  defaults?: { startsOn?: string; endsOn?: string };
  onSaved: (job: SiteJobView) => void;
  onCancel?: () => void;
  submitLabel?: string;
}) {
  const create = useCreateSiteJob();
  const update = useUpdateSiteJob();
  const [formError, setFormError] = useState<string>();

  const people = technicians.some((t) => t.id === me.id) ? technicians : [...technicians, me];
  const leadOptions = [
    { value: '', label: 'Nobody yet' },
    ...people.map((p) => ({ value: p.id, label: p.id === me.id ? `${p.name} (me)` : p.name })),
    ...(job?.leadTechnicianId && !people.some((p) => p.id === job.leadTechnicianId)
      ? [{ value: job.leadTechnicianId, label: 'The technician already chosen' }]
      : []),
  ];

  async function submit(values: JobValues, helpers: FormikHelpers<JobValues>) {
    setFormError(undefined);
    const input: SiteJobInput = {
      reference: values.reference.trim(),
      customerName: values.customerName.trim(),
      contactName: orNull(values.contactName),
      contactEmail: orNull(values.contactEmail),
      siteAddress: orNull(values.siteAddress),
      startsOn: values.startsOn,
      endsOn: values.endsOn,
      leadTechnicianId: values.leadTechnicianId || null,
      notes: orNull(values.notes),
      tightestTolerance: tightestTolerance(values),
    };
    try {
      const saved = job ? await update.mutateAsync({ id: job.id, ...input }) : await create.mutateAsync(input);
      onSaved(saved);
    } catch (error) {
      setFormError(applyServerErrors(error, helpers, { fields, labels }));
    }
  }

  return (
    <Formik initialValues={toValues(job, defaults)} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting, values }) => (
        <Form noValidate className="flex flex-col gap-3" aria-label={job ? `Change job ${job.reference}` : 'New job'}>
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field name="reference" label="Reference" mono autoComplete="off" />
            <Field name="customerName" label="Customer name" autoComplete="off" />
            <Field name="contactName" label="Contact" autoComplete="off" />
            <Field name="contactEmail" label="E-mail" type="email" autoComplete="off" />
            <Field name="siteAddress" label="Site address" className="sm:col-span-2" autoComplete="off" />
            <DateField name="startsOn" label="First day on site" />
            <DateField name="endsOn" label="Last day on site" />
            <SelectField name="leadTechnicianId" label="Lead technician" options={leadOptions} />
            <Field name="notes" label="Notes" className="sm:col-span-2" autoComplete="off" />
          </div>
          <fieldset className="grid gap-3 rounded-md border border-paper-line p-3 sm:grid-cols-2">
            <legend className="px-1 text-sm font-semibold text-ink-800">Tightest tolerance measured (optional)</legend>
            <p className="text-sm text-ink-700 sm:col-span-2">
              If an instrument is later found out of tolerance, the impact review weighs its error against this figure.
            </p>
            <SelectField name="toleranceKind" label="Tolerance" options={toleranceKindOptions} />
            {values.toleranceKind === 'fixed' ? <Field name="toleranceUm" label="± tolerance (µm)" inputMode="decimal" autoComplete="off" /> : null}
            {values.toleranceKind === 'range' ? (
              <>
                <Field name="toleranceAUm" label="A (µm)" inputMode="decimal" autoComplete="off" />
                <Field name="toleranceBUmPerM" label="B (µm/m)" inputMode="decimal" autoComplete="off" />
                <Field name="toleranceDistanceM" label="Distance from the tracker (m)" inputMode="decimal" autoComplete="off" />
              </>
            ) : null}
            {values.toleranceKind ? (
              <Field name="toleranceNote" label="Which feature" hint="e.g. bore position ±25 µm" className="sm:col-span-2" autoComplete="off" />
            ) : null}
          </fieldset>
          <div className="flex flex-wrap gap-2">
            <Button type="submit" variant="primary" busy={isSubmitting}>
              {submitLabel ?? (job ? 'Save job' : 'Add job')}
            </Button>
            {onCancel ? (
              <Button variant="quiet" onClick={onCancel}>
                Cancel
              </Button>
            ) : null}
          </div>
        </Form>
      )}
    </Formik>
  );
}
