import { cheapestCover, depositMinor, taxMinor } from '../../shared/billing/quote';
import type { Quote, QuoteLine } from '../../shared/billing/views';
import { assetTypeTitles, type AssetType } from '../../shared/assets/vocabulary';
import { bookingDays } from '../../shared/bookings/rules';
import type { Scoped } from '../db/scoped';
import { Asset } from '../fleet/asset.entity';
import { Kit } from '../fleet/kit.entity';
import { ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations/org-context';
import { RateCard } from './rate-card.entity';
import { Rental } from './rental.entity';
import { BookingItem, type Booking } from '../bookings/booking.entity';
import { DepositHold } from '../billing/deposit-hold.entity';

/**
 * A rental's booking moved: its prices follow the new dates (same items, the
 * rate cards of today). The deposit follows too, unless a hold for the old
 * amount is already on the card.
 */
export async function repriceRental(tx: Scoped, booking: Booking) {
  if (!booking.rentalId) return;
  const rental = await tx.get(Rental, { id: booking.rentalId }, 'That rental');
  const items = (await tx.find(BookingItem, { where: { bookingId: booking.id } })).map((i) => i.assetId);
  const kitMembers = booking.kitId ? (await tx.find(Asset, { where: { kitId: booking.kitId } })).map((a) => a.id) : [];
  const quote = await priceRental(tx, { kitId: booking.kitId ?? undefined, assetIds: items.filter((id) => !kitMembers.includes(id)), startsOn: booking.startsOn, endsOn: booking.endsOn });
  const held = await tx.count(DepositHold, { rentalId: rental.id, kind: 'hold', state: 'authorized' });
  Object.assign(rental, { quote, depositMinor: held ? rental.depositMinor : quote.depositMinor });
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
  const kit = q.kitId ? await tx.get(Kit, { id: q.kitId }, 'That kit') : null;
  const kitMembers = kit ? await tx.find(Asset, { where: { kitId: kit.id } }) : [];
  const loose = await tx.getEach(Asset, q.assetIds ?? [], 'One of those items');
  const cards = await tx.find(RateCard, {});
  const days = bookingDays(q.startsOn, q.endsOn);
  const lines: QuoteLine[] = [];
  const line = (card: RateCard, fields: Pick<QuoteLine, 'description' | 'assetIds' | 'kitId'>): QuoteLine => {
    const rates = { dayMinor: card.dayMinor, weekMinor: card.weekMinor, monthMinor: card.monthMinor };
    const cover = cheapestCover(days, rates);
    const quantity = fields.kitId ? 1 : fields.assetIds.length;
    return { ...fields, quantity, periods: cover.periods, unitMinor: cover.totalMinor, amountMinor: cover.totalMinor * quantity, rates, lateFeePerDayMinor: card.lateFeePerDayMinor };
  };
  const kitCard = kit ? cards.find((c) => c.kitId === kit.id) : undefined;
  if (kit && kitCard) lines.push(line(kitCard, { description: kit.name, assetIds: kitMembers.map((m) => m.id), kitId: kit.id }));
  const byType = new Map<AssetType, Asset[]>();
  for (const a of [...(kitCard ? [] : kitMembers), ...loose.filter((a) => !kitMembers.some((m) => m.id === a.id))]) byType.set(a.type, [...(byType.get(a.type) ?? []), a]);
  const unpriced = [...byType.keys()].filter((t) => !cards.some((c) => c.assetType === t));
  if (unpriced.length) throw ruleBroken('no_rate', `No rate card for: ${unpriced.map((t) => assetTypeTitles[t]).join(', ')}. Add one under rate cards.`, { types: unpriced });
  for (const [type, assets] of byType) lines.push(line(cards.find((c) => c.assetType === type)!, { description: assetTypeTitles[type], assetIds: assets.map((a) => a.id), kitId: null }));
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
    depositMinor: depositMinor(replacement, ctx.depositPolicy),
    currency: ctx.currency,
  };
}
