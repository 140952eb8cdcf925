import type { Scoped } from '../db/scoped';
import { getCustomer, rememberPaymentCustomer } from '../rentals';
import type { PaymentGateway } from './payment-gateway';

/** The customer's record with the provider, made (under a key per customer) at their first deposit. */
export async function providerCustomer(tx: Scoped, gateway: PaymentGateway, customerId: string): Promise<string> {
  const customer = await getCustomer(tx, customerId);
  if (customer.paymentCustomerId) return customer.paymentCustomerId;
  const paymentCustomerId = await gateway.ensureCustomer(customer);
  await rememberPaymentCustomer(tx, customer.id, paymentCustomerId);
  return paymentCustomerId;
}
