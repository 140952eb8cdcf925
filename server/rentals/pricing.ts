import { cheapestCover, depositMinor, taxMinor } from '../../shared/billing/quote';
import { roundUpToProviderStep } from '../../shared/billing/provider-amounts';
import type { Quote, QuoteLine } from '../../shared/billing/views';
import { assetTypeTitles, type AssetType } from '../../shared/assets/vocabulary';
import { bookingDays } from '../../shared/bookings/rules';
import type { BookingView } from '../bookings';
import type { Scoped } from '../db/scoped';
import { assetsByIds, getAssets, getKit, kitMembers as membersOf, type AssetRecord } from '../fleet';
import { ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { RateCard } from './rate-card.entity';
import type { RentalMoney } from './rental-money';
import { Rental } from './rental.entity';

/**
 * A rental's booking moved: its prices follow the new dates (same items, the
 * rate cards of today). The deposit follows too, unless the card is already
 * authorized for the old amount.
 */
export async function repriceRental(tx: Scoped, booking: BookingView, money: RentalMoney) {
  if (!booking.rentalId) return;
  const rental = await tx.get(Rental, { id: booking.rentalId }, 'That rental');
  const items = booking.assetIds;
  const kitMembers = booking.kitId ? (await membersOf(tx, booking.kitId)).map((a) => a.id) : [];
  const quote = await priceRental(tx, {
    kitId: booking.kitId ?? undefined,
    assetIds: items.filter((id) => !kitMembers.includes(id)),
    startsOn: booking.startsOn,
    endsOn: booking.endsOn,
  });
  const authorized = (await money.depositState(tx, rental.id)) === 'authorized';
  Object.assign(rental, { quote, depositMinor: authorized ? rental.depositMinor : quote.depositMinor });
  await tx.save(Rental, rental);
}

export type PriceRequest = { kitId?: string; assetIds?: string[]; startsOn: string; endsOn: string };

/**
 * Price a rental: a kit with its own rate card rents as one line; other items
 * rent by their type's card, one line per type. Each line charges the cheapest
 * cover of the rental days (shared/billing/quote.ts).
 */
export async function priceRental(tx: Scoped, q: PriceRequest): Promise<Quote> {
  const ctx = await loadOrgContext(tx);
  const kit = q.kitId ? await getKit(tx, q.kitId) : null;
  const kitMembers = kit ? await membersOf(tx, kit.id) : [];
  const loose = await getAssets(tx, q.assetIds ?? []);
  const cards = await tx.find(RateCard, {});
  const days = bookingDays(q.startsOn, q.endsOn);
  const lines: QuoteLine[] = [];
  const line = (card: RateCard, fields: Pick<QuoteLine, 'description' | 'assetIds' | 'kitId'>): QuoteLine => {
    const rates = { dayMinor: card.dayMinor, weekMinor: card.weekMinor, monthMinor: card.monthMinor };
    const cover = cheapestCover(days, rates);
    const quantity = fields.kitId ? 1 : fields.assetIds.length;
    return {
      ...fields,
      quantity,
      periods: cover.periods,
      unitMinor: cover.totalMinor,
      amountMinor: cover.totalMinor * quantity,
      rates,
      lateFeePerDayMinor: card.lateFeePerDayMinor,
    };
  };
  const kitCard = kit ? cards.find((c) => c.kitId === kit.id) : undefined;
  if (kit && kitCard) lines.push(line(kitCard, { description: kit.name, assetIds: kitMembers.map((m) => m.id), kitId: kit.id }));
  const byType = new Map<AssetType, AssetRecord[]>();
  for (const a of [...(kitCard ? [] : kitMembers), ...loose.filter((a) => !kitMembers.some((m) => m.id === a.id))])
    byType.set(a.type, [...(byType.get(a.type) ?? []), a]);
  const unpriced = [...byType.keys()].filter((t) => !cards.some((c) => c.assetType === t));
  if (unpriced.length)
    throw ruleBroken('no_rate', `No rate card for: ${unpriced.map((t) => assetTypeTitles[t]).join(', ')}. Add one under rate cards.`, { types: unpriced });
  for (const [type, assets] of byType)
    lines.push(
      line(
        cards.find((c) => c.assetType === type)!,
        { description: assetTypeTitles[type], assetIds: assets.map((a) => a.id), kitId: null },
      ),
    );
  const subtotalMinor = lines.reduce((s, l) => s + l.amountMinor, 0);
  const tax = taxMinor(subtotalMinor, ctx.taxRateBasisPoints);
  const replacement = [...kitMembers, ...loose].reduce((s, a) => s + (a.replacementValueMinor ?? 0), 0);
  return {
    days,
    startsOn: q.startsOn,
    endsOn: q.endsOn,
    lines,
    subtotalMinor,
    taxRateBasisPoints: ctx.taxRateBasisPoints,
    taxMinor: tax,
    totalMinor: subtotalMinor + tax,
    // Rounded up to a step the payment provider can authorize (KWD in 0.010, MGA in whole ariary).
    depositMinor: roundUpToProviderStep(depositMinor(replacement, ctx.depositPolicy), ctx.currency),
    currency: ctx.currency,
  };
}
