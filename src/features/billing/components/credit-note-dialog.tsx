import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits, formatMoney } from '../../../lib/format';
import { amountText, parseAmount } from '../../../lib/money';
import { useCreateCreditNote } from '../api/create-credit-note';
import type { InvoiceSummary } from '../../../../shared/billing/views';

/** Credit part of an invoice (net of tax) or, with no amount, all of it. The invoice itself never changes. */
export function CreditNoteDialog({ invoice, open, onClose }: { invoice: InvoiceSummary; open: boolean; onClose: () => void }) {
  const create = useCreateCreditNote();
  const [problem, setProblem] = useState<string>();
  const { currency } = invoice;
  const digits = currencyDigits(currency);
  const schema = Yup.object({
    reason: Yup.string().trim().required('Say why the invoice is credited; the customer sees it.').max(500, 'Keep the reason to 500 characters.'),
    amount: Yup.string()
      .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(5000, digits)}, or leave it empty.`, (v) => !v?.trim() || !!parseAmount(v, digits))
      .test(
        'within',
        `A credit note cannot exceed the invoice's ${formatMoney(invoice.subtotalMinor, currency)} net.`,
        (v) => (parseAmount(v ?? '', digits) ?? 0) <= invoice.subtotalMinor,
      ),
  });
  const close = () => {
    setProblem(undefined);
    onClose();
  };
  return (
    <Dialog
      open={open}
      onClose={close}
      title="Credit note"
      description={`Against invoice ${invoice.number} (${formatMoney(invoice.subtotalMinor, currency)} net of tax).`}
    >
      <Formik
        initialValues={{ reason: '', amount: '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          const amountMinor = values.amount.trim() ? (parseAmount(values.amount, digits) ?? undefined) : undefined;
          try {
            await create.mutateAsync({ invoiceId: invoice.id, reason: values.reason.trim(), amountMinor });
            close();
          } catch (error) {
            setProblem(applyServerErrors(error, helpers, { fields: ['reason', 'amount'], aliases: { amountMinor: 'amount' } }));
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate className="flex flex-col gap-3">
            {problem ? (
              <Notice tone="error" title="No credit note was issued">
                {problem}
              </Notice>
            ) : null}
            <Field name="reason" label="Reason" autoComplete="off" />
            <Field
              name="amount"
              label={`Amount, net of tax (${currency})`}
              inputMode="decimal"
              autoComplete="off"
              hint="Leave empty to credit the whole invoice."
            />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={close}>Cancel</Button>
              <Button type="submit" variant="primary" busy={isSubmitting}>
                Issue credit note
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
