import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { InvoiceIssuer, OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

const fields = ['address', 'taxNumber', 'paymentTerms'] as const;

const schema = Yup.object({
  address: Yup.string().trim().required('Invoices must say where the firm is.').max(400, 'Keep it under 400 characters.'),
  taxNumber: Yup.string().trim().max(40, 'Keep it under 40 characters.'),
  paymentTerms: Yup.string().trim().max(600, 'Keep it under 600 characters.'),
});

/** The firm as its invoices and credit notes name it (owner only); each invoice keeps the details it was issued with. */
export function InvoiceIssuerForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  if (!settings.issuer) return <Notice tone="info">This server does not offer invoice details yet.</Notice>;
  return (
    <Formik<InvoiceIssuer>
      initialValues={settings.issuer}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save({ issuer: { ...values, address: values.address.trim(), taxNumber: values.taxNumber.trim(), paymentTerms: values.paymentTerms.trim() } }, helpers, {
          fields,
          aliases: Object.fromEntries(fields.map((f) => [`issuer.${f}`, f])),
        })
      }
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate aria-label="Invoice details" className="flex max-w-xl flex-col gap-4 rounded-lg border border-paper-line bg-card p-4">
          <ReportUnsaved section="Invoice details" />
          {saved ? <Notice tone="success">Saved. Invoices issued from now on carry these details; issued ones keep theirs.</Notice> : null}
          {problem ? (
            <Notice tone="error" title="Not saved">
              {problem}
            </Notice>
          ) : null}
          <Field name="address" label="Address on invoices" autoComplete="street-address" />
          <Field name="taxNumber" label="Your tax number" autoComplete="off" hint="As your tax office gave it; printed on every invoice." />
          <Field
            name="paymentTerms"
            label="Payment terms"
            autoComplete="off"
            hint="How and by when to pay the balance, e.g. the days allowed and your bank details."
          />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting} disabled={!dirty}>
              Save invoice details
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
