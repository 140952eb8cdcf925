import { format } from 'date-fns';
import { de, enGB, enUS, fr } from 'date-fns/locale';
import { describe, expect, it } from 'vitest';
import { firmFormat, isFirmLocale, isTimeZoneName } from './firm-format';

const day = new Date(2026, 11, 3); // 3 December 2026, local midnight for date-fns

describe('dates in the firm locale', () => {
  // Reference: date-fns's own locale tables (written by its authors from CLDR charts, not read from ICU at run time),
  // with the pattern each locale's medium date uses.
  it.each([
    ['en-GB', format(day, 'd MMM yyyy', { locale: enGB })],
    ['en-US', format(day, 'MMM d, yyyy', { locale: enUS })],
    ['de-DE', format(day, 'd. MMM yyyy', { locale: de })],
    ['fr-FR', format(day, 'd MMM yyyy', { locale: fr })],
  ])('%s writes 3 December 2026 as date-fns does', (locale, expected) => {
    expect(firmFormat({ locale, timeZone: 'Europe/Berlin', currency: 'EUR' }).date('2026-12-03')).toBe(expected);
  });

  it('never shifts a calendar date, whatever the zone', () => {
    const farEast = firmFormat({ locale: 'en-GB', timeZone: 'Pacific/Kiritimati', currency: 'EUR' });
    const farWest = firmFormat({ locale: 'en-GB', timeZone: 'Pacific/Pago_Pago', currency: 'EUR' });
    expect(farEast.date('2026-12-31')).toBe('31 Dec 2026');
    expect(farWest.date('2026-12-31')).toBe('31 Dec 2026');
  });

  it('gives a range its year on both sides of a new year, once within a month', () => {
    const en = firmFormat({ locale: 'en-GB', timeZone: 'UTC', currency: 'EUR' });
    expect(en.dateRange('2026-12-23', '2027-01-05')).toMatch(/^23 Dec 2026\s–\s5 Jan 2027$/);
    expect(en.dateRange('2026-12-07', '2026-12-11')).toMatch(/^7\s?–\s?11 Dec 2026$/);
  });
});

describe('moments in the firm zone', () => {
  // tz database (IANA, northamerica file): America/Chicago keeps UTC−6 (CST) in December; Europe/Berlin UTC+1 (CET).
  it('shows 14:05 UTC on 3 Dec 2026 as 8:05 AM in Chicago and names the zone for a reader elsewhere', () => {
    const chicago = firmFormat({ locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' }, 'Europe/Berlin');
    expect(chicago.dateTime('2026-12-03T14:05:00Z')).toMatch(/^Dec 3, 2026, 8:05\sAM CST$/);
    expect(chicago.date('2026-12-04T03:00:00Z')).toBe('Dec 3, 2026'); // 21:00 the evening before in Chicago
  });

  it('leaves the zone out for a reader in the same zone', () => {
    const berlin = firmFormat({ locale: 'en-GB', timeZone: 'Europe/Berlin', currency: 'EUR' }, 'Europe/Berlin');
    expect(berlin.dateTime('2026-12-03T14:05:00Z')).toBe('3 Dec 2026, 15:05');
    expect(berlin.zoneNote).toBeNull();
  });
});

describe('numbers, money and coordinates', () => {
  it('writes a coordinate without grouping, so no separator can be misread (en-GB and de-DE)', () => {
    // The confusing form was "1,250, -340.5, 87.25": a thousands comma next to the list comma.
    expect(firmFormat({ locale: 'en-GB', timeZone: 'UTC', currency: 'EUR' }).coordinate([1250, -340.5, 87.25])).toBe('X 1250.000 · Y -340.500 · Z 87.250 mm');
    expect(firmFormat({ locale: 'de-DE', timeZone: 'UTC', currency: 'EUR' }).coordinate([1250, -340.5, 87.25])).toBe('X 1250,000 · Y -340,500 · Z 87,250 mm');
  });

  it('writes money with the ISO 4217 decimals in the firm locale', () => {
    // Common practice in each country's invoices (from memory): "€25,000.00" in Ireland/UK style, "25.000,00 €" in Germany.
    expect(firmFormat({ locale: 'en-IE', timeZone: 'UTC', currency: 'EUR' }).money(2_500_000)).toBe('€25,000.00');
    expect(firmFormat({ locale: 'de-DE', timeZone: 'UTC', currency: 'EUR' }).money(2_500_000)).toBe('25.000,00\u00a0€');
    expect(firmFormat({ locale: 'en-US', timeZone: 'UTC', currency: 'USD' }).money(41_650)).toBe('$416.50');
  });

  it('keeps lengths in fixed decimals', () => {
    const en = firmFormat({ locale: 'en-GB', timeZone: 'UTC', currency: 'EUR' });
    expect(en.mm(12.3456)).toBe('12.346 mm');
    expect(en.um(4.25, 1)).toMatch(/^4\.[23] µm$/);
  });
});

describe('what settings accept', () => {
  it('knows IANA zone names and refuses inventions', () => {
    expect(isTimeZoneName('America/Chicago')).toBe(true);
    expect(isTimeZoneName('UTC')).toBe(true);
    expect(isTimeZoneName('Mars/Olympus_Mons')).toBe(false);
    expect(isFirmLocale('en-US')).toBe(true);
    expect(isFirmLocale('xx-YY')).toBe(false);
  });
});
