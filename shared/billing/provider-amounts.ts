import { currencyExponent } from './money';

/**
 * The payment provider's own amount rules (Stripe, "Supported currencies",
 * docs.stripe.com/currencies: "Zero-decimal currencies", "Three-decimal
 * currencies", "Special cases"). Nestkeeper keeps ISO 4217 minor units; these
 * turn them into the provider's integer `amount` and back.
 */

/** "For zero-decimal currencies, still provide amounts as an integer but without multiplying by 100." */
const ZERO_DECIMAL = new Set(['BIF', 'CLP', 'DJF', 'GNF', 'JPY', 'KMF', 'KRW', 'MGA', 'PYG', 'RWF', 'UGX', 'VND', 'VUV', 'XAF', 'XOF', 'XPF']);

/** Three decimals, "the least-significant (last) digit" must be 0: "round amounts to the nearest ten". */
const THREE_DECIMAL = new Set(['BHD', 'JOD', 'KWD', 'OMR', 'TND']);

/**
 * Special cases. ISK became zero-decimal at the card networks on 14 April 2023
 * but stays two-decimal in the API: amounts are sent with two decimals and must
 * be evenly divisible by 100. HUF and TWD are charged with two decimals; the
 * provider treats them as zero-decimal for payouts only, which Nestkeeper does
 * not make, so they need nothing here.
 */
const WHOLE_UNITS_IN_TWO_DECIMALS = new Set(['ISK']);

/** Decimals of the provider's `amount` and the step it must be a multiple of, in the provider's units. */
export function providerAmountRule(currency: string): { digits: number; step: number } {
  const code = currency.toUpperCase();
  if (ZERO_DECIMAL.has(code)) return { digits: 0, step: 1 };
  if (THREE_DECIMAL.has(code)) return { digits: 3, step: 10 };
  if (WHOLE_UNITS_IN_TWO_DECIMALS.has(code)) return { digits: 2, step: 100 };
  return { digits: 2, step: 1 };
}

/** The smallest amount, in ISO 4217 minor units, that the provider can take: every amount sent must be a multiple of it. */
export function providerStepMinor(currency: string): number {
  const { digits, step } = providerAmountRule(currency);
  const shift = currencyExponent(currency) - digits;
  return shift >= 0 ? step * 10 ** shift : Math.max(1, step / 10 ** -shift);
}

/** Rounded up to what the provider can take (a deposit never falls below the firm's policy). */
export const roundUpToProviderStep = (minor: number, currency: string) => {
  const step = providerStepMinor(currency);
  return Math.ceil(minor / step) * step;
};

/** ISO minor units → the provider's `amount`. Refuses an amount the provider would not take. */
export function toProviderAmount(minor: number, currency: string): number {
  if (!Number.isSafeInteger(minor)) throw new RangeError(`${minor} is not a whole number of minor units.`);
  if (minor % providerStepMinor(currency) !== 0)
    throw new RangeError(`The payment provider takes ${currency.toUpperCase()} only in multiples of ${providerStepMinor(currency)} minor units.`);
  const shift = providerAmountRule(currency).digits - currencyExponent(currency);
  return shift >= 0 ? minor * 10 ** shift : minor / 10 ** -shift;
}

/** The provider's `amount` → ISO minor units. */
export function fromProviderAmount(amount: number, currency: string): number {
  const shift = currencyExponent(currency) - providerAmountRule(currency).digits;
  return shift >= 0 ? amount * 10 ** shift : Math.round(amount / 10 ** -shift);
}
