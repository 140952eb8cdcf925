import { Router } from 'express';
import { z } from 'zod';
import { resourceMissing } from './errors';
import { applyMetadata, common, listPage, listParams, metadataParam, nullableText, parseParams, textOrNull, type Metadata } from './params';
import type { PaymentResource } from './resource';
import type { PaymentStore } from './store';

export type Customer = {
  id: string;
  object: 'customer';
  address: null;
  balance: number;
  created: number;
  currency: string | null;
  default_source: string | null;
  delinquent: boolean;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  invoice_settings: {
    custom_fields: null;
    default_payment_method: string | null;
    footer: null;
    rendering_options: null;
  };
  livemode: false;
  metadata: Metadata;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
  preferred_locales: string[];
  shipping: null;
  tax_exempt: 'none';
  test_clock: null;
};

const writable = {
  ...common,
  email: nullableText,
  name: nullableText,
  description: nullableText,
  phone: nullableText,
  metadata: metadataParam,
  invoice_settings: z.strictObject({ default_payment_method: z.string().optional() }).optional(),
};
const createSchema = z.strictObject(writable);
const updateSchema = z.strictObject(writable);
const retrieveSchema = z.strictObject(common);
const listSchema = z.strictObject({ ...common, ...listParams, email: z.string().optional() });

export const customerTable = (store: PaymentStore) => store.table<Customer>('customers');

/** For other resources (payment methods, intents): the customer or a 404 naming `param`. */
export function findCustomer(store: PaymentStore, id: string, param = 'customer'): Customer {
  const customer = customerTable(store).get(id);
  if (!customer) throw resourceMissing('customer', id, param);
  return customer;
}

export const customers: PaymentResource = {
  name: 'customers',
  router(store) {
    const router = Router();
    const table = customerTable(store);

    router.post('/v1/customers', (req, res) => {
      const p = parseParams(createSchema, req.body);
      const id = store.newId('cus');
      const customer: Customer = {
        id,
        object: 'customer',
        address: null,
        balance: 0,
        created: store.nowSeconds(),
        currency: null,
        default_source: null,
        delinquent: false,
        description: textOrNull(p.description),
        email: textOrNull(p.email),
        invoice_prefix: id.slice(4, 12).toUpperCase(),
        invoice_settings: {
          custom_fields: null,
          default_payment_method: p.invoice_settings?.default_payment_method ?? null,
          footer: null,
          rendering_options: null,
        },
        livemode: false,
        metadata: applyMetadata({}, p.metadata),
        name: textOrNull(p.name),
        next_invoice_sequence: 1,
        phone: textOrNull(p.phone),
        preferred_locales: [],
        shipping: null,
        tax_exempt: 'none',
        test_clock: null,
      };
      table.set(id, customer);
      res.json(customer);
    });

    router.get('/v1/customers', (req, res) => {
      const p = parseParams(listSchema, req.query);
      const all = [...table.values()].filter((c) => p.email === undefined || c.email === p.email);
      res.json(listPage('/v1/customers', all, p));
    });

    router.get('/v1/customers/:id', (req, res) => {
      parseParams(retrieveSchema, req.query);
      res.json(findCustomer(store, req.params.id, 'id'));
    });

    router.post('/v1/customers/:id', (req, res) => {
      const customer = findCustomer(store, req.params.id, 'id');
      const p = parseParams(updateSchema, req.body);
      const updated: Customer = {
        ...customer,
        description: textOrNull(p.description, customer.description),
        email: textOrNull(p.email, customer.email),
        name: textOrNull(p.name, customer.name),
        phone: textOrNull(p.phone, customer.phone),
        metadata: applyMetadata(customer.metadata, p.metadata),
        invoice_settings: {
          ...customer.invoice_settings,
          default_payment_method: textOrNull(p.invoice_settings?.default_payment_method, customer.invoice_settings.default_payment_method),
        },
      };
      table.set(customer.id, updated);
      res.json(updated);
    });

    return router;
  },
};
