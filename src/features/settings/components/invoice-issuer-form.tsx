import { Form, Formik } from 'formik';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import type { InvoiceIssuer, OrganizationSettingsView } from '../../../../shared/organizations/views';
import { useSettingsSave } from '../api/use-settings-save';
import { ReportUnsaved } from './unsaved-changes';

const fields = ['address', 'taxNumber', 'paymentTerms', 'paymentDays', 'bankDetails'] as const;
type Values = Omit<InvoiceIssuer, 'paymentDays'> & { paymentDays: string };

const schema = Yup.object({
  address: Yup.string().trim().required('Invoices must say where the firm is.').max(400, 'Keep it under 400 characters.'),
  taxNumber: Yup.string().trim().max(40, 'Keep it under 40 characters.'),
  paymentTerms: Yup.string().trim().max(600, 'Keep it under 600 characters.'),
  paymentDays: Yup.string()
    .trim()
    .required('Give the days allowed; 0 means due on receipt.')
    .matches(/^\d{1,3}$/, 'Enter whole days from 0 to 365.')
    .test('range', 'Enter whole days from 0 to 365.', (v) => Number(v) <= 365),
  bankDetails: Yup.string().trim().max(600, 'Keep it under 600 characters.'),
});

/** The firm as its invoices and credit notes name it (owner only); each invoice keeps the details it was issued with. */
export function InvoiceIssuerForm({ settings }: { settings: OrganizationSettingsView }) {
  const { save, saved, problem } = useSettingsSave();
  if (!settings.issuer) return <Notice tone="info">This server does not offer invoice details yet.</Notice>;
  return (
    <Formik<Values>
      initialValues={{ ...settings.issuer, paymentDays: String(settings.issuer.paymentDays ?? 30), bankDetails: settings.issuer.bankDetails ?? '' }}
      validationSchema={schema}
      enableReinitialize
      onSubmit={(values, helpers) =>
        save(
          {
            issuer: {
              address: values.address.trim(),
              taxNumber: values.taxNumber.trim(),
              paymentTerms: values.paymentTerms.trim(),
              paymentDays: Number(values.paymentDays.trim()),
              bankDetails: values.bankDetails.trim(),
            },
          },
          helpers,
          {
            fields,
            aliases: Object.fromEntries(fields.map((f) => [`issuer.${f}`, f])),
          },
        )
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
            hint="Any further words on paying, printed under “How to pay” (the due date and bank details are printed from the fields below)."
          />
          <Field
            name="paymentDays"
            label="Days to pay"
            inputMode="numeric"
            autoComplete="off"
            className="sm:max-w-xs"
            hint="Each invoice's due date is its issue date plus these days; 0 means due on receipt."
          />
          <Field
            name="bankDetails"
            label="Bank details"
            autoComplete="off"
            hint="Account holder, IBAN and BIC (or your country's equivalent), printed on every invoice."
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
