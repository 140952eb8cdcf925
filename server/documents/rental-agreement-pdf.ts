import { lateChargeMinor, periodWords } from '../../shared/billing/quote';
import type { RentalView } from '../../shared/billing/views';
import type { FirmFormat } from '../../shared/formatting/firm-format';
import {
  bullets,
  daysIncluded,
  facts,
  heading,
  rentalCautions,
  section,
  signatureLines,
  table,
  taxRateText,
  totals,
  typeTitle,
  type DocumentFirm,
} from './document-layout';
import { MM, renderPdf } from './pdf';

/** The rental's terms in words (the agreement's and the renter's page), in the firm's format and the rental's currency. */
export function agreementTerms(rental: RentalView, f: FirmFormat) {
  const money = (minor: number) => f.money(minor, rental.currency);
  const late = rental.quote.lines
    .map(
      (l) =>
        `${l.description}: ${money(l.rates.dayMinor)} day rate + ${money(l.lateFeePerDayMinor)} late fee = ${money(lateChargeMinor(1, l.rates, l.lateFeePerDayMinor))} a day each`,
    )
    .join('; ');
  return [
    `Late return: for every day after ${f.date(rental.endsOn)} that an item is not back, it is charged its day rate plus a late fee per day, with tax on top. ${late}.`,
    `Deposit: ${money(rental.depositMinor)} is authorized on your card. It is an authorization, not a charge; what is not needed is released when the kit is back.`,
    'Damage or loss: the repair or replacement is charged against the deposit authorization; any amount above it is charged to the same card.',
    `Calibration: the kit is rented calibrated. The certificate pack for every item travels by e-mail to ${rental.customer.billingEmail}.`,
    'Tell us at once about any drop, knock or damage: a knocked item may no longer measure true and must be checked before it is used again.',
  ];
}

export function rentalAgreementPdf(input: { firm: DocumentFirm; rental: RentalView }): Promise<Buffer> {
  const { firm, rental } = input;
  const { quote, currency } = rental;
  const f = firm.format;
  const money = (minor: number) => f.money(minor, currency);
  return renderPdf({ size: 'A4', margin: 18 * MM, info: { Title: `Rental agreement ${rental.number}`, CreationDate: new Date(rental.createdAt) } }, (doc) => {
    heading(doc, firm.name, `Rental agreement ${rental.number}`, [
      `Booked ${f.dateTime(rental.createdAt)}${rental.checkedOutAt ? ` · handed over ${f.dateTime(rental.checkedOutAt)}` : ''}`,
    ]);
    facts(doc, [
      ['Customer', rental.customer.company],
      ['Billing contact', rental.customer.billingContact],
      ['E-mail', rental.customer.billingEmail],
      ['Rental', `${daysIncluded(f, rental.startsOn, rental.endsOn)}: ${f.count(quote.days)} ${quote.days === 1 ? 'day' : 'days'}`],
      ['Kit', rental.kit?.name ?? null],
      ['Note', rental.note || null],
    ]);

    section(doc, `Items (${rental.items.length})`);
    table(
      doc,
      [
        { header: 'Tag', share: 0.17, mono: true },
        { header: 'Type', share: 0.22 },
        { header: 'Maker and model', share: 0.36 },
        { header: 'Serial number', share: 0.25, mono: true },
      ],
      rental.items.map((i) => [i.assetTag, typeTitle(i.type), [i.manufacturer, i.model].filter(Boolean).join(' ') || '—', i.serialNumber]),
    );

    section(doc, 'Price');
    table(
      doc,
      [
        { header: 'Description', share: 0.4 },
        { header: 'Quantity', share: 0.12, right: true },
        { header: 'Periods', share: 0.26 },
        { header: 'Amount', share: 0.22, right: true },
      ],
      quote.lines.map((l) => [l.description, f.count(l.quantity), periodWords(l.periods), money(l.amountMinor)]),
    );
    totals(doc, [
      { label: 'Subtotal', value: money(quote.subtotalMinor) },
      { label: `Tax ${taxRateText(quote.taxRateBasisPoints, f)}`, value: money(quote.taxMinor) },
      { label: 'Total', value: money(quote.totalMinor), strong: true },
      { label: 'Deposit to be held on the card', value: money(rental.depositMinor) },
    ]);

    section(doc, 'Terms');
    bullets(doc, agreementTerms(rental, f));
    section(doc, 'Cautions');
    bullets(doc, rentalCautions);

    signatureLines(doc, [firm.name, rental.customer.company]);
  });
}
