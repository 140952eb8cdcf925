import { Not, type DataSource } from 'typeorm';
import type { z } from 'zod';
import type { customerPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict } from '../http/errors';
import { Customer } from './customer.entity';

type CustomerInput = z.infer<typeof customerPayload>;

/** Customers: the firms that rent kit, with their billing details. */
export class CustomersService {
  constructor(private readonly db: DataSource) {}

  list(actor: Actor, paging: { limit: number; offset: number }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [items, total] = await tx.findAndCount(Customer, { order: { company: 'ASC' }, take: paging.limit, skip: paging.offset });
      return { items, total };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, (tx) => tx.get(Customer, { id }, 'That customer'));
  }

  save(actor: Actor, input: CustomerInput, id?: string) {
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
      return customer;
    });
  }
}
