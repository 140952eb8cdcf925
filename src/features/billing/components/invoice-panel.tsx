import { useState, type ReactNode } from 'react';
import { Button, buttonClasses } from '../../../components/button';
import { DownloadIcon } from '../../../components/icons';
import { MoneyLines } from '../../../components/money-lines';
import { Panel } from '../../../components/panel';
import { todayIn } from '../../../lib/calibration';
import { formatCalendarDate, formatMoney, useFirmFormat } from '../../../lib/format';
import { invoiceDocumentUrl, rentalInvoiceUrl } from '../api/get-invoices';
import { useIssueInvoice } from '../api/issue-invoice';
import type { InvoiceLine, InvoiceSummary, RentalView } from '../../../../shared/billing/views';
import { CreditNoteDialog } from './credit-note-dialog';
import { MoneyConfirmation } from './money-confirmation';
import { MoneyMails } from './money-mails';
import { PaymentDialog } from './payment-dialog';

const lineKindWords: Record<InvoiceLine['kind'], string> = { rental: 'Rental', late: 'Late days', damage: 'Damage or loss', credit: 'Credit' };

/** Why the invoice cannot be issued yet, or null when it can. */
function notReady(rental: RentalView): string | null {
  if (!rental.returnedAt) return 'The invoice can be issued once the kit is back.';
  if (rental.deposit.state === 'authorized') return 'Settle the deposit first: capture from the authorization or release it.';
  return null;
}

/** What the rental comes to, the invoice, what was received against it and its credit notes (`charges`: the damage and loss charges, shown while settling). */
export function InvoicePanel({ rental, canCharge, charges }: { rental: RentalView; canCharge: boolean; charges: ReactNode }) {
  const issue = useIssueInvoice();
  const { timeZone } = useFirmFormat();
  const [creditOpen, setCreditOpen] = useState(false);
  const [paymentOpen, setPaymentOpen] = useState(false);
  const [issuing, setIssuing] = useState(false);
  const { settlement, currency } = rental;
  const invoice = rental.invoices.find((i) => i.kind === 'invoice');
  const creditNotes = rental.invoices.filter((i) => i.kind === 'credit_note');
  const blocker = notReady(rental);
  const settling = rental.returnedAt && !invoice && rental.deposit.state !== 'authorized';
  return (
    <Panel title="Invoice" className="lg:col-span-2">
      <div className="flex flex-col gap-4">
        {settling ? charges : null}
        <MoneyLines
          caption="What the rental comes to"
          currency={currency}
          lines={settlement.lines.map((line, i) => ({
            key: `${line.kind}-${i}`,
            description: line.description,
            detail: lineKindWords[line.kind],
            quantity: line.quantity,
            unitMinor: line.unitMinor,
            amountMinor: line.amountMinor,
          }))}
          totals={[
            { label: 'Subtotal', minor: settlement.subtotalMinor },
            { label: 'Tax', minor: settlement.taxMinor },
            { label: 'Total', minor: settlement.totalMinor, strong: true },
            { label: 'Paid from the deposit', minor: settlement.depositCapturedMinor },
            { label: 'Charged to the saved card', minor: settlement.cardChargedMinor },
            // Balance is what is still owed: once invoiced, less credit notes and payments received.
            ...(invoice
              ? [
                  ...(invoice.creditedMinor
                    ? [{ label: 'Credited (with tax)', minor: invoice.balanceMinor - invoice.outstandingMinor - invoice.receivedMinor }]
                    : []),
                  ...(invoice.receivedMinor ? [{ label: 'Received', minor: invoice.receivedMinor }] : []),
                  { label: 'Balance', minor: invoice.outstandingMinor, strong: true },
                ]
              : [{ label: 'Balance', minor: settlement.balanceMinor, strong: true }]),
          ]}
        />
        {invoice ? (
          <div className="flex flex-wrap items-center gap-3">
            <p>
              Invoice <span className="font-mono font-semibold">{invoice.number}</span>, issued {formatCalendarDate(invoice.issuedOn)}
              {invoice.creditedMinor ? `; ${formatMoney(invoice.creditedMinor, currency)} credited` : ''}
              {invoice.receivedMinor ? `; ${formatMoney(invoice.receivedMinor, currency)} received` : ''}
              {invoice.outstandingMinor > 0 ? `; ${formatMoney(invoice.outstandingMinor, currency)} outstanding.` : '; nothing outstanding.'}
            </p>
            <a href={rentalInvoiceUrl(rental.id)} target="_blank" rel="noopener" className={buttonClasses('secondary', 'sm')}>
              <DownloadIcon size={14} />
              Download invoice (PDF)
            </a>
            {canCharge && invoice.outstandingMinor > 0 ? (
              <Button size="sm" onClick={() => setPaymentOpen(true)}>
                Record a payment
              </Button>
            ) : null}
            {canCharge ? (
              <Button size="sm" onClick={() => setCreditOpen(true)}>
                Credit note
              </Button>
            ) : null}
          </div>
        ) : canCharge ? (
          <div className="flex flex-wrap items-center gap-3">
            <Button variant="primary" disabled={!!blocker} onClick={() => setIssuing(true)}>
              Issue invoice
            </Button>
            {blocker ? <span className="text-sm text-ink-700">{blocker}</span> : null}
          </div>
        ) : null}
        <MoneyMails mails={rental.moneyMails} events={['invoice_issued', 'credit_note_issued']} currency={currency} />
        {creditNotes.length ? <CreditNotes notes={creditNotes} /> : null}
      </div>
      {issuing ? (
        <MoneyConfirmation
          open
          onClose={() => setIssuing(false)}
          title="Issue the invoice"
          what={issueWords(settlement, formatMoney, currency)}
          mailTo={`the invoice is mailed with its PDF to ${rental.customer.billingEmail}`}
          confirmLabel="Issue invoice"
          onConfirm={() => issue.mutateAsync(rental.id)}
        />
      ) : null}
      {invoice ? <CreditNoteDialog invoice={invoice} mailTo={rental.customer.billingEmail} open={creditOpen} onClose={() => setCreditOpen(false)} /> : null}
      {invoice ? <PaymentDialog invoice={invoice} today={todayIn(timeZone ?? 'UTC')} open={paymentOpen} onClose={() => setPaymentOpen(false)} /> : null}
    </Panel>
  );
}

/** "An invoice of €392.70 is issued: €214.20 paid from the deposit, €178.50 balance" — the rental's settlement, which the invoice copies. */
function issueWords(s: RentalView['settlement'], format: typeof formatMoney, currency: string): string {
  const money = (minor: number) => format(minor, currency);
  const paid = [
    s.depositCapturedMinor ? `${money(s.depositCapturedMinor)} paid from the deposit` : '',
    s.cardChargedMinor ? `${money(s.cardChargedMinor)} charged to the saved card` : '',
  ].filter(Boolean);
  return `An invoice of ${money(s.totalMinor)} is issued${paid.length ? `: ${paid.join(', ')}` : ''}, ${s.balanceMinor > 0 ? `${money(s.balanceMinor)} balance to pay` : 'nothing left to pay'}`;
}

function CreditNotes({ notes }: { notes: InvoiceSummary[] }) {
  return (
    <section aria-labelledby="credit-notes-heading">
      <h3 id="credit-notes-heading" className="mb-1 font-semibold text-ink-900">
        Credit notes
      </h3>
      <ul className="flex flex-col divide-y divide-paper-line">
        {notes.map((note) => (
          <li key={note.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-1.5 text-sm">
            <span className="font-mono font-semibold">{note.number}</span>
            <span>{formatCalendarDate(note.issuedOn)}</span>
            <span className="tabular-nums">{formatMoney(note.totalMinor, note.currency)}</span>
            <span className="min-w-0 flex-1 text-ink-700">{note.reason}</span>
            <a href={invoiceDocumentUrl(note.id)} target="_blank" rel="noopener" className="font-semibold text-brass-deep underline">
              {`Credit note ${note.number} (PDF)`}
            </a>
          </li>
        ))}
      </ul>
    </section>
  );
}
