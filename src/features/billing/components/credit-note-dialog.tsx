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
import { creditNoteAmounts } from '../../../../shared/billing/settlement';
import type { InvoiceSummary } from '../../../../shared/billing/views';

/** Credit part of an invoice (net of tax) or, with no amount, all of it. The invoice itself never changes. */
export function CreditNoteDialog({ invoice, mailTo, open, onClose }: { invoice: InvoiceSummary; mailTo: string; open: boolean; onClose: () => void }) {
  const create = useCreateCreditNote();
  const [problem, setProblem] = useState<string>();
  /** Set once the form is filled: the dialog then says what will be issued and asks once. */
  const [review, setReview] = useState<{ reason: string; amountMinor: number | undefined } | null>(null);
  const left = creditNoteAmounts(invoice).leftMinor;
  const { currency } = invoice;
  const digits = currencyDigits(currency);
  const schema = Yup.object({
    reason: Yup.string().trim().required('Say why the invoice is credited; the customer sees it.').max(500, 'Keep the reason to 500 characters.'),
    amount: Yup.string()
      .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(5000, digits)}, or leave it empty.`, (v) => !v?.trim() || !!parseAmount(v, digits))
      .test('within', `At most ${formatMoney(left, currency)} (net) of the invoice is left to credit.`, (v) => (parseAmount(v ?? '', digits) ?? 0) <= left),
  });
  const close = () => {
    setProblem(undefined);
    setReview(null);
    onClose();
  };
  const credit = review ? creditNoteAmounts(invoice, review.amountMinor) : null;
  return (
    <Dialog
      open={open}
      onClose={close}
      title="Credit note"
      description={
        review && credit?.netMinor ? (
          <p className="text-base text-ink-900">
            {`A credit note of ${formatMoney(credit.totalMinor, currency)} (${formatMoney(credit.netMinor, currency)} + ${formatMoney(credit.taxMinor, currency)} tax) against invoice ${invoice.number} is issued; it is mailed with its PDF to ${mailTo}.`}
          </p>
        ) : (
          `Against invoice ${invoice.number}: ${formatMoney(left, currency)} net of tax left to credit.`
        )
      }
    >
      <Formik
        initialValues={{ reason: '', amount: '' }}
        validationSchema={schema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          const amountMinor = values.amount.trim() ? (parseAmount(values.amount, digits) ?? undefined) : undefined;
          // First the form, then one question with the figures; the second submit issues it.
          if (!review) return setReview({ reason: values.reason.trim(), amountMinor });
          try {
            await create.mutateAsync({ invoiceId: invoice.id, ...review });
            close();
          } catch (error) {
            setReview(null);
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
            <div className={review ? 'hidden' : 'flex flex-col gap-3'}>
              <Field name="reason" label="Reason" autoComplete="off" />
              <Field
                name="amount"
                label={`Amount, net of tax (${currency})`}
                inputMode="decimal"
                autoComplete="off"
                hint="Leave empty to credit all that is left."
              />
            </div>
            <div className="flex flex-wrap justify-end gap-2">
              {review ? <Button onClick={() => setReview(null)}>Change</Button> : <Button onClick={close}>Cancel</Button>}
              <Button type="submit" variant="primary" busy={isSubmitting}>
                {review && credit?.netMinor ? `Issue credit note of ${formatMoney(credit.totalMinor, currency)}` : 'Review the credit note'}
              </Button>
            </div>
          </Form>
        )}
      </Formik>
    </Dialog>
  );
}
