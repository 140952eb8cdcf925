import { Form, Formik, type FormikHelpers } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCreateCustomer, type CustomerInput } from '../api/create-customer';
import type { CustomerView } from '../../../../shared/billing/views';
import { useUpdateCustomer } from '../api/update-customer';
import { SaveOrCancel } from './save-or-cancel';

type CustomerValues = Record<keyof CustomerInput, string>;

const fields = ['company', 'billingContact', 'billingEmail', 'address', 'taxNumber', 'notes'] as const satisfies readonly (keyof CustomerValues)[];
const labels = {
  company: 'Company',
  billingContact: 'Billing contact',
  billingEmail: 'Billing e-mail',
  address: 'Address',
  taxNumber: 'Tax number',
  notes: 'Notes',
};

const schema = Yup.object({
  company: Yup.string().trim().required('Give the company name.').max(160, 'Keep the name to 160 characters.'),
  billingContact: Yup.string().trim().max(120, 'Keep the name to 120 characters.'),
  billingEmail: Yup.string().trim().required('Invoices go to this address: give one.').email('This is not an e-mail address.'),
  address: Yup.string().trim().max(400, 'Keep the address to 400 characters.'),
  taxNumber: Yup.string().trim().max(40, 'Keep the tax number to 40 characters.'),
  notes: Yup.string().trim().max(4000, 'Keep the notes to 4000 characters.'),
});

const orNull = (s: string) => s.trim() || null;

/** Add or change a customer who rents kit. A company name is used once. */
export function CustomerForm({ customer, onSaved, onCancel }: { customer?: CustomerView; onSaved: (customer: CustomerView) => void; onCancel: () => void }) {
  const create = useCreateCustomer();
  const update = useUpdateCustomer();
  const [formError, setFormError] = useState<string>();
  const initialValues: CustomerValues = {
    company: customer?.company ?? '',
    billingContact: customer?.billingContact ?? '',
    billingEmail: customer?.billingEmail ?? '',
    address: customer?.address ?? '',
    taxNumber: customer?.taxNumber ?? '',
    notes: customer?.notes ?? '',
  };

  async function submit(values: CustomerValues, helpers: FormikHelpers<CustomerValues>) {
    setFormError(undefined);
    const input: CustomerInput = {
      company: values.company.trim(),
      billingContact: orNull(values.billingContact),
      billingEmail: values.billingEmail.trim(),
      address: orNull(values.address),
      taxNumber: orNull(values.taxNumber),
      notes: orNull(values.notes),
    };
    try {
      onSaved(customer ? await update.mutateAsync({ id: customer.id, ...input }) : await create.mutateAsync(input));
    } catch (error) {
      setFormError(applyServerErrors(error, helpers, { fields, labels, byCode: { conflict: 'company' } }));
    }
  }

  return (
    <Formik initialValues={initialValues} validationSchema={schema} onSubmit={submit}>
      {({ isSubmitting }) => (
        <Form noValidate className="flex flex-col gap-3" aria-label={customer ? `Change ${customer.company}` : 'New customer'}>
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field name="company" label={labels.company} autoComplete="off" placeholder="e.g. Quillmoor Fabrication" />
            <Field name="billingEmail" label={labels.billingEmail} type="email" mono autoComplete="off" placeholder="accounts@example.com" />
            <Field name="billingContact" label={labels.billingContact} autoComplete="off" />
            <Field name="taxNumber" label={labels.taxNumber} mono autoComplete="off" />
            <Field name="address" label={labels.address} className="sm:col-span-2" autoComplete="off" />
            <Field name="notes" label={labels.notes} className="sm:col-span-2" autoComplete="off" />
          </div>
          <SaveOrCancel label={customer ? 'Save customer' : 'Add customer'} busy={isSubmitting} onCancel={onCancel} />
        </Form>
      )}
    </Formik>
  );
}
