import type { InvoiceView } from '../../shared/billing/views';
import { bullets, calendarDate, facts, heading, money, section, table, taxRateText, totals } from './document-layout';
import { MM, renderPdf } from './pdf';

/** What was paid and what is left, after the invoice totals; a credit note only states what it gives back. */
function settlementRows(invoice: InvoiceView) {
  const { currency } = invoice;
  if (invoice.kind === 'credit_note') return [{ label: 'Total credited', value: money(Math.abs(invoice.totalMinor), currency), strong: true }];
  return [
    { label: 'Deposit captured', value: money(invoice.depositCapturedMinor, currency) },
    { label: 'Charged to card', value: money(invoice.cardChargedMinor, currency) },
    { label: 'Balance due', value: invoice.balanceMinor > 0 ? money(invoice.balanceMinor, currency) : 'Nothing left to pay', strong: true },
  ];
}

export function invoicePdf(input: { firm: { name: string; timeZone: string }; invoice: InvoiceView }): Promise<Buffer> {
  const { firm, invoice } = input;
  const { currency, customer } = invoice;
  const credit = invoice.kind === 'credit_note';
  const title = `${credit ? 'Credit note' : 'Invoice'} ${invoice.number}`;
  return renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: title } }, (doc) => {
    const issuer = invoice.issuer;
    heading(doc, firm.name, title, [
      ...(issuer?.address ? [issuer.address] : []),
      ...(issuer?.taxNumber ? [`Tax number ${issuer.taxNumber}`] : []),
      `Issue date ${calendarDate(invoice.issuedOn)}`,
    ]);
    if (credit) {
      facts(doc, [
        ['Corrects invoice', invoice.correctsNumber],
        ['Reason', invoice.reason],
      ]);
    }

    section(doc, 'Customer');
    facts(doc, [
      ['Company', customer.company],
      ['Contact', customer.billingContact],
      ['Address', customer.address],
      ['Tax number', customer.taxNumber],
      ['E-mail', customer.billingEmail],
    ]);

    section(doc, credit ? 'Credited' : 'Charges');
    table(
      doc,
      [
        { header: 'Description', share: 0.46 },
        { header: 'Quantity', share: 0.12, right: true },
        { header: 'Unit', share: 0.2, right: true },
        { header: 'Amount', share: 0.22, right: true },
      ],
      invoice.lines.map((l) => [l.description, String(l.quantity), money(l.unitMinor, currency), money(l.amountMinor, currency)]),
    );
    totals(doc, [
      { label: 'Subtotal', value: money(invoice.subtotalMinor, currency) },
      { label: `Tax ${taxRateText(invoice.taxRateBasisPoints)}`, value: money(invoice.taxMinor, currency) },
      { label: 'Total', value: money(invoice.totalMinor, currency), strong: true },
      ...settlementRows(invoice),
    ]);
    if (issuer?.paymentTerms && !credit) {
      section(doc, 'Payment');
      bullets(doc, [issuer.paymentTerms]);
    }
  });
}
