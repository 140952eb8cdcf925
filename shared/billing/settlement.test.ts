import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { addDays as dateFnsAddDays } from 'date-fns';
import { captureSplit, creditNoteAmounts, lateDaysBetween, paymentDueOn, settle } from './settlement';
import type { Quote } from './views';

// Two SMRs for 13 days at day 15.00 / week 75.00 / month 240.00, late fee 5.00 a day, tax 19 %.
const quote: Quote = {
  days: 13,
  startsOn: '2027-03-01',
  endsOn: '2027-03-13',
  lines: [
    {
      description: 'SMR',
      assetIds: ['a', 'b'],
      kitId: null,
      quantity: 2,
      periods: { months: 0, weeks: 2, days: 0 },
      unitMinor: 15_000,
      amountMinor: 30_000,
      rates: { dayMinor: 1500, weekMinor: 7500, monthMinor: 24_000 },
      lateFeePerDayMinor: 500,
    },
  ],
  subtotalMinor: 30_000,
  taxRateBasisPoints: 1900,
  taxMinor: 5700,
  totalMinor: 35_700,
  depositMinor: 50_000,
  currency: 'EUR',
};

describe('settling a rental at return', () => {
  it('adds late days per item and damage, taxes the sum, and subtracts what was taken', () => {
    // Worked by hand: late 2 days × (15.00 + 5.00) × 2 SMRs = 80.00; damage 180.00;
    // net 300.00 + 80.00 + 180.00 = 560.00; tax 19 % = 106.40; total 666.40.
    // Extras 260.00 + 19 % = 309.40 captured from the card authorization; the balance is the rental's own 357.00.
    const s = settle({
      quote,
      lateDays: 2,
      damage: [{ description: 'SMR-004 dented', amountMinor: 18_000 }],
      depositCapturedMinor: 30_940,
      cardChargedMinor: 0,
    });
    expect(s.lines.map((l) => [l.kind, l.amountMinor])).toEqual([
      ['rental', 30_000],
      ['late', 8000],
      ['damage', 18_000],
    ]);
    expect(s).toMatchObject({ subtotalMinor: 56_000, taxMinor: 10_640, totalMinor: 66_640, extrasGrossMinor: 30_940, balanceMinor: 35_700 });
    expect(s.lines[0].description).toBe('SMR — 2 weeks');
  });

  it('on time and undamaged: the quote is the invoice', () => {
    const s = settle({ quote, lateDays: 0, damage: [], depositCapturedMinor: 0, cardChargedMinor: 0 });
    expect(s).toMatchObject({
      subtotalMinor: quote.subtotalMinor,
      taxMinor: quote.taxMinor,
      totalMinor: quote.totalMinor,
      extrasGrossMinor: 0,
      balanceMinor: quote.totalMinor,
    });
  });
});

describe('late days', () => {
  // Checked against luxon's calendar arithmetic (an independent date library).
  const luxonDays = (a: string, b: string) => Math.max(0, DateTime.fromISO(b, { zone: 'utc' }).diff(DateTime.fromISO(a, { zone: 'utc' }), 'days').days);
  it.each([
    ['2027-03-13', '2027-03-13'], // back on the last day: not late (dates inclusive, common practice)
    ['2027-03-13', '2027-03-15'],
    ['2028-02-28', '2028-03-01'], // 2028 is a leap year: 29 February counts
    ['2027-12-30', '2028-01-02'],
    ['2027-03-13', '2027-03-10'], // early
  ])('%s → %s', (endsOn, returnedOn) => {
    expect(lateDaysBetween(endsOn, returnedOn)).toBe(luxonDays(endsOn, returnedOn));
  });
  it('counts the leap day', () => expect(lateDaysBetween('2028-02-28', '2028-03-01')).toBe(2));
});

describe('a capture at return', () => {
  // Worked by hand: 214.20 of a 500.00 authorization is captured, 285.80 released, nothing charged above it.
  it('takes what it can from the authorization and releases the rest', () =>
    expect(captureSplit(21_420, 50_000)).toEqual({ fromAuthorizationMinor: 21_420, releasedMinor: 28_580, chargedMinor: 0 }));
  // 650.00 against a 500.00 authorization: all 500.00 captured, nothing released, 150.00 charged to the saved card.
  it('charges the card for what is above the authorization', () =>
    expect(captureSplit(65_000, 50_000)).toEqual({ fromAuthorizationMinor: 50_000, releasedMinor: 0, chargedMinor: 15_000 }));
  it('without a live authorization the whole amount is a charge', () =>
    expect(captureSplit(12_000, 0)).toEqual({ fromAuthorizationMinor: 0, releasedMinor: 0, chargedMinor: 12_000 }));
});

describe('a credit note', () => {
  // Worked by hand: an invoice of 330.00 net at 19 %, 100.00 already credited; crediting 50.00 adds 9.50 tax = 59.50.
  const invoice = { subtotalMinor: 33_000, creditedMinor: 10_000, taxRateBasisPoints: 1900 };
  it('taxes the credited amount at the invoice’s rate', () =>
    expect(creditNoteAmounts(invoice, 5000)).toEqual({ leftMinor: 23_000, netMinor: 5000, taxMinor: 950, totalMinor: 5950 }));
  // 230.00 left; 19 % of it is 43.70: 273.70 in all.
  it('credits all that is left when no amount is given', () =>
    expect(creditNoteAmounts(invoice)).toEqual({ leftMinor: 23_000, netMinor: 23_000, taxMinor: 4370, totalMinor: 27_370 }));
  it('refuses more than is left', () => expect(creditNoteAmounts(invoice, 23_001).netMinor).toBeNull());
});

describe('the due date from the payment days', () => {
  // Checked against date-fns addDays and luxon's plus({ days }) (independent calendar arithmetic), in UTC dates.
  it.each([
    ['2026-12-03', 30],
    ['2027-01-31', 30], // across a short February
    ['2028-02-15', 14], // 2028 is a leap year
    ['2026-12-20', 14], // across the year end
    ['2026-12-03', 0], // due on receipt
  ])('%s + %i days', (issuedOn, days) => {
    const viaDateFns = dateFnsAddDays(new Date(`${issuedOn}T12:00:00Z`), days)
      .toISOString()
      .slice(0, 10);
    expect(paymentDueOn(issuedOn, days)).toBe(viaDateFns);
    expect(paymentDueOn(issuedOn, days)).toBe(DateTime.fromISO(issuedOn, { zone: 'utc' }).plus({ days }).toISODate());
  });
  // Worked by hand: 31 January 2027 + 30 days = 2 March 2027 (28 days of February, then 2).
  it('worked example', () => expect(paymentDueOn('2027-01-31', 30)).toBe('2027-03-02'));
});
