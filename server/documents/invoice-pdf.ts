import type { InvoiceView } from '../../shared/billing/views';
import type { FirmFormat } from '../../shared/formatting/firm-format';
import { bullets, facts, heading, section, table, taxRateText, totals, type DocumentFirm } from './document-layout';
import { MM, renderPdf } from './pdf';

/** What was paid and what is left, after the invoice totals; a credit note only states what it gives back. */
function settlementRows(invoice: InvoiceView, f: FirmFormat) {
  const money = (minor: number) => f.money(minor, invoice.currency);
  if (invoice.kind === 'credit_note') return [{ label: 'Total credited', value: money(Math.abs(invoice.totalMinor)), strong: true }];
  return [
    { label: 'Deposit captured', value: money(invoice.depositCapturedMinor) },
    { label: 'Charged to card', value: money(invoice.cardChargedMinor) },
    { label: 'Balance due', value: invoice.balanceMinor > 0 ? money(invoice.balanceMinor) : 'Nothing left to pay', strong: true },
  ];
}

export function invoicePdf(input: { firm: DocumentFirm; invoice: InvoiceView }): Promise<Buffer> {
  const { firm, invoice } = input;
  const { currency, customer } = invoice;
  const f = firm.format;
  const money = (minor: number) => f.money(minor);
  const credit = invoice.kind === 'credit_note';
  const title = `${credit ? 'Credit note' : 'Invoice'} ${invoice.number}`;
  return renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: title } }, (doc) => {
    const issuer = invoice.issuer;
    heading(doc, firm.name, title, [
      ...(issuer?.address ? [issuer.address] : []),
      ...(issuer?.taxNumber ? [`Tax number ${issuer.taxNumber}`] : []),
      `Issue date ${f.date(invoice.issuedOn)}`,
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
      invoice.lines.map((l) => [l.description, f.count(l.quantity), money(l.unitMinor), money(l.amountMinor)]),
    );
    totals(doc, [
      { label: 'Subtotal', value: money(invoice.subtotalMinor) },
      { label: `Tax ${taxRateText(invoice.taxRateBasisPoints, f)}`, value: money(invoice.taxMinor) },
      { label: 'Total', value: money(invoice.totalMinor), strong: true },
      ...settlementRows(invoice, f),
    ]);
    if (issuer?.paymentTerms && !credit) {
      section(doc, 'Payment');
      bullets(doc, [issuer.paymentTerms]);
    }
  });
}
