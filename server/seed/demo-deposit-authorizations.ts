import type { DataSource } from 'typeorm';
import { DepositAuthorization } from '../billing/deposit-authorization.entity';
import type { PaymentGateway } from '../billing/payment-gateway';
import { Scoped } from '../db/scoped';
import { Customer } from '../rentals/customer.entity';
import { Rental } from '../rentals/rental.entity';

/** True when the provider knows this PaymentIntent. */
const known = (gateway: PaymentGateway, id: string) =>
  gateway.retrieve(id).then(
    () => true,
    () => false,
  );

/**
 * The local payment fake keeps nothing across restarts, while the database
 * still counts on its open deposit authorizations (the demo's among them).
 * Local runs only: each such card authorization is placed again on the fake
 * with the success test card and aged so it lapses when the database says it does.
 */
export async function restoreAuthorizationsOnLocalFake(db: DataSource, gateway: PaymentGateway, fakeBaseUrl: string): Promise<number> {
  const rows: { id: string; organization_id: string; payment_intent_id: string | null }[] = await db.query(
    `SELECT id, organization_id, payment_intent_id FROM deposit_authorizations WHERE kind = 'authorization' AND state = 'authorized'`,
  );
  let restored = 0;
  for (const row of rows) {
    if (row.payment_intent_id && (await known(gateway, row.payment_intent_id))) continue;
    await db.transaction(async (manager) => {
      const tx = new Scoped(manager, row.organization_id);
      const authorization = await tx.get(DepositAuthorization, { id: row.id }, 'That card authorization');
      const rental = await tx.get(Rental, { id: authorization.rentalId }, 'That rental');
      const customer = await tx.get(Customer, { id: rental.customerId }, 'That customer');
      customer.paymentCustomerId = await gateway.ensureCustomer(customer);
      const card = await gateway.saveCard('pm_card_visa', customer.paymentCustomerId, `restore:${authorization.id}:card`);
      const placed = await gateway.confirmIntent({
        amountMinor: authorization.amountMinor,
        currency: rental.currency,
        customer: customer.paymentCustomerId,
        paymentMethod: card,
        capture: 'manual',
        offSession: false,
        description: `Deposit for rental ${rental.number}`,
        metadata: { rentalId: rental.id, organizationId: row.organization_id, purpose: 'deposit' },
        key: `restore:${authorization.id}`,
      });
      if (!placed.ok || !placed.captureBefore || !authorization.captureBefore) return;
      const seconds = Math.max(0, Math.round((placed.captureBefore.getTime() - authorization.captureBefore.getTime()) / 1000));
      await fetch(`${fakeBaseUrl}/__fake/authorizations/${placed.id}/age`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ seconds }),
      });
      await tx.save(Customer, customer);
      Object.assign(rental, { paymentMethodId: card });
      await tx.save(Rental, rental);
      Object.assign(authorization, { paymentIntentId: placed.id, cardBrand: placed.cardBrand, cardLast4: placed.cardLast4 });
      await tx.save(DepositAuthorization, authorization);
      restored += 1;
    });
  }
  await closeForgottenPaymentPages(db, gateway);
  return restored;
}

/** Hosted payment pages the restarted fake no longer knows can never be paid: their requests read as expired, and the clerk sends a new link. */
async function closeForgottenPaymentPages(db: DataSource, gateway: PaymentGateway) {
  const open: { id: string; checkout_session_id: string }[] = await db.query(`SELECT id, checkout_session_id FROM deposit_requests WHERE state = 'open'`);
  for (const request of open) {
    const known = await gateway.retrieveCheckout(request.checkout_session_id).then(
      () => true,
      () => false,
    );
    if (!known) await db.query(`UPDATE deposit_requests SET state = 'expired' WHERE id = $1 AND state = 'open'`, [request.id]);
  }
}
