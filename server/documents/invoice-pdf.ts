import type { InvoiceView } from '../../shared/billing/views';
import type { FirmFormat } from '../../shared/formatting/firm-format';
import { bullets, facts, heading, section, table, taxRateText, totals, typeTitle, type DocumentFirm } from './document-layout';
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

/** "Laser tracker, Halvard QF-9" — the item as an accounts clerk can match it to the delivery. */
const itemWords = (i: InvoiceView['rental']['items'][number]) =>
  [typeTitle(i.type), [i.manufacturer, i.model].filter(Boolean).join(' ')].filter(Boolean).join(', ');

/**
 * An invoice or credit note as an accounts department files it: who issued it (as on the day of issue), the rental it
 * bills with its period and items, the lines, the tax line, the due date and how to pay; a credit note names the
 * invoice it corrects. Dates and money in the firm's voice.
 */
export function invoicePdf(input: { firm: DocumentFirm; invoice: InvoiceView }): Promise<Buffer> {
  const { firm, invoice } = input;
  const f = firm.format;
  const money = (minor: number) => f.money(minor, invoice.currency);
  const { customer, rental } = invoice;
  const credit = invoice.kind === 'credit_note';
  const title = `${credit ? 'Credit note' : 'Invoice'} ${invoice.number}`;
  return renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: title } }, (doc) => {
    // Kept as issued; invoices from before payment days and bank details were kept print what they have.
    const issuer = invoice.issuer;
    heading(doc, firm.name, title, [
      ...(issuer?.address ? [issuer.address] : []),
      ...(issuer?.taxNumber ? [`Tax number ${issuer.taxNumber}`] : []),
      `Issue date ${f.date(invoice.issuedOn)}`,
      ...(invoice.dueOn ? [`Due date ${f.date(invoice.dueOn)}`] : []),
    ]);
    facts(doc, [
      ['Rental', rental.number],
      ['Rental period', f.dateRange(rental.startsOn, rental.endsOn)],
      ...(credit
        ? ([
            ['Corrects invoice', invoice.corrects ? `${invoice.corrects.number} of ${f.date(invoice.corrects.issuedOn)}` : invoice.correctsNumber],
            ['Reason', invoice.reason],
          ] as [string, string | null][])
        : []),
    ]);

    section(doc, 'Customer');
    facts(doc, [
      ['Company', customer.company],
      ['Contact', customer.billingContact],
      ['Address', customer.address],
      ['Tax number', customer.taxNumber],
      ['E-mail', customer.billingEmail],
    ]);

    if (rental.items.length) {
      section(doc, 'Items rented');
      table(
        doc,
        [
          { header: 'Tag', share: 0.2, mono: true },
          { header: 'Item', share: 0.5 },
          { header: 'Serial number', share: 0.3, mono: true },
        ],
        rental.items.map((i) => [i.assetTag, itemWords(i), i.serialNumber]),
      );
    }

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
    if (!credit && (issuer?.paymentTerms || issuer?.bankDetails || invoice.dueOn)) {
      section(doc, 'How to pay');
      bullets(doc, [
        ...(invoice.dueOn && invoice.balanceMinor > 0
          ? [`Please pay ${money(invoice.balanceMinor)} by ${f.date(invoice.dueOn)}, quoting ${invoice.number}.`]
          : []),
        ...(issuer?.paymentTerms ? [issuer.paymentTerms] : []),
        ...(issuer?.bankDetails ? [`Bank details: ${issuer.bankDetails}`] : []),
      ]);
    }
  });
}
