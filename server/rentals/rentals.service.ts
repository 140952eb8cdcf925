import { Not, type DataSource } from 'typeorm';
import type { z } from 'zod';
import type { CustomerView, Quote, RateCardView } from '../../shared/billing/views';
import type { Page } from '../../shared/lists/page';
import type { customerPayload, quoteQuery, rateCardPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { getKit } from '../fleet';
import { conflict } from '../http/errors';
import { Customer } from './customer.entity';
import { priceRental } from './pricing';
import { RateCard } from './rate-card.entity';
import { listReply } from '../http/list-reply';

type CustomerInput = z.infer<typeof customerPayload>;
type RateCardInput = z.infer<typeof rateCardPayload>;

/** Customers, rate cards and quotes: the ground a rental stands on. */
export class RentalsService {
  constructor(private readonly db: DataSource) {}

  listCustomers(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<CustomerView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Customer, { order: { company: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items, total };
    });
  }

  getCustomer(actor: Actor, id: string): Promise<CustomerView> {
    return inOrganization(this.db, actor.organizationId, (tx) => tx.get(Customer, { id }, 'That customer'));
  }

  saveCustomer(actor: Actor, input: CustomerInput, id?: string): Promise<CustomerView> {
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

  listRateCards(actor: Actor): Promise<Page<RateCardView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => listReply(await tx.find(RateCard, { order: { assetType: 'ASC' } })));
  }

  saveRateCard(actor: Actor, input: RateCardInput, id?: string): Promise<RateCardView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (input.kitId) await getKit(tx, input.kitId);
      const subject = input.kitId ? { kitId: input.kitId } : { assetType: input.assetType! };
      const clash = await tx.findOne(RateCard, subject);
      if (clash && clash.id !== id) throw conflict('That type or kit already has a rate card; change that one.', { fields: { [input.kitId ? 'kitId' : 'assetType']: 'already has a rate card' } });
      const values = { assetType: input.assetType ?? null, kitId: input.kitId ?? null, dayMinor: input.dayMinor, weekMinor: input.weekMinor, monthMinor: input.monthMinor, lateFeePerDayMinor: input.lateFeePerDayMinor };
      const card = id ? await tx.save(RateCard, Object.assign(await tx.get(RateCard, { id }, 'That rate card'), values)) : await tx.insert(RateCard, values);
      await recordAudit(tx, actor, 'rate_card.saved', { type: 'rate_card', id: card.id }, values);
      return card;
    });
  }

  quote(actor: Actor, q: z.infer<typeof quoteQuery>): Promise<Quote> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      if (q.customerId) await tx.get(Customer, { id: q.customerId }, 'That customer');
      return priceRental(tx, q);
    });
  }
}
