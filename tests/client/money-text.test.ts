import { describe, expect, it } from 'vitest';
import { parseMoneyText } from '../../src/lib/money';

// Amounts as a person types them in each firm's way of writing money (from memory of the national conventions:
// en-GB/en-US "25,000.00", de-DE "25.000,00", fr-FR "25 000,00"), against the minor units worked by hand.
describe('money typed as money', () => {
  it.each([
    ['€25,000.00', 'en-GB', 2_500_000],
    ['25,000', 'en-GB', 2_500_000],
    ['25000', 'en-GB', 2_500_000],
    ['180,50', 'en-GB', 18_050], // not a thousands group: a decimal comma
    ['$1,250.5', 'en-US', 125_050],
    ['25.000,00 €', 'de-DE', 2_500_000],
    ['180.50', 'de-DE', 18_050], // not a thousands group: a decimal point
    ['25 000,00 €', 'fr-FR', 2_500_000],
    ['25\u202f000,00\u00a0€', 'fr-FR', 2_500_000],
  ])('%s in %s', (text, locale, minor) => expect(parseMoneyText(text, 2, locale)).toBe(minor));

  it.each([['€'], ['twelve'], ['1.2.3'], ['12.345'], ['-5']])('refuses %s', (text) => expect(parseMoneyText(text, 2, 'en-GB')).toBeNull());
});
