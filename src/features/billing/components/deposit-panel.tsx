import { Form, Formik } from 'formik';
import { useState, type ReactNode } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { DepositStateChip, AuthorizationLapse } from '../../../components/deposit-state';
import { SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { FactList, Panel } from '../../../components/panel';
import { TableHead } from '../../../components/table-head';
import { formatMoney, useFirmFormat } from '../../../lib/format';
import { usePaymentMode } from '../api/get-payment-mode';
import { useTakeDeposit } from '../api/take-deposit';
import { DepositRequest } from './deposit-request';
import { testCards, type DepositAuthorizationView, type RentalView } from '../../../../shared/billing/views';
import { paymentProblem } from './payment-problem';
import { MoneyMails } from './money-mails';
import { SettleDeposit } from './settle-deposit';
import { ScrollBox } from '../../../components/scroll-box';

const brand = (name: string | null) => (name ? name[0].toUpperCase() + name.slice(1) : 'Card');
const card = (hold: DepositAuthorizationView | null) => (hold?.cardLast4 ? `${brand(hold.cardBrand)} ending ${hold.cardLast4}` : null);

/** The rental's deposit: the card authorization on the renter's card, taking it, and settling it at return (`charges`: the rental's damage and loss charges, set before settling). */
export function DepositPanel({ rental, canManage, charges }: { rental: RentalView; canManage: boolean; charges: ReactNode }) {
  const { dateTime } = useFirmFormat();
  const { state, authorization: hold, authorizations: holds } = rental.deposit;
  const money = (minor: number) => formatMoney(minor, rental.currency);
  const stillOut = rental.state === 'reserved' || rental.state === 'out';
  const canTake = stillOut && (state === 'none' || state === 'declined' || state === 'lapsed');
  const authorized = state === 'authorized' && hold;
  const testMode = usePaymentMode().data?.mode === 'test';
  const request = rental.deposit.request;
  return (
    <Panel title="Deposit" className="lg:col-span-2">
      <div className="grid items-start gap-4 lg:grid-cols-2">
        <div className="flex flex-col gap-4">
          <FactList
            items={[
              { term: 'State', value: <DepositStateChip state={state} /> },
              { term: 'Deposit asked', value: money(rental.depositMinor) },
              { term: 'Card', value: card(hold) },
              ...(authorized
                ? [
                    { term: 'Amount authorized', value: money(hold.amountMinor) },
                    { term: 'Lapses at', value: <AuthorizationLapse at={hold.captureBefore} dateTime={dateTime} /> },
                  ]
                : []),
              ...(hold && hold.capturedMinor > 0
                ? [{ term: 'Captured', value: `${money(hold.capturedMinor)}${hold.captureReason ? ` — ${hold.captureReason}` : ''}` }]
                : []),
            ]}
          />
          {canManage && canTake ? <DepositRequest rentalId={rental.id} request={request} sentTo={rental.customer.billingEmail} /> : null}
          {canManage && canTake && testMode ? <TakeDeposit rentalId={rental.id} amount={money(rental.depositMinor)} /> : null}
          {authorized && !rental.returnedAt ? (
            <p className="text-sm text-ink-700">
              The authorization stays on the card until the kit is back. Nestkeeper renews it on the saved card before it would lapse.
            </p>
          ) : null}
          {authorized && rental.returnedAt && canManage ? <SettleDeposit rental={rental} hold={hold} charges={charges} /> : null}
          <MoneyMails mails={rental.moneyMails} events={['deposit_captured', 'deposit_released']} currency={rental.currency} />
        </div>
        {holds.length ? <AuthorizationHistory holds={holds} currency={rental.currency} dateTime={dateTime} /> : null}
      </div>
    </Panel>
  );
}

function TakeDeposit({ rentalId, amount }: { rentalId: string; amount: string }) {
  const take = useTakeDeposit();
  const [problem, setProblem] = useState<{ title: string; text: string }>();
  return (
    <Formik
      initialValues={{ paymentMethod: testCards[0].paymentMethod as string }}
      validationSchema={Yup.object({ paymentMethod: Yup.string().required('Pick a card.') })}
      onSubmit={async ({ paymentMethod }) => {
        setProblem(undefined);
        try {
          await take.mutateAsync({ rentalId, paymentMethod });
        } catch (error) {
          // The server's words already say the card was declined and what to do: said once.
          setProblem({ title: 'No deposit was taken', text: paymentProblem(error) });
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate className="flex flex-col gap-3 rounded-md border border-dashed border-warn/60 bg-paper p-3" aria-label="Take the deposit in test mode">
          <p className="font-semibold text-warn">Test mode</p>
          {problem ? (
            <Notice tone="error" title={problem.title}>
              {problem.text}
            </Notice>
          ) : null}
          <SelectField
            name="paymentMethod"
            label="Test card"
            options={testCards.map((c) => ({ value: c.paymentMethod, label: c.label }))}
            hint="Only while the payment keys are test keys: the provider's published test cards, no renter needed. With live keys this shortcut is gone and the renter's link is the only way."
          />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Take deposit with a test card
            </Button>
            <span className="ml-3 text-sm text-ink-700">Authorizes {amount} on the card; nothing is charged yet.</span>
          </div>
        </Form>
      )}
    </Formik>
  );
}

/** A charge above the hold and a renewal are both merchant-initiated on the saved card; the kind tells them apart. */
const howTaken = (h: DepositAuthorizationView) =>
  h.kind === 'charge' ? 'Charged to the saved card' : h.initiatedBy === 'customer' ? 'By the customer' : 'Renewal on the saved card';

function AuthorizationHistory({ holds, currency, dateTime }: { holds: DepositAuthorizationView[]; currency: string; dateTime: (value: string) => string }) {
  return (
    <ScrollBox label="Authorization history">
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-semibold text-ink-900">Authorization history</caption>
        <TableHead columns={['Tried', 'How', 'Card', 'Amount#', 'State', 'Captured#', 'Note']} />
        <tbody className="divide-y divide-paper-line">
          {holds.map((h) => (
            <tr key={h.id}>
              <td className="py-1.5 pr-2">{dateTime(h.createdAt)}</td>
              <td className="py-1.5 pr-2">{howTaken(h)}</td>
              <td className="py-1.5 pr-2 font-mono">{card(h) ?? '—'}</td>
              <td className="py-1.5 pr-2 text-right tabular-nums">{formatMoney(h.amountMinor, currency)}</td>
              <td className="py-1.5 pr-2">
                <DepositStateChip state={h.state} />
              </td>
              <td className="py-1.5 pr-2 text-right tabular-nums">{h.capturedMinor ? formatMoney(h.capturedMinor, currency) : '—'}</td>
              <td className="py-1.5">{h.failureMessage ?? h.captureReason ?? (h.settledAt ? `Settled ${dateTime(h.settledAt)}` : '')}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollBox>
  );
}
