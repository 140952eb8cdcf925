import { Form, Formik, useFormikContext } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { AlertIcon, PlusIcon } from '../../../components/icons';
import { Notice } from '../../../components/notice';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

/** What the server allows (shared/schemas/assets.ts, organizationSettingsPayload.providers). */
const MAX_PROVIDERS = 50;
const MAX_NAME = 120;
/** The turnaround the window finder uses for a provider not on the list (server/organizations/org-context.ts). */
const DEFAULT_TURNAROUND_DAYS = 14;

type ProviderValues = { name: string; turnaroundDays: number | '' };
type Values = { providers: ProviderValues[] };

const turnaroundMessage = 'Enter whole days from 1 to 180.';

const schema = Yup.object({
  providers: Yup.array()
    .of(
      Yup.object({
        name: Yup.string().trim().required('Enter the provider’s name.').max(MAX_NAME, `Use at most ${MAX_NAME} characters.`),
        turnaroundDays: Yup.number()
          .typeError(turnaroundMessage)
          .required(turnaroundMessage)
          .integer(turnaroundMessage)
          .min(1, turnaroundMessage)
          .max(180, turnaroundMessage),
      }),
    )
    .max(MAX_PROVIDERS, `List at most ${MAX_PROVIDERS} providers.`)
    // The window finder looks a provider up by name, so two rows with one name would be ambiguous.
    .test('unique-names', 'Each provider needs a different name.', function (rows) {
      const seen = new Set<string>();
      for (const [i, row] of (rows ?? []).entries()) {
        const key = (row?.name ?? '').trim().toLowerCase();
        if (!key) continue;
        if (seen.has(key)) return this.createError({ path: `providers.${i}.name`, message: 'Another row already has this name.' });
        seen.add(key);
      }
      return true;
    }),
});

const emptyRow = (): ProviderValues => ({ name: '', turnaroundDays: '' });

function ProviderRows() {
  const { values, setFieldValue, errors } = useFormikContext<Values>();
  const rows = values.providers;
  const listError = typeof errors.providers === 'string' ? errors.providers : undefined;
  return (
    <fieldset className="flex min-w-0 flex-col gap-2">
      <legend className="mb-1 font-semibold">Providers</legend>
      {rows.length === 0 ? <p className="text-sm text-ink-700">No providers listed yet.</p> : null}
      <ol className="flex flex-col gap-3">
        {rows.map((_, i) => (
          <li key={i} className="grid items-start gap-2 sm:grid-cols-[1fr_10rem_auto]">
            <Field
              name={`providers.${i}.name`}
              label={
                <>
                  Provider name<span className="sr-only"> {i + 1}</span>
                </>
              }
              autoComplete="off"
              maxLength={MAX_NAME}
            />
            <Field
              name={`providers.${i}.turnaroundDays`}
              label={
                <>
                  Turnaround (days)<span className="sr-only"> {i + 1}</span>
                </>
              }
              type="number"
              inputMode="numeric"
              min={1}
              max={180}
              step={1}
            />
            <Button
              variant="quiet"
              className="sm:mt-6"
              aria-label={`Remove provider ${i + 1}`}
              onClick={() =>
                void setFieldValue(
                  'providers',
                  rows.filter((__, j) => j !== i),
                )
              }
            >
              Remove
            </Button>
          </li>
        ))}
      </ol>
      {listError ? (
        <p className="flex items-start gap-1 text-sm text-bad">
          <AlertIcon size={14} className="mt-0.5 shrink-0" />
          <span>{listError}</span>
        </p>
      ) : null}
      <div>
        <Button
          size="sm"
          icon={<PlusIcon size={14} />}
          disabled={rows.length >= MAX_PROVIDERS}
          onClick={() => void setFieldValue('providers', [...rows, emptyRow()])}
        >
          Add a provider
        </Button>
      </div>
    </fieldset>
  );
}

/** The calibration labs the firm uses and each one's usual turnaround, for planning lab trips (owner only). */
export function ProvidersForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  if (!settings.providers) {
    return <Notice tone="info">This server does not offer calibration provider settings yet.</Notice>;
  }
  return (
    <Formik<Values>
      initialValues={{ providers: settings.providers.map((p) => ({ name: p.name, turnaroundDays: p.turnaroundDays })) }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save({ providers: values.providers.map((p) => ({ name: p.name.trim(), turnaroundDays: Number(p.turnaroundDays) })) }, helpers, {
          fields: ['providers', ...values.providers.flatMap((_, i) => [`providers.${i}.name`, `providers.${i}.turnaroundDays`])],
          labels: Object.fromEntries(
            values.providers.flatMap((_, i) => [
              [`providers.${i}.name`, 'The name'],
              [`providers.${i}.turnaroundDays`, 'The turnaround'],
            ]),
          ),
        })
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Calibration providers" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Calibration providers" />
          {saved ? <Notice tone="success">Saved. Lab trips are now planned with these turnarounds.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <p className="text-sm text-ink-700">
            The window finder keeps an item free for its provider&rsquo;s turnaround; a provider not listed here gets {DEFAULT_TURNAROUND_DAYS} days.
          </p>
          <ProviderRows />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save providers
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
