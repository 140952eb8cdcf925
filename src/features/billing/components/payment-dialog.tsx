import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { DateField } from '../../../components/date-field';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits, formatMoney } from '../../../lib/format';
import { amountText, parseAmount } from '../../../lib/money';
import { useRecordPayment } from '../api/record-payment';
import type { InvoiceSummary } from '../../../../shared/billing/views';

/** Record money received against an invoice; at most what is outstanding. Payments are kept, never edited. */
export function PaymentDialog({ invoice, today, open, onClose }: { invoice: InvoiceSummary; today: string; open: boolean; onClose: () => void }) {
  const record = useRecordPayment();
  const [problem, setProblem] = useState<string>();
  const { currency } = invoice;
  const digits = currencyDigits(currency);
  const schema = Yup.object({
    amount: Yup.string()
      .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(invoice.outstandingMinor, digits)}.`, (v) => !!parseAmount(v ?? '', digits))
      .test(
        'within',
        `At most the ${formatMoney(invoice.outstandingMinor, currency)} outstanding.`,
        (v) => (parseAmount(v ?? '', digits) ?? 0) <= invoice.outstandingMinor,
      ),
    receivedOn: Yup.string()
      .required('Say when it arrived.')
      .matches(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.'),
    reference: Yup.string().trim().min(2, 'Say where it came from, e.g. the bank reference.').max(200, 'Keep it under 200 characters.'),
  });
  const close = () => {
    setProblem(undefined);
    onClose();
  };
  return (
    <Dialog
      open={open}
      onClose={close}
      title="Record a payment"
      description={`Against invoice ${invoice.number}: ${formatMoney(invoice.outstandingMinor, currency)} outstanding.`}
    >
      <Formik
        initialValues={{ amount: amountText(invoice.outstandingMinor, digits), receivedOn: today, reference: '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          try {
            await record.mutateAsync({
              invoiceId: invoice.id,
              amountMinor: parseAmount(values.amount, digits)!,
              receivedOn: values.receivedOn,
              reference: values.reference.trim(),
            });
            close();
          } catch (error) {
            setProblem(applyServerErrors(error, helpers, { fields: ['amount', 'receivedOn', 'reference'], aliases: { amountMinor: 'amount' } }));
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate className="flex flex-col gap-3">
            {problem ? (
              <Notice tone="error" title="The payment was not recorded">
                {problem}
              </Notice>
            ) : null}
            <Field name="amount" label={`Amount received (${currency})`} inputMode="decimal" autoComplete="off" />
            <DateField name="receivedOn" label="Received on" />
            <Field name="reference" label="Reference" autoComplete="off" hint="The payer's reference or the bank statement line." />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={close}>Cancel</Button>
              <Button type="submit" variant="primary" busy={isSubmitting}>
                Record payment
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
