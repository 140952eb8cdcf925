import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

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
});

type Values = { dueSoonDays: number | ''; checkoutOpensDaysBefore: number | '' };

/** When items count as due soon and how early kit may be handed over. */
export function SettingsForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();

  return (
    <Formik<Values>
      initialValues={{ dueSoonDays: settings.dueSoonDays, checkoutOpensDaysBefore: settings.checkoutOpensDaysBefore }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save({ dueSoonDays: Number(values.dueSoonDays), checkoutOpensDaysBefore: Number(values.checkoutOpensDaysBefore) }, helpers, {
          fields: ['dueSoonDays', 'checkoutOpensDaysBefore'],
          labels: { dueSoonDays: 'The due-soon window', checkoutOpensDaysBefore: 'Checkout opens' },
        })
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Due dates and checkout" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Due dates and checkout" />
          {saved ? <Notice tone="success">Saved. Due states everywhere now use them.</Notice> : null}
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
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save due dates and checkout
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
