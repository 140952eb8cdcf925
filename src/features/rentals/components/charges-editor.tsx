import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import type { RentalChargeView, RentalView } from '../../../../shared/billing/views';
import { incidentKindTitles, type IncidentKind } from '../../../../shared/incidents/vocabulary';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { currencyDigits, formatMoney } from '../../../lib/format';
import { amountText, parseAmount } from '../../../lib/money';
import { useSetCharge } from '../api/set-charge';

/** Repair or replacement charges (net of tax) for what came back damaged or did not come back. */
export function ChargesEditor({ rental, canCharge }: { rental: RentalView; canCharge: boolean }) {
  if (!rental.charges.length) return <p className="text-sm text-ink-700">Nothing came back damaged or missing: no charges.</p>;
  return (
    <section aria-labelledby="charges-heading" className="flex flex-col gap-2">
      <h3 id="charges-heading" className="font-semibold text-ink-900">
        Damage and loss charges
      </h3>
      <ul className="flex flex-col gap-2">
        {rental.charges.map((charge) => (
          <li key={charge.incidentId} className="rounded-md border border-paper-line bg-card p-3">
            <p className="text-sm">
              <span className="font-mono font-semibold">{charge.assetTag}</span>{' '}
              <span className="text-ink-700">({incidentKindTitles[charge.kind as IncidentKind] ?? 'damage or loss'})</span> {charge.description}
            </p>
            {canCharge && rental.state !== 'invoiced' ? (
              <ChargeForm rentalId={rental.id} charge={charge} currency={rental.currency} />
            ) : (
              <p className="mt-1 text-sm">Charge, net of tax: {formatMoney(charge.amountMinor, rental.currency)}</p>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function ChargeForm({ rentalId, charge, currency }: { rentalId: string; charge: RentalChargeView; currency: string }) {
  const save = useSetCharge();
  const [problem, setProblem] = useState<string>();
  const digits = currencyDigits(currency);
  const schema = Yup.object({
    amount: Yup.string()
      .required('Give the charge; 0 if there is nothing to charge.')
      .test('amount', `Enter an amount in ${currency}, e.g. ${amountText(12000, digits)}.`, (v) => !v || parseAmount(v, digits) !== null),
  });
  return (
    <Formik
      initialValues={{ amount: charge.amountMinor === null ? '' : amountText(charge.amountMinor, digits) }}
      enableReinitialize
      validationSchema={schema}
      onSubmit={async ({ amount }, helpers) => {
        setProblem(undefined);
        try {
          await save.mutateAsync({ rentalId, incidentId: charge.incidentId, amountMinor: parseAmount(amount, digits) ?? 0 });
        } catch (error) {
          setProblem(applyServerErrors(error, helpers, { fields: ['amount'], aliases: { amountMinor: 'amount' } }));
        }
      }}
    >
      {({ isSubmitting, dirty }) => (
        <Form noValidate className="mt-2 flex flex-wrap items-end gap-2">
          <Field name="amount" label={`Charge for ${charge.assetTag}, net of tax (${currency})`} inputMode="decimal" autoComplete="off" className="min-w-56" />
          <Button type="submit" busy={isSubmitting} disabled={!dirty && charge.amountMinor !== null}>
            Save charge
          </Button>
          {problem ? (
            <Notice tone="error" className="w-full">
              {problem}
            </Notice>
          ) : null}
        </Form>
      )}
    </Formik>
  );
}
