import { In, Not, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { bookingDays } from '../../shared/bookings/rules';
import { cheapestCover, depositMinor, taxMinor } from '../../shared/billing/quote';
import { assetTypeTitles, type AssetType } from '../../shared/assets/vocabulary';
import type { customerPayload, quoteQuery, rateCardPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { Asset } from '../fleet/asset.entity';
import { Kit } from '../fleet/kit.entity';
import { conflict, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations/org-context';
import { Customer } from './customer.entity';
import { RateCard } from './rate-card.entity';
import { listReply } from '../http/list-reply';

type CustomerInput = z.infer<typeof customerPayload>;
type RateCardInput = z.infer<typeof rateCardPayload>;

/** Customers, rate cards and quotes: the ground a rental stands on. */
export class RentalsService {
  constructor(private readonly db: DataSource) {}

  listCustomers(actor: Actor, paging: { limit: number; offset: number }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Customer, { order: { company: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items, total };
    });
  }

  getCustomer(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, (tx) => tx.get(Customer, { id }, 'That customer'));
  }

  saveCustomer(actor: Actor, input: CustomerInput, id?: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (await tx.count(Customer, { company: input.company, ...(id ? { id: Not(id) } : {}) })) {
        throw conflict(`${input.company} is already a customer.`, { fields: { company: 'is already a customer' } });
      }
      const values = { company: input.company, billingContact: input.billingContact ?? null, billingEmail: input.billingEmail, address: input.address ?? null, taxNumber: input.taxNumber ?? null, notes: input.notes ?? null };
      const customer = id ? await tx.save(Customer, Object.assign(await tx.get(Customer, { id }, 'That customer'), values)) : await tx.insert(Customer, values);
      await recordAudit(tx, actor, id ? 'customer.updated' : 'customer.created', { type: 'customer', id: customer.id }, { company: customer.company });
      return customer;
    });
  }

  listRateCards(actor: Actor) {
    return inOrganization(this.db, actor.organizationId, async (tx) => listReply(await tx.find(RateCard, { order: { assetType: 'ASC' } })));
  }

  saveRateCard(actor: Actor, input: RateCardInput, id?: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (input.kitId) await tx.get(Kit, { id: input.kitId }, 'That kit');
      const subject = input.kitId ? { kitId: input.kitId } : { assetType: input.assetType! };
      const clash = await tx.findOne(RateCard, subject);
      if (clash && clash.id !== id) throw conflict('That type or kit already has a rate card; change that one.', { fields: { [input.kitId ? 'kitId' : 'assetType']: 'already has a rate card' } });
      const values = { assetType: input.assetType ?? null, kitId: input.kitId ?? null, dayMinor: input.dayMinor, weekMinor: input.weekMinor, monthMinor: input.monthMinor, lateFeePerDayMinor: input.lateFeePerDayMinor };
      const card = id ? await tx.save(RateCard, Object.assign(await tx.get(RateCard, { id }, 'That rate card'), values)) : await tx.insert(RateCard, values);
      await recordAudit(tx, actor, 'rate_card.saved', { type: 'rate_card', id: card.id }, values);
      return card;
    });
  }

  /**
   * Price a rental: a kit with its own rate card rents as one line; other items
   * rent by their type's card, one line per type. Each line charges the cheapest
   * cover of the rental days (shared/billing/quote.ts).
   */
  quote(actor: Actor, q: z.infer<typeof quoteQuery>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      if (q.customerId) await tx.get(Customer, { id: q.customerId }, 'That customer');
      const kit = q.kitId ? await tx.get(Kit, { id: q.kitId }, 'That kit') : null;
      const kitMembers = kit ? await tx.find(Asset, { where: { kitId: kit.id } }) : [];
      const loose = q.assetIds?.length ? await tx.find(Asset, { where: { id: In(q.assetIds) } }) : [];
      if (loose.length !== new Set(q.assetIds ?? []).size) throw ruleBroken('unknown_asset', 'One of those items is not in your fleet.');
      const cards = await tx.find(RateCard, {});
      const days = bookingDays(q.startsOn, q.endsOn);
      const lines: { description: string; assetIds: string[]; quantity: number; periods: ReturnType<typeof cheapestCover>['periods']; unitMinor: number; amountMinor: number }[] = [];
      const kitCard = kit ? cards.find((c) => c.kitId === kit.id) : undefined;
      const byType = new Map<AssetType, Asset[]>();
      for (const a of [...(kitCard ? [] : kitMembers), ...loose.filter((a) => !kitMembers.some((m) => m.id === a.id))]) byType.set(a.type, [...(byType.get(a.type) ?? []), a]);
      if (kit && kitCard) {
        const cover = cheapestCover(days, kitCard);
        lines.push({ description: kit.name, assetIds: kitMembers.map((m) => m.id), quantity: 1, periods: cover.periods, unitMinor: cover.totalMinor, amountMinor: cover.totalMinor });
      }
      const unpriced = [...byType.keys()].filter((t) => !cards.some((c) => c.assetType === t));
      if (unpriced.length) throw ruleBroken('no_rate', `No rate card for: ${unpriced.map((t) => assetTypeTitles[t]).join(', ')}. Add one under rate cards.`, { types: unpriced });
      for (const [type, assets] of byType) {
        const cover = cheapestCover(days, cards.find((c) => c.assetType === type)!);
        lines.push({ description: assetTypeTitles[type], assetIds: assets.map((a) => a.id), quantity: assets.length, periods: cover.periods, unitMinor: cover.totalMinor, amountMinor: cover.totalMinor * assets.length });
      }
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
    });
  }
}
