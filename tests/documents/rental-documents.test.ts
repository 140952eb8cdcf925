import * as mupdf from 'mupdf';
import { describe, expect, it } from 'vitest';
import type { InvoiceView, QuoteLine, RentalItem, RentalView } from '../../shared/billing/views';
import { firmFormat } from '../../shared/formatting/firm-format';
import { certificatePackPdf, type CertificateEntry } from '../../server/documents/certificate-pack';
import { invoicePdf } from '../../server/documents/invoice-pdf';
import { renderPdf } from '../../server/documents/pdf';
import { rentalAgreementPdf } from '../../server/documents/rental-agreement-pdf';
import { inspectPdf } from '../../server/documents/pdf-inspection';
import { pdfPageCount, pdfText } from '../support/pdf';
import { activeChanges, activeNamesSeenByMuPdf, certificateWith } from '../support/pdf-fixtures';

// Invented firm, customer, makers and tags (DESIGN.md §9).
const firm = { name: 'Brackenmoor Dimensional Works', format: firmFormat({ locale: 'en-GB', timeZone: 'Europe/Berlin', currency: 'EUR' }) };
const customer = { id: 'c1', company: 'Larkspur Aero Structures', billingContact: 'Accounts desk, Hangar 3', billingEmail: 'accounts@larkspur-aero.example' };

const item = (assetTag: string, type: string, serialNumber: string): RentalItem => ({
  id: assetTag,
  assetTag,
  type,
  serialNumber,
  manufacturer: 'Quillfen Instruments',
  model: 'QF-9',
  replacementValueMinor: null,
});

const line = (description: string, quantity: number, dayMinor: number, weekMinor: number, lateFeePerDayMinor: number): QuoteLine => ({
  description,
  assetIds: [],
  kitId: null,
  quantity,
  // 10 rental days: one week + three days beats two weeks at these rates (worked by hand; shared/billing/quote.ts picks the same).
  periods: { months: 0, weeks: 1, days: 3 },
  unitMinor: weekMinor + 3 * dayMinor,
  amountMinor: quantity * (weekMinor + 3 * dayMinor),
  rates: { dayMinor, weekMinor, monthMinor: 4 * weekMinor },
  lateFeePerDayMinor,
});

function rental(items: RentalItem[]): RentalView {
  const lines = [line('Laser tracker', 1, 25_000, 120_000, 5_000), line('SMR', 2, 2_000, 10_000, 500), line('Battery', 1, 1_000, 5_000, 200)];
  // Worked by hand: 1 950.00 + 2 × 160.00 + 80.00 = 2 350.00; 19 % tax = 446.50; total 2 796.50.
  const quote = {
    days: 10,
    startsOn: '2025-03-03',
    endsOn: '2025-03-12',
    lines,
    subtotalMinor: 235_000,
    taxRateBasisPoints: 1900,
    taxMinor: 44_650,
    totalMinor: 279_650,
    depositMinor: 150_000,
    currency: 'EUR',
  };
  const none = {
    lateDays: 0,
    lines: [],
    subtotalMinor: 0,
    taxMinor: 0,
    totalMinor: 0,
    extrasGrossMinor: 0,
    depositCapturedMinor: 0,
    cardChargedMinor: 0,
    balanceMinor: 0,
  };
  return {
    id: 'r1',
    number: 'R-2025-031',
    state: 'reserved',
    customer,
    bookingId: 'b1',
    kit: null,
    items,
    startsOn: quote.startsOn,
    endsOn: quote.endsOn,
    note: null,
    quote,
    currency: 'EUR',
    depositMinor: 150_000,
    deposit: { state: 'none', authorization: null, authorizations: [], request: null },
    agreement: null,
    handoverOverride: null,
    checkedOutAt: null,
    returnedAt: null,
    charges: [],
    settlement: none,
    invoices: [],
    moneyMails: [],
    createdAt: '2025-02-20T09:30:00Z',
  };
}

const expectAll = (text: string, parts: string[]) => parts.forEach((part) => expect(text).toContain(part));

const threeItems = [item('TRK-001', 'tracker', 'QF9-40117'), item('SMR-004', 'smr', 'S38-0442'), item('BAT-002', 'battery', 'LB-77120')];

describe('rental agreement PDF', () => {
  it('names the rental, every item, the money and the terms', async () => {
    const text = pdfText(await rentalAgreementPdf({ firm, rental: rental(threeItems) }));
    expectAll(text, [
      'Rental agreement R-2025-031',
      'Larkspur Aero Structures',
      'accounts@larkspur-aero.example',
      ...threeItems.flatMap((i) => [i.assetTag, i.serialNumber]),
      '1 week, 3 days',
      '€2,796.50', // total, worked by hand above
      'Tax 19 %',
      '€1,500.00', // the deposit in the fixture
      // Late day for the tracker: 250.00 day rate + 50.00 late fee = 300.00 (worked by hand).
      '€250.00 day rate + €50.00 late fee = €300.00 a day',
      'charged against the deposit authorization',
      'IEC 60825-1 Class 2',
      'do not stare into the beam',
      'do not charge them and do not ship them by air',
      'two people or use a trolley',
      "the instrument maker's instructions come first",
      'For Brackenmoor Dimensional Works',
      'For Larkspur Aero Structures',
    ]);
  });

  it('runs onto more pages for 40 items and still lists the last one', async () => {
    const forty = Array.from({ length: 40 }, (_, i) => item(`TIP-${String(i + 1).padStart(3, '0')}`, 'tip', `PT-${9000 + i}`));
    const pdf = await rentalAgreementPdf({ firm, rental: rental(forty) });
    expect(pdfPageCount(pdf)).toBeGreaterThan(1);
    expectAll(pdfText(pdf), ['TIP-040', 'PT-9039', 'For Larkspur Aero Structures']);
  });
});

function invoice(over: Partial<InvoiceView> = {}): InvoiceView {
  return {
    id: 'i1',
    kind: 'invoice',
    number: 'INV-2025-0042',
    receivedMinor: 0,
    outstandingMinor: 54_600,
    payments: [],
    issuer: {
      address: 'Forge Lane 12, Wrenhallow',
      taxNumber: 'WH-7781-0042',
      paymentTerms: 'Payment within 14 days of the invoice date, quoting the invoice number.',
      paymentDays: 14,
      bankDetails: 'Wrenhallow Mutual Bank, IBAN XX00 1234 5678 9012 3456 78, BIC WRNHXX00',
    },
    issuedOn: '2025-03-14',
    // 14 March 2025 + 14 days = 28 March 2025 (worked by hand; the service computes it with paymentDueOn).
    dueOn: '2025-03-28',
    rental: {
      number: 'R-2025-031',
      startsOn: '2025-03-03',
      endsOn: '2025-03-12',
      items: threeItems.map(({ assetTag, type, serialNumber, manufacturer, model }) => ({ assetTag, type, serialNumber, manufacturer, model })),
    },
    corrects: null,
    issuedAt: '2025-03-14T10:00:00Z',
    rentalId: 'r1',
    customerId: 'c1',
    customerCompany: customer.company,
    correctsInvoiceId: null,
    correctsNumber: null,
    currency: 'EUR',
    lines: [
      { kind: 'rental', description: 'Rental R-2025-031, 10 days', quantity: 1, unitMinor: 235_000, amountMinor: 235_000 },
      { kind: 'late', description: 'Late days, laser tracker', quantity: 2, unitMinor: 30_000, amountMinor: 60_000 },
      { kind: 'damage', description: 'SMR-004 cracked retroreflector', quantity: 1, unitMinor: 45_000, amountMinor: 45_000 },
    ],
    // Worked by hand: 2 350.00 + 600.00 + 450.00 = 3 400.00; 19 % = 646.00; total 4 046.00;
    // less 1 500.00 captured and 2 000.00 on the card leaves 546.00.
    subtotalMinor: 340_000,
    taxRateBasisPoints: 1900,
    taxMinor: 64_600,
    totalMinor: 404_600,
    depositCapturedMinor: 150_000,
    cardChargedMinor: 200_000,
    balanceMinor: 54_600,
    creditedMinor: 0,
    reason: null,
    customer: {
      company: customer.company,
      billingContact: customer.billingContact,
      billingEmail: customer.billingEmail,
      address: '7 Fennick Lane\nOrrowby',
      taxNumber: 'XX 123 456 789',
    },
    ...over,
  };
}

describe('invoice PDF', () => {
  it('shows the number, the customer, the lines and the balance due', async () => {
    const text = pdfText(await invoicePdf({ firm, invoice: invoice() }));
    expectAll(text, [
      'Invoice INV-2025-0042',
      'Orrowby',
      'XX 123 456 789',
      'SMR-004 cracked retroreflector',
      'Tax 19 %',
      '€4,046.00',
      'Deposit captured €1,500.00',
      'Balance due €546.00',
      // The issuing firm's own details, as kept on the invoice.
      'Forge Lane 12, Wrenhallow',
      'Tax number WH-7781-0042',
      'Payment within 14 days of the invoice date',
    ]);
  });

  it('names the rental, its period, each item with tag and serial, the due date and the bank details', async () => {
    const text = pdfText(await invoicePdf({ firm, invoice: invoice() }));
    expectAll(text, [
      'Rental R-2025-031',
      // en-GB short-month dates, the year once for a range within one month (from memory of British usage: "3 – 12 Mar 2025").
      'Rental period 3 – 12 Mar 2025',
      ...threeItems.flatMap((i) => [i.assetTag, i.serialNumber]),
      'Issue date 14 Mar 2025',
      'Due date 28 Mar 2025',
      'Please pay €546.00 by 28 Mar 2025, quoting INV-2025-0042',
      'IBAN XX00 1234 5678 9012 3456 78',
      'Tax 19 % €646.00',
    ]);
  });

  it('speaks the firm’s voice: en-US dates and money', async () => {
    const text = pdfText(
      await invoicePdf({ firm: { ...firm, format: firmFormat({ locale: 'en-US', timeZone: 'America/Chicago', currency: 'EUR' }) }, invoice: invoice() }),
    );
    // US order, month first (from memory of US business letters): "Mar 28, 2025".
    expectAll(text, ['Due date Mar 28, 2025', 'Issue date Mar 14, 2025', 'Rental period Mar 3 – 12, 2025']);
    expect(text).not.toContain('28 Mar 2025');
  });

  it('prints what an invoice from before payment days and bank details were kept has', async () => {
    const old = invoice({
      issuer: { address: 'Forge Lane 12, Wrenhallow', taxNumber: 'WH-7781-0042', paymentTerms: 'Payment within 30 days.' } as never,
      dueOn: null,
    });
    const text = pdfText(await invoicePdf({ firm, invoice: old }));
    expectAll(text, ['Forge Lane 12, Wrenhallow', 'Payment within 30 days.']);
    expect(text).not.toMatch(/Due date|Bank details/);
  });

  it('says nothing is left to pay once the balance is settled', async () => {
    const text = pdfText(await invoicePdf({ firm, invoice: invoice({ cardChargedMinor: 254_600, balanceMinor: 0 }) }));
    expect(text).toContain('Nothing left to pay');
  });

  it('titles a credit note and names the invoice it corrects', async () => {
    const credit = invoice({
      kind: 'credit_note',
      number: 'CN-2025-0003',
      correctsInvoiceId: 'i1',
      correctsNumber: 'INV-2025-0042',
      corrects: { number: 'INV-2025-0042', issuedOn: '2025-03-14' },
      dueOn: null,
      reason: 'Late days waived: the carrier delayed the return',
      lines: [{ kind: 'credit', description: 'Late days, laser tracker', quantity: 2, unitMinor: 30_000, amountMinor: 60_000 }],
      // Worked by hand: 600.00 + 19 % (114.00) = 714.00.
      subtotalMinor: 60_000,
      taxMinor: 11_400,
      totalMinor: 71_400,
    });
    const text = pdfText(await invoicePdf({ firm, invoice: credit }));
    expectAll(text, [
      'Credit note CN-2025-0003',
      'Corrects invoice INV-2025-0042 of 14 Mar 2025',
      'Rental R-2025-031',
      'the carrier delayed the return',
      'Total credited €714.00',
    ]);
    expect(text).not.toMatch(/Balance due|How to pay/);
  });
});

/** A stand-in lab certificate: one line of text per page. */
const certificate = (pages: string[]) =>
  renderPdf({ size: 'A4' }, (doc) =>
    pages.forEach((p, i) => {
      if (i > 0) doc.addPage();
      doc.text(p);
    }),
  );

const entry = (assetTag: string, certificateNumber: string | null, pdf: Buffer | null): CertificateEntry => ({
  assetTag,
  type: 'tracker',
  serialNumber: `${assetTag}-SN`,
  model: 'QF-9',
  certificateNumber,
  performedOn: '2025-01-10',
  dueOn: '2026-01-10',
  provider: 'Orrowby Calibration Lab',
  pdf,
});

const pack = (entries: CertificateEntry[]) =>
  certificatePackPdf({ firm, rentalNumber: 'R-2025-031', customerCompany: customer.company, startsOn: '2025-03-03', endsOn: '2025-03-12', entries });

describe('certificate pack PDF', () => {
  it('puts a cover before every page of every certificate, in entry order', async () => {
    const first = await certificate(['Lab certificate OCL-1187 for the tracker']);
    const second = await certificate(['Lab certificate OCL-1203 page one', 'Lab certificate OCL-1203 page two']);
    const pdf = await pack([entry('TRK-001', 'OCL-1187', first), entry('SMR-004', 'OCL-1203', second)]);
    expect(pdfPageCount(pdf)).toBe(1 + 1 + 2); // cover + a 1-page and a 2-page certificate
    const text = pdfText(pdf);
    const order = ['Certificate pack', 'OCL-1187 for the tracker', 'OCL-1203 page one', 'OCL-1203 page two'].map((s) => text.indexOf(s));
    expect(order.every((at, i) => at >= 0 && (i === 0 || at > order[i - 1]))).toBe(true);
    const cover = text.slice(0, order[1]);
    expectAll(cover, ['OCL-1187', 'OCL-1203', 'certificate attached', 'in calibration for the rental']);
    expect(mupdf.Document.openDocument(pdf, 'application/pdf').getMetaData('info:Title')).toBe('Certificate pack R-2025-031');
  });

  it('lists an unreadable or missing certificate on the cover and still builds', async () => {
    const pdf = await pack([entry('TRK-001', 'OCL-1187', Buffer.from('this is not a PDF')), entry('SMR-004', null, null)]);
    expect(pdfPageCount(pdf)).toBe(1);
    expectAll(pdfText(pdf), ['certificate could not be read', 'no certificate on file']);
  });

  // Certificates stored before uploads were checked may carry active content; pdf-lib's copyPages
  // would bring a page's annotations and /AA along. The pack keeps what the pages draw and nothing else.
  it('carries no scripts, launch actions or attached files from a stored certificate, yet shows its pages', async () => {
    const stored = await Promise.all(
      Object.values(activeChanges).map((change, i) => certificateWith(change, [`Lab certificate OCL-88${i} page one`, `Lab certificate OCL-88${i} page two`])),
    );
    const pdf = await pack(stored.map((bytes, i) => entry(`TRK-10${i}`, `OCL-88${i}`, bytes)));
    expect(await inspectPdf(pdf)).toMatchObject({ kind: 'pdf', activeContent: [] });
    // Read by an independent parser too (MuPDF): no active-content name in any object of the pack.
    expect(activeNamesSeenByMuPdf(pdf)).toEqual([]);
    expect(pdfPageCount(pdf)).toBe(1 + 2 * stored.length);
    const text = pdfText(pdf);
    expectAll(
      text,
      stored.flatMap((_, i) => [`OCL-88${i} page one`, `OCL-88${i} page two`]),
    );
    expect(text.match(/pages attached; scripts and files removed/g)).toHaveLength(stored.length);
  });

  it('says so when none of the rented items needs calibration', async () => {
    const pdf = await pack([]);
    expect(pdfPageCount(pdf)).toBe(1);
    expectAll(pdfText(pdf), ['None of the rented items needs calibration', 'no certificates to include']);
  });
});
