import { Form, Formik } from 'formik';
import { useId, useMemo } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';

function isTimeZone(value: string | undefined): boolean {
  if (!value) return false;
  try {
    new Intl.DateTimeFormat('en', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

const schema = Yup.object({
  dueSoonDays: Yup.number()
    .typeError('Enter a number of days.')
    .required('Enter a number of days.')
    .integer('Use whole days.')
    .min(1, 'Use at least 1 day.')
    .max(365, 'Use at most 365 days.'),
  checkoutOpensDaysBefore: Yup.number()
    .typeError('Enter a number of days.')
    .required('Enter a number of days.')
    .integer('Use whole days.')
    .min(0, 'Use 0 or more days.')
    .max(365, 'Use at most 365 days.'),
  timeZone: Yup.string().trim().required('Enter a time zone.').test('tz', 'Use a time zone name such as Europe/Berlin.', isTimeZone),
});

type Values = { dueSoonDays: number | ''; checkoutOpensDaysBefore: number | ''; timeZone: string };

export function SettingsForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  const listId = useId();
  const zones = useMemo(() => {
    const intl = Intl as unknown as { supportedValuesOf?: (key: string) => string[] };
    return intl.supportedValuesOf?.('timeZone') ?? [];
  }, []);

  return (
    <Formik<Values>
      initialValues={{ dueSoonDays: settings.dueSoonDays, checkoutOpensDaysBefore: settings.checkoutOpensDaysBefore, timeZone: settings.timeZone }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save(
          { dueSoonDays: Number(values.dueSoonDays), checkoutOpensDaysBefore: Number(values.checkoutOpensDaysBefore), timeZone: values.timeZone.trim() },
          helpers,
          {
            fields: ['dueSoonDays', 'checkoutOpensDaysBefore', 'timeZone'],
            labels: { dueSoonDays: 'The due-soon window', checkoutOpensDaysBefore: 'Checkout opens', timeZone: 'The time zone' },
          },
        )
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Settings" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          {saved ? <Notice tone="success">Settings saved. Due states everywhere now use them.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <Field
            name="dueSoonDays"
            label="Due-soon window (days)"
            type="number"
            inputMode="numeric"
            min={1}
            max={365}
            step={1}
            hint="An item whose calibration runs out within this many days shows as “Due soon”."
          />
          <Field
            name="checkoutOpensDaysBefore"
            label="Checkout opens (days before the start)"
            type="number"
            inputMode="numeric"
            min={0}
            max={365}
            step={1}
            hint="Kit can be handed over this many days before its booking starts. Earlier needs a reason, which the booking keeps."
          />
          <Field name="timeZone" label="Time zone" list={listId} autoComplete="off" hint="Dates, due dates and “today” are worked out in this zone." />
          <datalist id={listId}>
            {zones.map((z) => (
              <option key={z} value={z} />
            ))}
          </datalist>
          <p className="text-sm text-ink-700">Currency: {settings.currency} (set when the firm was created).</p>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save settings
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
