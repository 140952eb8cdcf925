import { Form, Formik } from 'formik';
import { useState, type ReactNode } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { FactList } from '../../../components/panel';
import { currencyDigits, formatMoney } from '../../../lib/format';
import { amountText, parseAmount } from '../../../lib/money';
import { useCaptureDeposit } from '../api/capture-deposit';
import { useReleaseDeposit } from '../api/release-deposit';
import { captureSplit } from '../../../../shared/billing/settlement';
import type { DepositAuthorizationView, RentalView } from '../../../../shared/billing/views';
import { MoneyConfirmation } from './money-confirmation';

/** What the hold is there to cover, in words, as the reason the clerk starts from. */
function suggestedReason(rental: RentalView): string {
  const late = rental.settlement.lateDays;
  const parts = [
    late > 0 ? `Late return, ${late} ${late === 1 ? 'day' : 'days'}` : '',
    ...rental.charges.filter((c) => c.amountMinor).map((c) => `${c.assetTag} ${c.kind}`),
  ];
  return parts.filter(Boolean).join('; ');
}

/** At return: set the charges, then capture what the extras come to (the rest is released) or release the whole hold. */
export function SettleDeposit({ rental, hold, charges }: { rental: RentalView; hold: DepositAuthorizationView; charges: ReactNode }) {
  const capture = useCaptureDeposit();
  const release = useReleaseDeposit();
  const [asking, setAsking] = useState<{ amountMinor: number; reason: string } | 'release' | null>(null);
  const { currency, settlement } = rental;
  const digits = currencyDigits(currency);
  const money = (minor: number) => formatMoney(minor, currency);
  const suggested = Math.min(hold.amountMinor, settlement.extrasGrossMinor);
  const schema = Yup.object({
    amount: Yup.string()
      .required('Give the amount to capture.')
      .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(suggested || 5000, digits)}.`, (v) => !v || parseAmount(v, digits) !== null)
      .test('some', 'To capture nothing, release the whole authorization instead.', (v) => !v || parseAmount(v, digits) !== 0),
    reason: Yup.string().trim().required('Say what the amount is for; the renter sees it.').max(500, 'Keep the reason to 500 characters.'),
  });

  const mailTo = `the customer is told by mail at ${rental.customer.billingEmail}`;
  return (
    <section aria-labelledby="settle-heading" className="flex flex-col gap-3 rounded-md border border-brass-deep/40 bg-brass-wash/40 p-3">
      <h3 id="settle-heading" className="font-semibold text-ink-900">
        Settle the deposit
      </h3>
      {charges}
      <FactList
        items={[
          { term: 'Late days', value: settlement.lateDays ? `${settlement.lateDays} (day rate plus late fee each)` : 'None: back on time' },
          { term: 'Extras with tax', value: money(settlement.extrasGrossMinor) },
          { term: 'Authorized on the card', value: money(hold.amountMinor) },
        ]}
      />
      <Formik
        initialValues={{ amount: amountText(suggested, digits), reason: suggestedReason(rental) }}
        enableReinitialize
        validationSchema={schema}
        // The form only asks; the confirmation says what will happen and acts.
        onSubmit={(values) => setAsking({ amountMinor: parseAmount(values.amount, digits) ?? 0, reason: values.reason.trim() })}
      >
        {({ values }) => {
          const amount = parseAmount(values.amount, digits);
          return (
            <Form noValidate className="flex flex-col gap-3" aria-label="Settle the deposit">
              <div className="grid gap-3 sm:grid-cols-2">
                <Field
                  name="amount"
                  label={`Amount to capture (${currency})`}
                  inputMode="decimal"
                  autoComplete="off"
                  hint={captureHint(amount, hold.amountMinor, money)}
                />
                <Field name="reason" label="Reason" autoComplete="off" />
              </div>
              <div className="flex flex-wrap gap-2">
                <Button type="submit" variant="primary">
                  Capture and release the rest
                </Button>
                <Button variant="secondary" onClick={() => setAsking('release')}>
                  Release the whole authorization
                </Button>
              </div>
            </Form>
          );
        }}
      </Formik>
      {asking === 'release' ? (
        <MoneyConfirmation
          open
          onClose={() => setAsking(null)}
          title="Release the card authorization"
          what={`${money(hold.amountMinor)} released, nothing captured`}
          mailTo={mailTo}
          confirmLabel={`Release ${money(hold.amountMinor)}`}
          onConfirm={() => release.mutateAsync(rental.id)}
        />
      ) : asking ? (
        <MoneyConfirmation
          open
          onClose={() => setAsking(null)}
          title="Capture from the card authorization"
          what={captureWords(asking.amountMinor, hold.amountMinor, money)}
          mailTo={mailTo}
          confirmLabel={`Capture ${money(asking.amountMinor)}`}
          onConfirm={() => capture.mutateAsync({ rentalId: rental.id, ...asking })}
        />
      ) : null}
    </section>
  );
}

/** "€214.20 captured, €285.80 released" (and what goes on the saved card above the authorization): the split the server makes. */
function captureWords(amountMinor: number, authorizedMinor: number, money: (minor: number) => string): string {
  const split = captureSplit(amountMinor, authorizedMinor);
  return [
    `${money(split.fromAuthorizationMinor)} captured`,
    split.chargedMinor ? `${money(split.chargedMinor)} charged to the saved card` : '',
    `${money(split.releasedMinor)} released`,
  ]
    .filter(Boolean)
    .join(', ');
}

function captureHint(amount: number | null, heldMinor: number, money: (minor: number) => string): string | undefined {
  if (amount === null || amount === 0) return undefined;
  return `${captureWords(amount, heldMinor, money)}.`;
}
