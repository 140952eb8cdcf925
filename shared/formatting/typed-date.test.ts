import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { firmFormat, firmLocales } from './firm-format';
import { parseTypedDate } from './typed-date';

/** Every calendar day of 2026–2028 (1,096 days, 2028 a leap year), counted by luxon rather than by the code under test. */
const days: string[] = [];
for (let day = DateTime.fromISO('2026-01-01', { zone: 'utc' }); day.year <= 2028; day = day.plus({ days: 1 })) days.push(day.toISODate()!);

describe('a typed date read back in the firm locale', () => {
  it('counts the days it walks', () => expect(days).toHaveLength(365 + 365 + 366));

  // Intl (ICU) prints, date-fns parses with its own locale tables: two independent implementations of the same conventions.
  it.each(firmLocales)('%s: every day of 2026–2028 as the screens show it reads back as the same ISO date', (locale) => {
    const shown = firmFormat({ locale, timeZone: 'UTC', currency: 'EUR' });
    const misread = days.filter((iso) => parseTypedDate(shown.date(iso), locale) !== iso).map((iso) => `${iso} shown "${shown.date(iso)}"`);
    expect(misread).toEqual([]);
  });

  it.each(firmLocales)("%s: every day of 2026–2028 in the locale's numeric style (luxon's short date) reads back", (locale) => {
    const misread = days.filter((iso) => {
      const typed = DateTime.fromISO(iso, { zone: 'utc' }).setLocale(locale).toLocaleString(DateTime.DATE_SHORT);
      return parseTypedDate(typed, locale) !== iso;
    });
    expect(misread).toEqual([]);
  });

  it.each(firmLocales)('%s: ISO 8601 YYYY-MM-DD is accepted whatever the locale', (locale) => {
    expect(parseTypedDate('2028-02-29', locale)).toBe('2028-02-29');
    expect(parseTypedDate(' 2026-12-03 ', locale)).toBe('2026-12-03');
  });

  // Typed examples a person in each locale would write for 3 December 2026 (and 7 March 2027 where day and month could swap).
  it.each([
    // UK: day before month, "3 December 2026" in prose; GOV.UK style guide "Dates" (from memory); numeric dd/mm/yyyy is common practice.
    ['en-GB', '3 December 2026', '2026-12-03'],
    ['en-GB', '03/12/2026', '2026-12-03'],
    ['en-GB', '7/3/2027', '2027-03-07'],
    ['en-GB', '3 Sept 2026', '2026-09-03'],
    // US: month first, "December 3, 2026"; The Chicago Manual of Style 6.38 (from memory); numeric M/D/YYYY is common practice.
    ['en-US', 'December 3, 2026', '2026-12-03'],
    ['en-US', 'Dec 3, 2026', '2026-12-03'],
    ['en-US', '12/3/2026', '2026-12-03'],
    ['en-US', '3/7/2027', '2027-03-07'],
    // Ireland and Australia write day first like the UK (common practice).
    ['en-IE', '3/12/2026', '2026-12-03'],
    ['en-AU', '3 June 2026', '2026-06-03'],
    ['en-AU', '03/12/2026', '2026-12-03'],
    // Canada: the ISO form is the government's numeric style (from memory).
    ['en-CA', '2026-12-03', '2026-12-03'],
    ['en-CA', 'Dec 3, 2026', '2026-12-03'],
    // German: DIN 5008 numeric "03.12.2026", also without leading zeros; "3. Dezember 2026" in prose (DIN 5008, from memory).
    ['de-DE', '03.12.2026', '2026-12-03'],
    ['de-DE', '3.12.2026', '2026-12-03'],
    ['de-DE', '3. Dezember 2026', '2026-12-03'],
    ['de-DE', '7. März 2027', '2027-03-07'],
    // Austria: "Jänner" for January (Austrian German usage, from memory).
    ['de-AT', '3. Jänner 2027', '2027-01-03'],
    ['de-CH', '3.12.2026', '2026-12-03'],
    // French: "3 décembre 2026", numeric jj/mm/aaaa (common practice).
    ['fr-FR', '3 décembre 2026', '2026-12-03'],
    ['fr-FR', '03/12/2026', '2026-12-03'],
    // Dutch: "3 december 2026", numeric with hyphens "3-12-2026" (common practice).
    ['nl-NL', '3 december 2026', '2026-12-03'],
    ['nl-NL', '3-12-2026', '2026-12-03'],
    ['nl-NL', '3 mrt 2027', '2027-03-03'],
    // Italian and Spanish: day first, slashes (common practice).
    ['it-IT', '3 dicembre 2026', '2026-12-03'],
    ['it-IT', '03/12/2026', '2026-12-03'],
    ['es-ES', '3 diciembre 2026', '2026-12-03'],
    ['es-ES', '3/12/2026', '2026-12-03'],
    // Swedish: ISO order is the national numeric style (SS-ISO 8601, from memory); "3 december 2026" in prose.
    ['sv-SE', '2026-12-03', '2026-12-03'],
    ['sv-SE', '3 december 2026', '2026-12-03'],
    // Polish: "3 grudnia 2026" (genitive month) and "03.12.2026" (common practice).
    ['pl-PL', '3 grudnia 2026', '2026-12-03'],
    ['pl-PL', '03.12.2026', '2026-12-03'],
  ])('%s: "%s" is %s', (locale, typed, iso) => {
    expect(parseTypedDate(typed, locale)).toBe(iso);
  });

  it.each([
    ['en-GB', '31/02/2026', 'no 31 February'],
    ['en-GB', '2026-02-30', 'no 30 February in ISO either'],
    ['en-GB', '29/02/2027', '2027 is not a leap year'],
    ['en-US', '13/12/2026', 'month 13 in the US order'],
    ['en-GB', '3 Dec', 'no year'],
    ['en-GB', '3/12/26', 'a two-digit year is refused rather than guessed'],
    ['en-GB', '3 Dec 2026 and more', 'something left over'],
    ['en-GB', 'tomorrow', 'not a date'],
    ['en-GB', '', 'empty'],
    ['de-DE', '3.12.0226', 'a year outside the product range'],
    ['en-GB', '2026-12-3', 'ISO needs two-digit months and days'],
  ])('%s: "%s" is refused (%s)', (locale, typed) => {
    expect(parseTypedDate(typed, locale)).toBeNull();
  });
});
