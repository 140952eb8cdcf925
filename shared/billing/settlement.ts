import { lateChargeMinor, periodWords, taxMinor } from './quote';
import type { InvoiceLine, Quote, Settlement } from './views';

/** Whole days from `endsOn` to `returnedOn` (dates inclusive, so returning on the end day is not late). */
export function lateDaysBetween(endsOn: string, returnedOn: string): number {
  const days = (Date.parse(`${returnedOn}T00:00:00Z`) - Date.parse(`${endsOn}T00:00:00Z`)) / 86_400_000;
  return Math.max(0, Math.round(days));
}

/**
 * What a rental comes to at return (DESIGN.md §5): the quoted lines, late days
 * per line at the day rate plus the late fee, damage charges, tax on the sum,
 * then what the deposit capture and card charges already paid.
 */
export function settle(input: {
  quote: Quote;
  lateDays: number;
  damage: { description: string; amountMinor: number }[];
  depositCapturedMinor: number;
  cardChargedMinor: number;
}): Settlement {
  const { quote, lateDays } = input;
  const lines: InvoiceLine[] = quote.lines.map((l) => ({
    kind: 'rental',
    description: `${l.description} — ${periodWords(l.periods)} (${quote.startsOn} to ${quote.endsOn})`,
    quantity: l.quantity,
    unitMinor: l.unitMinor,
    amountMinor: l.amountMinor,
  }));
  const extras: InvoiceLine[] = [];
  if (lateDays > 0) {
    for (const l of quote.lines) {
      const unit = lateChargeMinor(lateDays, l.rates, l.lateFeePerDayMinor);
      extras.push({
        kind: 'late',
        description: `${l.description} — ${lateDays} late day${lateDays === 1 ? '' : 's'}`,
        quantity: l.quantity,
        unitMinor: unit,
        amountMinor: unit * l.quantity,
      });
    }
  }
  for (const d of input.damage) extras.push({ kind: 'damage', description: d.description, quantity: 1, unitMinor: d.amountMinor, amountMinor: d.amountMinor });
  const all = [...lines, ...extras];
  const subtotalMinor = all.reduce((s, l) => s + l.amountMinor, 0);
  const tax = taxMinor(subtotalMinor, quote.taxRateBasisPoints);
  const extrasNet = extras.reduce((s, l) => s + l.amountMinor, 0);
  const totalMinor = subtotalMinor + tax;
  return {
    lateDays,
    lines: all,
    subtotalMinor,
    taxMinor: tax,
    totalMinor,
    extrasGrossMinor: extrasNet + taxMinor(extrasNet, quote.taxRateBasisPoints),
    depositCapturedMinor: input.depositCapturedMinor,
    cardChargedMinor: input.cardChargedMinor,
    balanceMinor: totalMinor - input.depositCapturedMinor - input.cardChargedMinor,
  };
}
