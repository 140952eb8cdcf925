import { Not, type DataSource } from 'typeorm';
import type { z } from 'zod';
import type { CustomerView } from '../../shared/billing/views';
import type { Page } from '../../shared/lists/page';
import type { customerPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict } from '../http/errors';
import { Customer } from './customer.entity';

type CustomerInput = z.infer<typeof customerPayload>;

/** What the API shows of a customer: never the payment provider's customer id, which only billing uses. */
const customerView = (c: Customer): CustomerView => ({
  id: c.id,
  company: c.company,
  billingContact: c.billingContact,
  billingEmail: c.billingEmail,
  address: c.address,
  taxNumber: c.taxNumber,
  notes: c.notes,
});

/** Customers: the firms that rent kit, with their billing details. */
export class CustomersService {
  constructor(private readonly db: DataSource) {}

  list(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<CustomerView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Customer, { order: { company: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items: items.map(customerView), total };
    });
  }

  get(actor: Actor, id: string): Promise<CustomerView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => customerView(await tx.get(Customer, { id }, 'That customer')));
  }

  save(actor: Actor, input: CustomerInput, id?: string): Promise<CustomerView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (await tx.count(Customer, { company: input.company, ...(id ? { id: Not(id) } : {}) })) {
        throw conflict(`${input.company} is already a customer.`, { fields: { company: 'is already a customer' } });
      }
      const values = {
        company: input.company,
        billingContact: input.billingContact ?? null,
        billingEmail: input.billingEmail,
        address: input.address ?? null,
        taxNumber: input.taxNumber ?? null,
        notes: input.notes ?? null,
      };
      const customer = id ? await tx.save(Customer, Object.assign(await tx.get(Customer, { id }, 'That customer'), values)) : await tx.insert(Customer, values);
      await recordAudit(tx, actor, id ? 'customer.updated' : 'customer.created', { type: 'customer', id: customer.id }, { company: customer.company });
      return customerView(customer);
    });
  }
}
