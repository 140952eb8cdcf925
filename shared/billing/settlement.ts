import { addDays } from '../calibration/due-date';
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
    // The period itself is printed beside the lines in the firm's date format, never as ISO dates inside the text.
    description: `${l.description} — ${periodWords(l.periods)}`,
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

/**
 * How a capture at return splits (DepositsService.capture does exactly this): what comes from the card authorization,
 * what of it is released to the renter's card, and what goes on the saved card as a charge above it. Without a live
 * authorization (`authorizedMinor` 0) the whole amount is a charge.
 */
export function captureSplit(amountMinor: number, authorizedMinor: number): { fromAuthorizationMinor: number; releasedMinor: number; chargedMinor: number } {
  const fromAuthorizationMinor = Math.min(amountMinor, authorizedMinor);
  return { fromAuthorizationMinor, releasedMinor: authorizedMinor - fromAuthorizationMinor, chargedMinor: amountMinor - fromAuthorizationMinor };
}

/**
 * A credit note against an invoice: `amountMinor` net (all that is left when omitted), its tax at the invoice's rate,
 * and what is left to credit before it. `null` net when the amount is more than is left or nothing.
 */
export function creditNoteAmounts(
  invoice: { subtotalMinor: number; creditedMinor: number; taxRateBasisPoints: number },
  amountMinor?: number,
): { leftMinor: number; netMinor: number | null; taxMinor: number; totalMinor: number } {
  const leftMinor = invoice.subtotalMinor - invoice.creditedMinor;
  const net = amountMinor ?? leftMinor;
  if (net <= 0 || net > leftMinor) return { leftMinor, netMinor: null, taxMinor: 0, totalMinor: 0 };
  const tax = taxMinor(net, invoice.taxRateBasisPoints);
  return { leftMinor, netMinor: net, taxMinor: tax, totalMinor: net + tax };
}

/** The day an invoice issued on `issuedOn` falls due: `paymentDays` calendar days later (0: due on the day of issue). */
export const paymentDueOn = (issuedOn: string, paymentDays: number): string => addDays(issuedOn, paymentDays);
