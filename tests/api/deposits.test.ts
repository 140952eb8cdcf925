import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createPaymentClient } from '../../server/billing/payment-client';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';
import { signPayload } from '../../server/fakes/payments/events';
import type { RentalView } from '../../shared/billing/views';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { pdfText } from '../support/pdf';
import { bearer, binaryBody, createTestApp, webhookSecret, type TestApp } from '../support/test-app';
import { eventually } from '../support/eventually';
import { renterAccepts, renterLinkFor } from '../support/renter';

const WEBHOOK_SECRET = webhookSecret();
let t: TestApp;
let fake: PaymentFake;
let server: Server;
let billing: string;
let manager: string;
let tech: string;
let owner: string;
let otherOwner: string;
let customerId: string;
let stripe: ReturnType<typeof createPaymentClient>;

beforeAll(async () => {
  fake = await startPaymentFake({ port: 0, webhookSecret: WEBHOOK_SECRET, webhookRetryDelaysMs: [100, 100] });
  // The SDK gives up on a call after 2 s here (an ordinary reply comes well before, even on a busy machine), so a withheld reply turns into retries quickly.
  t = await createTestApp({ PAYMENT_API_PORT: String(fake.port), PAYMENT_WEBHOOK_SECRET: WEBHOOK_SECRET, PAYMENT_TIMEOUT_MS: '2000' });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  fake.store.settings.webhookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/payments`;
  stripe = createPaymentClient({
    PAYMENT_API_KEY: t.config.PAYMENT_API_KEY,
    PAYMENT_API_HOST: '127.0.0.1',
    PAYMENT_API_PORT: fake.port,
    PAYMENT_API_PROTOCOL: 'http',
    PAYMENT_TIMEOUT_MS: 5000,
  });
  [billing, manager, tech, owner, otherOwner] = await Promise.all(
    ['billing@demo.test', 'manager@demo.test', 'tech@demo.test', 'owner@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)),
  );
  await t.api
    .patch('/api/settings')
    .set(bearer(owner))
    .send({ taxRateBasisPoints: 1900, depositPolicy: { percent: 10, minMinor: 50_000, maxMinor: 2_500_000 }, checkoutOpensDaysBefore: 365 });
  // Checkout opens a year ahead here: these rentals lie months out and are handed over as the money steps need.
  // The demo seed's SMR rate card: day 15.00, week 75.00, month 240.00, late fee 5.00.
  customerId = (
    await t.api
      .post('/api/customers')
      .set(bearer(billing))
      .send({ company: 'Quillon Test Rigs', billingEmail: 'accounts@quillon.test', billingContact: 'Ines Varga' })
  ).body.id;
});
afterAll(async () => {
  server?.close();
  server?.closeAllConnections();
  await fake?.close();
  await t?.close();
});

let day = 0;
/** Two free SMRs for a fresh window each time (rentals in this file never overlap). */
async function newRental(days = 13): Promise<RentalView> {
  const start = new Date(Date.UTC(2027, 0, 4 + day));
  day += days + 1;
  const startsOn = start.toISOString().slice(0, 10);
  const endsOn = new Date(start.getTime() + (days - 1) * 86_400_000).toISOString().slice(0, 10);
  const free = (await t.api.get('/api/availability').query({ type: 'smr', startsOn, endsOn, limit: 2 }).set(bearer(billing))).body.items;
  const res = await t.api
    .post('/api/rentals')
    .set(bearer(billing))
    .send({ customerId, assetIds: free.map((a: { id: string }) => a.id), startsOn, endsOn });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}
const checklist = (r: RentalView, damaged?: string) => ({
  counterpart: 'Ines Varga',
  checklist: r.items.map((i) => ({ assetId: i.id, present: true, condition: i.id === damaged ? 'damaged' : 'good' })),
});
const takeDeposit = (r: RentalView, paymentMethod = 'pm_card_visa') => t.api.post(`/api/rentals/${r.id}/deposit`).set(bearer(billing)).send({ paymentMethod });
/** At the counter; the renter has accepted the agreement on their page first (tests/api/renter-deposits.test.ts covers that gate). */
const checkout = async (r: RentalView) => {
  const accepted = await renterAccepts(t.api, await renterLinkFor(t.db, r.id));
  expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
  return t.api.post(`/api/bookings/${r.bookingId}/checkout`).set(bearer(manager)).send(checklist(r));
};
const giveBack = (r: RentalView, damaged?: string) => t.api.post(`/api/bookings/${r.bookingId}/return`).set(bearer(manager)).send(checklist(r, damaged));
const view = async (r: RentalView): Promise<RentalView> => (await t.api.get(`/api/rentals/${r.id}`).set(bearer(billing))).body;
const mailTo = (address: string) =>
  t.db.query(
    `SELECT m.subject, array_agg(a.file_name ORDER BY a.file_name) FILTER (WHERE a.id IS NOT NULL) AS files FROM outbox_messages m LEFT JOIN outbox_attachments a ON a.message_id = m.id WHERE $1 = ANY(m.recipients) GROUP BY m.id, m.subject ORDER BY m.created_at`,
    [address],
  );

describe('a rental from quote to invoice', () => {
  let rental: RentalView;

  it('books at quoted prices under the booking rules; technicians may not rent', async () => {
    rental = await newRental();
    expect(rental).toMatchObject({ number: expect.stringMatching(/^R-\d{4}$/), state: 'reserved', currency: 'EUR', depositMinor: 50_000 });
    // 13 days of two SMRs: two weeks each (common practice: cheapest cover), 300.00 + 19 % tax.
    expect(rental.quote).toMatchObject({ days: 13, subtotalMinor: 30_000, taxMinor: 5700, totalMinor: 35_700 });
    const booking = (await t.api.get(`/api/bookings/${rental.bookingId}`).set(bearer(manager))).body;
    expect(booking).toMatchObject({
      purpose: 'rental',
      rentalId: rental.id,
      rental: { id: rental.id, number: rental.number, customerCompany: 'Quillon Test Rigs' },
    });
    // A bare booking cannot claim a rental: the two are made together.
    const claim = await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [rental.items[0].id], startsOn: '2027-09-01', endsOn: '2027-09-02', rentalId: rental.id });
    expect(claim.status).toBe(422);
    expect(claim.body.error.code).toBe('rental_booking');
    expect(
      (
        await t.api
          .post('/api/rentals')
          .set(bearer(tech))
          .send({ customerId, assetIds: [rental.items[0].id], startsOn: '2027-06-01', endsOn: '2027-06-02' })
      ).status,
    ).toBe(403);
    // The same SMRs for overlapping days: the bookings rules answer, unchanged.
    const clash = await t.api
      .post('/api/rentals')
      .set(bearer(billing))
      .send({ customerId, assetIds: rental.items.map((i) => i.id), startsOn: rental.endsOn, endsOn: rental.endsOn });
    expect(clash.status).toBe(409);
    expect(clash.body.error.details.conflicts[0].bookingId).toBe(rental.bookingId);
  });

  it('refuses checkout until the deposit is authorized on the card; a declined card says so and keeps blocking', async () => {
    const blocked = await checkout(rental);
    expect(blocked.status).toBe(422);
    expect(blocked.body.error.code).toBe('deposit_required');
    const declined = await takeDeposit(rental, 'pm_card_chargeDeclined');
    expect(declined.status).toBe(422);
    expect(declined.body.error).toMatchObject({ code: 'card_declined' });
    expect(declined.body.error.message).toMatch(/declined/);
    const poor = await takeDeposit(rental, 'pm_card_chargeDeclinedInsufficientFunds');
    expect(poor.body.error.message).toMatch(/insufficient funds/);
    expect((await view(rental)).deposit.state).toBe('declined');
    expect((await checkout(rental)).body.error.code).toBe('deposit_required');
  });

  it('technicians may not take deposits; another firm cannot see the rental', async () => {
    expect((await t.api.post(`/api/rentals/${rental.id}/deposit`).set(bearer(tech)).send({ paymentMethod: 'pm_card_visa' })).status).toBe(403);
    // A rental and its papers are the billing desk's (the customer gets the papers by e-mail at hand-over).
    expect((await t.api.get(`/api/rentals/${rental.id}`).set(bearer(tech))).status).toBe(403);
    expect((await t.api.get(`/api/rentals/${rental.id}/agreement.pdf`).set(bearer(manager))).status).toBe(403);
    expect((await t.api.get(`/api/rentals/${rental.id}`).set(bearer(otherOwner))).status).toBe(404);
    expect((await t.api.post(`/api/rentals/${rental.id}/deposit`).set(bearer(otherOwner)).send({ paymentMethod: 'pm_card_visa' })).status).toBe(404);
  });

  it('authorizes with the success card (manual capture, 7-day window) and hands over with papers mailed', async () => {
    const held = await takeDeposit(rental);
    expect(held.status, JSON.stringify(held.body)).toBe(200);
    const authorization = held.body.deposit.authorization;
    expect(authorization).toMatchObject({ state: 'authorized', amountMinor: 50_000, cardBrand: 'visa', cardLast4: '4242', initiatedBy: 'customer' });
    // Provider reference ("Place a hold on a payment method"): 7 days for a customer-initiated online card authorization.
    const [{ payment_intent_id }] = await t.db.query(`SELECT payment_intent_id FROM deposit_authorizations WHERE id = $1`, [authorization.id]);
    const intent = await stripe.paymentIntents.retrieve(payment_intent_id);
    expect(intent).toMatchObject({ status: 'requires_capture', capture_method: 'manual', amount: 50_000, amount_capturable: 50_000 });
    expect(Date.parse(authorization.captureBefore) / 1000 - intent.created).toBe(7 * 24 * 3600);
    expect((await checkout(rental)).status).toBe(200);
    const mails = await mailTo('accounts@quillon.test');
    expect(mails.at(-1)).toMatchObject({
      subject: expect.stringContaining(rental.number),
      files: [`agreement-${rental.number}.pdf`, `certificates-${rental.number}.pdf`],
    });
  });

  it('comes back with a damaged SMR: the repair and tax are captured from the card authorization, the rest released', async () => {
    const damaged = rental.items[1];
    const back = await giveBack(rental, damaged.id);
    expect(back.status).toBe(200);
    let r = await view(rental);
    expect(r.state).toBe('returned');
    expect(r.charges).toEqual([expect.objectContaining({ assetId: damaged.id, amountMinor: null })]);
    expect((await t.api.post(`/api/rentals/${rental.id}/invoice`).set(bearer(billing))).body.error.code).toBe('deposit_unsettled');
    r = (await t.api.put(`/api/rentals/${rental.id}/charges/${r.charges[0].incidentId}`).set(bearer(billing)).send({ amountMinor: 18_000 })).body;
    // Worked by hand: repair 180.00 + 19 % = 214.20 to take from the 500.00 authorization.
    expect(r.settlement.extrasGrossMinor).toBe(21_420);
    expect((await t.api.post(`/api/rentals/${rental.id}/deposit/capture`).set(bearer(tech)).send({ amountMinor: 21_420, reason: 'SMR repair' })).status).toBe(
      403,
    );
    const captured = await t.api
      .post(`/api/rentals/${rental.id}/deposit/capture`)
      .set(bearer(billing))
      .send({ amountMinor: 21_420, reason: 'Dented SMR: re-coat and recertify' });
    expect(captured.status, JSON.stringify(captured.body)).toBe(200);
    expect(captured.body.deposit).toMatchObject({ state: 'captured', authorization: { capturedMinor: 21_420 } });
    const [{ payment_intent_id }] = await t.db.query(`SELECT payment_intent_id FROM deposit_authorizations WHERE id = $1`, [
      captured.body.deposit.authorization.id,
    ]);
    // Provider reference (capture, amount_to_capture): the uncaptured rest is released.
    expect(await stripe.paymentIntents.retrieve(payment_intent_id)).toMatchObject({ status: 'succeeded', amount_received: 21_420, amount_capturable: 0 });
    const again = await t.api.post(`/api/rentals/${rental.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 100, reason: 'twice' });
    expect(again.status).toBe(409);
  });

  it('issues the invoice with a gapless number, a PDF and an e-mail; a credit note corrects it', async () => {
    const year = Number(todayIn('Europe/Berlin').slice(0, 4));
    // The next numbers after the demo's own invoices and credit notes of this year.
    const [{ invoices, credits }] = await t.db.query(
      `SELECT count(*) FILTER (WHERE kind = 'invoice')::int AS invoices, count(*) FILTER (WHERE kind = 'credit_note')::int AS credits FROM invoices WHERE issued_on >= make_date($1, 1, 1)`,
      [year],
    );
    const invoiceNo = `${year}-${String(invoices + 1).padStart(4, '0')}`;
    const creditNo = `CN-${year}-${String(credits + 1).padStart(4, '0')}`;
    const issued = await t.api.post(`/api/rentals/${rental.id}/invoice`).set(bearer(billing));
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    // 300.00 rental + 180.00 repair = 480.00; tax 91.20; total 571.20; 214.20 taken from the authorization → 357.00 due (worked by hand).
    expect(issued.body).toMatchObject({
      number: invoiceNo,
      subtotalMinor: 48_000,
      taxMinor: 9120,
      totalMinor: 57_120,
      depositCapturedMinor: 21_420,
      balanceMinor: 35_700,
    });
    expect((await t.api.post(`/api/rentals/${rental.id}/invoice`).set(bearer(billing))).status).toBe(409);
    const pdf = await t.api.get(`/api/rentals/${rental.id}/invoice.pdf`).set(bearer(billing)).buffer(true).parse(binaryBody);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain(invoiceNo);
    expect(text).toContain('€357.00');
    // The firm's own details (demo settings) are printed, and kept on the invoice: a later change leaves it as issued.
    expect(text).toContain('Tax number WH-7781-0042');
    await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({ issuer: { address: 'Mill Yard 3, Wrenhallow', taxNumber: 'WH-0000-0001', paymentTerms: 'Within 30 days.' } });
    expect((await t.api.get(`/api/invoices/${issued.body.id}`).set(bearer(billing))).body.issuer).toMatchObject({ taxNumber: 'WH-7781-0042' });
    expect((await mailTo('accounts@quillon.test')).at(-1).files).toEqual([`invoice-${invoiceNo}.pdf`]);
    const tooMuch = await t.api.post(`/api/invoices/${issued.body.id}/credit-note`).set(bearer(billing)).send({ reason: 'Goodwill', amountMinor: 48_001 });
    expect(tooMuch.status).toBe(422);
    const credit = await t.api
      .post(`/api/invoices/${issued.body.id}/credit-note`)
      .set(bearer(billing))
      .send({ reason: 'Repair cost lower than estimated', amountMinor: 3000 });
    expect(credit.status).toBe(201);
    // 30.00 + 19 % = 35.70 credited.
    expect(credit.body).toMatchObject({ kind: 'credit_note', number: creditNo, correctsNumber: invoiceNo, totalMinor: 3570 });
    expect((await t.api.get(`/api/invoices/${issued.body.id}`).set(bearer(billing))).body.creditedMinor).toBe(3000);
    // Invoices are never edited: the database refuses.
    await expect(t.db.query(`UPDATE invoices SET total_minor = 0 WHERE id = $1`, [issued.body.id])).rejects.toThrow();
    // 357.00 due less the credit note's 35.70 = 321.30 outstanding; a transfer is recorded against it, never more than is owed.
    expect((await t.api.get(`/api/invoices/${issued.body.id}`).set(bearer(billing))).body).toMatchObject({ receivedMinor: 0, outstandingMinor: 32_130 });
    const over = await t.api
      .post(`/api/invoices/${issued.body.id}/payments`)
      .set(bearer(billing))
      .send({ amountMinor: 32_131, receivedOn: '2027-02-03', reference: 'Transfer QTR-8812' });
    expect(over.status).toBe(422);
    expect(over.body.error.code).toBe('overpaid');
    expect(
      (await t.api.post(`/api/invoices/${issued.body.id}/payments`).set(bearer(tech)).send({ amountMinor: 100, receivedOn: '2027-02-03', reference: 'x y' }))
        .status,
    ).toBe(403);
    const paid = await t.api
      .post(`/api/invoices/${issued.body.id}/payments`)
      .set(bearer(billing))
      .send({ amountMinor: 32_130, receivedOn: '2027-02-03', reference: 'Transfer QTR-8812' });
    expect(paid.status).toBe(201);
    expect(paid.body).toMatchObject({
      receivedMinor: 32_130,
      outstandingMinor: 0,
      payments: [expect.objectContaining({ amountMinor: 32_130, receivedOn: '2027-02-03', reference: 'Transfer QTR-8812' })],
    });
    await expect(t.db.query(`DELETE FROM invoice_payments`)).rejects.toThrow();
    const csv = await t.api.get('/api/invoices/export.csv').set(bearer(billing));
    expect(csv.text.split('\r\n')[0]).toContain('Number,Kind,Issued on,Customer,Corrects,Currency,Subtotal (EUR),Tax (EUR),Total (EUR)');
    expect(csv.text).toContain(creditNo);
  });
});

describe('when the provider misbehaves', () => {
  async function returnedWithAuthorization() {
    const r = await newRental(3);
    expect((await takeDeposit(r)).status).toBe(200);
    expect((await checkout(r)).status).toBe(200);
    expect((await giveBack(r)).status).toBe(200);
    return r;
  }
  const intentOf = async (r: RentalView) =>
    (
      await t.db.query(
        `SELECT payment_intent_id FROM deposit_authorizations WHERE rental_id = $1 AND kind = 'authorization' AND state <> 'declined' ORDER BY created_at DESC LIMIT 1`,
        [r.id],
      )
    )[0].payment_intent_id as string;
  const captureCharges = async (pi: string) => (await stripe.charges.list({ payment_intent: pi })).data.filter((c) => c.captured);

  it('a capture whose reply is lost is retried under the same key: captured exactly once', async () => {
    const r = await returnedWithAuthorization();
    // The fake applies the capture but withholds its reply past the SDK's 2 s timeout — once.
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ path: '/v1/payment_intents/:id/capture', mode: 'timeout', times: 1, hangMs: 10_000 }),
    });
    const res = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 5000, reason: 'Scratched case' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const pi = await stripe.paymentIntents.retrieve(await intentOf(r));
    expect(pi).toMatchObject({ status: 'succeeded', amount_received: 5000 });
    expect(await captureCharges(pi.id)).toHaveLength(1);
  });

  it("when every attempt times out the clerk is told to retry; the provider's event tells the truth and nothing is captured twice", async () => {
    const r = await returnedWithAuthorization();
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ path: '/v1/payment_intents/:id/capture', mode: 'timeout', times: 3, hangMs: 10_000 }),
    });
    const failed = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 7000, reason: 'Late by two days' });
    expect(failed.status).toBe(502);
    expect(failed.body.error.code).toBe('payment_unavailable');
    // The capture did happen at the provider; its signed payment_intent.succeeded event brings the authorization up to date.
    await eventually(async () => (await view(r)).deposit.authorization?.capturedMinor).toBe(7000);
    const retried = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 7000, reason: 'Late by two days' });
    expect(retried.status).toBe(409);
    const pi = await stripe.paymentIntents.retrieve(await intentOf(r));
    expect(pi.amount_received).toBe(7000);
    expect(await captureCharges(pi.id)).toHaveLength(1);
  }, 30_000);

  it('a provider answering 500 captures nothing; the clerk is told to try again, and the retry captures once', async () => {
    const r = await returnedWithAuthorization();
    // Three faults: the first call and both of the SDK's retries fail, nothing applied (provider reference: api_error).
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ path: '/v1/payment_intents/:id/capture', mode: '500', times: 3 }),
    });
    const failed = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 4000, reason: 'Cleaning' });
    expect(failed.status).toBe(502);
    expect(failed.body.error.code).toBe('payment_unavailable');
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, { method: 'DELETE' });
    expect((await stripe.paymentIntents.retrieve(await intentOf(r))).status).toBe('requires_capture');
    expect((await view(r)).deposit.state).toBe('authorized');
    const retried = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 4000, reason: 'Cleaning' });
    expect(retried.status).toBe(200);
    expect((await stripe.paymentIntents.retrieve(await intentOf(r))).amount_received).toBe(4000);
  }, 30_000);

  it('an authorization that lapsed before its event reached us: the capture finds out and goes on the saved card', async () => {
    const r = await returnedWithAuthorization();
    const url = fake.store.settings.webhookUrl;
    fake.store.settings.webhookUrl = undefined; // the event is lost on the way
    await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ advanceSeconds: 8 * 24 * 3600 }),
    });
    fake.store.settings.webhookUrl = url;
    expect((await view(r)).deposit.state).toBe('authorized');
    const res = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 6000, reason: 'Late by three days' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.deposit.state).toBe('lapsed');
    expect(res.body.settlement).toMatchObject({ depositCapturedMinor: 0, cardChargedMinor: 6000 });
  });

  it('a charge above the authorization: it is captured whole and the rest charged to the saved card', async () => {
    const r = await returnedWithAuthorization();
    const res = await t.api.post(`/api/rentals/${r.id}/deposit/capture`).set(bearer(billing)).send({ amountMinor: 80_000, reason: 'SMR lost' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.settlement).toMatchObject({ depositCapturedMinor: 50_000, cardChargedMinor: 30_000 });
    expect(res.body.deposit.authorizations.at(-1)).toMatchObject({ kind: 'charge', state: 'captured', capturedMinor: 30_000, initiatedBy: 'merchant' });
  });

  it('moving a rental to other dates prices it for the new days', async () => {
    const r = await newRental(13);
    const endsOn = new Date(Date.parse(r.startsOn) + 5 * 86_400_000).toISOString().slice(0, 10);
    expect((await t.api.patch(`/api/bookings/${r.bookingId}`).set(bearer(manager)).send({ startsOn: r.startsOn, endsOn })).status).toBe(200);
    // Six days of two SMRs: a week each (75.00) beats six days (90.00) — worked by hand, common practice.
    expect((await view(r)).quote).toMatchObject({ days: 6, endsOn, subtotalMinor: 15_000, taxMinor: 2850 });
  });

  it('cancelling a reserved rental releases the card authorization of its deposit', async () => {
    const r = await newRental(3);
    expect((await takeDeposit(r)).status).toBe(200);
    expect((await t.api.post(`/api/bookings/${r.bookingId}/cancel`).set(bearer(manager))).status).toBe(200);
    const after = await view(r);
    expect(after).toMatchObject({ state: 'cancelled', deposit: { state: 'released' } });
    expect((await stripe.paymentIntents.retrieve(await intentOf(r))).status).toBe('canceled');
  });

  it('releases an authorization in full', async () => {
    const r = await returnedWithAuthorization();
    const res = await t.api.post(`/api/rentals/${r.id}/deposit/release`).set(bearer(billing));
    expect(res.body.deposit.state).toBe('released');
    expect((await stripe.paymentIntents.retrieve(await intentOf(r))).status).toBe('canceled');
  });
});

describe('what the customer is told, and the invoice their accounts department files', () => {
  it('a release is mailed to the billing contact and kept with its outbox mail; the invoice PDF names the rental, items, period, due date and bank', async () => {
    await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({
        issuer: {
          address: 'Mill Yard 3, Wrenhallow',
          taxNumber: 'WH-7781-0042',
          paymentTerms: 'Please quote the invoice number.',
          paymentDays: 21,
          bankDetails: 'Wrenhallow Mutual, IBAN XX00 1111 2222 3333 4444 55',
        },
      });
    const r = await newRental(3);
    expect((await takeDeposit(r)).status).toBe(200);
    expect((await checkout(r)).status).toBe(200);
    expect((await giveBack(r)).status).toBe(200);
    const released = await t.api.post(`/api/rentals/${r.id}/deposit/release`).set(bearer(billing));
    expect(released.status).toBe(200);
    expect((released.body as RentalView).moneyMails).toEqual([
      expect.objectContaining({
        event: 'deposit_released',
        releasedMinor: r.depositMinor,
        capturedMinor: 0,
        sentTo: ['accounts@quillon.test'],
        mail: 'waiting',
        sentAt: null,
      }),
    ]);
    const [told] = await t.db.query(
      `SELECT subject, text_body FROM outbox_messages WHERE id = (SELECT outbox_message_id FROM money_mails WHERE rental_id = $1)`,
      [r.id],
    );
    expect(told.subject).toBe(`Rental ${r.number}: deposit released`);
    expect(told.text_body).toContain('The whole authorization of €500.00 is released');

    const issued = await t.api.post(`/api/rentals/${r.id}/invoice`).set(bearer(billing));
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    // The due date: issue date + 21 days, checked with luxon (an independent date library).
    const dueOn = DateTime.fromISO(issued.body.issuedOn, { zone: 'utc' }).plus({ days: 21 }).toISODate()!;
    expect(issued.body.dueOn).toBe(dueOn);
    const day = (iso: string) => DateTime.fromISO(iso, { zone: 'utc' }).setLocale('en-GB').toFormat('d LLL yyyy');
    const pdf = await t.api.get(`/api/invoices/${issued.body.id}/document.pdf`).set(bearer(billing)).buffer(true).parse(binaryBody);
    const text = pdfText(pdf.body as Buffer).replace(/\u00a0/g, ' ');
    for (const part of [
      `Rental ${r.number}`,
      ...r.items.flatMap((i) => [i.assetTag, i.serialNumber]),
      `Due date ${day(dueOn)}`,
      `Issue date ${day(issued.body.issuedOn)}`,
      'Bank details: Wrenhallow Mutual, IBAN XX00 1111 2222 3333 4444 55',
      'Please quote the invoice number.',
      'Tax 19 %',
    ])
      expect(text).toContain(part);
    // The period: both dates of the rental with their year, however the range is written.
    expect(text).toMatch(new RegExp(`Rental period .*${DateTime.fromISO(r.endsOn).toFormat('yyyy')}`));
    expect(issued.body.rental).toMatchObject({ number: r.number, startsOn: r.startsOn, endsOn: r.endsOn });

    const credit = await t.api.post(`/api/invoices/${issued.body.id}/credit-note`).set(bearer(billing)).send({ reason: 'One day waived', amountMinor: 1500 });
    expect(credit.status).toBe(201);
    expect(credit.body).toMatchObject({ corrects: { number: issued.body.number, issuedOn: issued.body.issuedOn }, dueOn: null });
    const creditPdf = await t.api.get(`/api/invoices/${credit.body.id}/document.pdf`).set(bearer(billing)).buffer(true).parse(binaryBody);
    const creditText = pdfText(creditPdf.body as Buffer);
    expect(creditText).toContain(`Corrects invoice ${issued.body.number} of ${day(issued.body.issuedOn)}`);
    expect(creditText).toContain(`Rental ${r.number}`);
    const mails = (await t.api.get(`/api/rentals/${r.id}`).set(bearer(billing))).body.moneyMails as { event: string; documentNumber: string | null }[];
    expect(mails.map((m) => [m.event, m.documentNumber])).toEqual([
      ['deposit_released', null],
      ['invoice_issued', issued.body.number],
      ['credit_note_issued', credit.body.number],
    ]);
  });
});

describe('payment webhooks', () => {
  const post = (payload: string, signature: string) =>
    t.api.post('/api/webhooks/payments').set('Content-Type', 'application/json').set('Stripe-Signature', signature).send(payload);
  const event = (id: string) =>
    JSON.stringify({
      id,
      object: 'event',
      type: 'customer.updated',
      api_version: '2026-10-28.endive',
      created: Math.floor(Date.now() / 1000),
      data: { object: { id: 'cus_x', object: 'customer' } },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
    });

  it('verifies the signature with the SDK; tampered or stale deliveries are refused', async () => {
    const body = event('evt_sig_1');
    const now = Math.floor(Date.now() / 1000);
    expect((await post(body, signPayload(body, WEBHOOK_SECRET, now))).status).toBe(200);
    expect((await post(body.replace('cus_x', 'cus_y'), signPayload(body, WEBHOOK_SECRET, now))).status).toBe(400);
    expect((await post(body, signPayload(body, 'whsec_wrong', now))).status).toBe(400);
    // The SDK's default tolerance is 300 s (provider reference, "Verify webhook signatures").
    const stale = await post(event('evt_sig_2'), signPayload(event('evt_sig_2'), WEBHOOK_SECRET, now - 600));
    expect(stale.status).toBe(400);
    expect(stale.body.error.code).toBe('invalid_signature');
  });

  it('processes an event delivered twice only once', async () => {
    const body = event('evt_twice');
    const sig = signPayload(body, WEBHOOK_SECRET, Math.floor(Date.now() / 1000));
    expect((await post(body, sig)).body).toMatchObject({ received: true, duplicate: false });
    expect((await post(body, sig)).body).toMatchObject({ received: true, duplicate: true });
    expect((await t.db.query(`SELECT count(*)::int AS n FROM payment_events WHERE event_id = 'evt_twice'`))[0].n).toBe(1);
  });

  it('refuses events signed with the old built-in secret', async () => {
    const body = event('evt_old_default');
    expect((await post(body, signPayload(body, 'whsec_nestkeeper_local', Math.floor(Date.now() / 1000)))).status).toBe(400);
  });

  describe('a signed claim about a card authorization is checked with the provider first', () => {
    const claim = (id: string, type: string, intent: string) =>
      JSON.stringify({
        id,
        object: 'event',
        type,
        api_version: '2026-10-28.endive',
        created: Math.floor(Date.now() / 1000),
        data: {
          object: {
            id: intent,
            object: 'payment_intent',
            status: type === 'payment_intent.canceled' ? 'canceled' : 'succeeded',
            amount_received: 50_000,
            cancellation_reason: 'automatic',
          },
        },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
      });
    const send = (body: string) => post(body, signPayload(body, WEBHOOK_SECRET, Math.floor(Date.now() / 1000)));
    const outcomeOf = async (id: string) =>
      (await t.db.query(`SELECT outcome FROM payment_events WHERE event_id = $1`, [id]))[0]?.outcome as string | undefined;

    it('a cancellation or capture the provider does not confirm changes nothing, and is recorded as such', async () => {
      const r = await newRental(3);
      expect((await takeDeposit(r)).status).toBe(200);
      const [{ payment_intent_id: intent }] = await t.db.query(
        `SELECT payment_intent_id FROM deposit_authorizations WHERE rental_id = $1 AND state = 'authorized'`,
        [r.id],
      );
      expect((await send(claim('evt_forged_cancel', 'payment_intent.canceled', intent))).status).toBe(200);
      expect((await send(claim('evt_forged_capture', 'payment_intent.succeeded', intent))).status).toBe(200);
      expect(await outcomeOf('evt_forged_cancel')).toMatch(/^not confirmed: .* is requires_capture, not canceled; nothing changed$/);
      expect(await outcomeOf('evt_forged_capture')).toMatch(/^not confirmed: .* is requires_capture, not succeeded; nothing changed$/);
      expect((await view(r)).deposit).toMatchObject({ state: 'authorized', authorization: { capturedMinor: 0 } });
      expect((await mailTo('billing@demo.test')).map((m: { subject: string }) => m.subject)).not.toContain(`Deposit authorization lapsed: rental ${r.number}`);
      expect((await stripe.paymentIntents.retrieve(intent)).status).toBe('requires_capture');
    });

    it('when the provider cannot be asked, the delivery is refused (502) and nothing is recorded, so its retry counts', async () => {
      const r = await newRental(3);
      expect((await takeDeposit(r)).status).toBe(200);
      const [{ payment_intent_id: intent }] = await t.db.query(
        `SELECT payment_intent_id FROM deposit_authorizations WHERE rental_id = $1 AND state = 'authorized'`,
        [r.id],
      );
      // The provider really cancels it, but its own event is lost on the way; a delivery of ours stands in for it.
      const url = fake.store.settings.webhookUrl;
      fake.store.settings.webhookUrl = undefined;
      await stripe.paymentIntents.cancel(intent, {}, { idempotencyKey: `test:${intent}:cancel` });
      fake.store.settings.webhookUrl = url;
      const fault = { path: '/v1/payment_intents/:id', method: 'GET', mode: '500', times: 10 };
      await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(fault),
      });
      const body = claim('evt_unasked_cancel', 'payment_intent.canceled', intent);
      const refused = await send(body);
      await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, { method: 'DELETE' });
      expect(refused.status).toBe(502);
      expect(await outcomeOf('evt_unasked_cancel')).toBeUndefined();
      expect((await send(body)).body).toMatchObject({ duplicate: false, outcome: expect.stringMatching(/lapsed$/) });
      expect((await view(r)).deposit.state).toBe('lapsed');
    }, 30_000);
  });

  it('an authorization the provider lets lapse is marked lapsed from its signed event, and the clerk is told', async () => {
    const r = await newRental(3);
    await takeDeposit(r);
    await checkout(r);
    // Eight days later at the provider: past the 7-day window, the authorization is released and the event delivered.
    await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ advanceSeconds: 8 * 24 * 3600 }),
    });
    await eventually(async () => (await view(r)).deposit.state).toBe('lapsed');
    const mails = await mailTo('billing@demo.test');
    expect(mails.at(-1).subject).toBe(`Deposit authorization lapsed: rental ${r.number}`);
  });
});

describe('the daily renewal of card authorizations near lapse', () => {
  const runRenewals = (now: Date) =>
    t.routines.definitions.find((j) => j.name === 'deposit-renewals')!.run({ db: t.db, now, trigger: 'manual', organizationId: null });

  it('renews on the saved card (merchant-initiated: Visa 4 days 18 hours) and lets the old authorization go', async () => {
    const r = await newRental(20);
    await takeDeposit(r);
    await checkout(r);
    const first = (await view(r)).deposit.authorization!;
    // Six days on, the authorization lapses within 48 hours.
    const summary = await runRenewals(new Date(Date.parse(first.captureBefore!) - 24 * 3600_000));
    expect(summary).toMatchObject({ renewed: 1, refused: 0 });
    const after = await view(r);
    expect(after.deposit.authorization).toMatchObject({ state: 'authorized', initiatedBy: 'merchant', amountMinor: first.amountMinor });
    expect(after.deposit.authorizations.find((h) => h.id === first.id)!.state).toBe('replaced');
    const [{ payment_intent_id }] = await t.db.query(`SELECT payment_intent_id FROM deposit_authorizations WHERE id = $1`, [after.deposit.authorization!.id]);
    const pi = await stripe.paymentIntents.retrieve(payment_intent_id);
    // Provider reference: merchant-initiated authorizations on Visa are held 4 days 18 hours.
    expect(Date.parse(after.deposit.authorization!.captureBefore!) / 1000 - pi.created).toBe(4 * 24 * 3600 + 18 * 3600);
    const [{ payment_intent_id: old }] = await t.db.query(`SELECT payment_intent_id FROM deposit_authorizations WHERE id = $1`, [first.id]);
    expect((await stripe.paymentIntents.retrieve(old)).status).toBe('canceled');
  });

  it('tells the clerk when the card refuses the renewal', async () => {
    const r = await newRental(20);
    await takeDeposit(r);
    await checkout(r);
    const authorization = (await view(r)).deposit.authorization!;
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ path: '/v1/payment_intents', method: 'POST', mode: 'decline', times: 10 }),
    });
    const summary = await runRenewals(new Date(Date.parse(authorization.captureBefore!) - 24 * 3600_000));
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, { method: 'DELETE' });
    expect(summary.refused).toBeGreaterThanOrEqual(1);
    const after = await view(r);
    expect(after.deposit).toMatchObject({ state: 'authorized', authorization: { id: authorization.id } });
    expect(after.deposit.authorizations.at(-1)).toMatchObject({ state: 'declined', initiatedBy: 'merchant' });
    expect((await mailTo('billing@demo.test')).map((m: { subject: string }) => m.subject)).toContain(`Deposit authorization not renewed: rental ${r.number}`);
  });
});

describe('invoice numbers under concurrency', () => {
  it('50 invoices issued at once get 50 consecutive numbers, no gap, no repeat', async () => {
    await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({ depositPolicy: { percent: 0, minMinor: 0, maxMinor: 0 } });
    // An SMR of its own, in the shop and free for the fifty days (the file's other rentals keep theirs out or reserved).
    const made = await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({ type: 'smr', assetTag: 'SMR-INV-50', serialNumber: 'SMR-INV-50', specs: { diameterMm: 38.1 } });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const smr = made.body as { id: string };
    const rentals: RentalView[] = [];
    for (let i = 0; i < 50; i += 1) {
      const on = addDays(todayIn('Europe/Berlin'), 1 + i);
      const res = await t.api
        .post('/api/rentals')
        .set(bearer(billing))
        .send({ customerId, assetIds: [smr.id], startsOn: on, endsOn: on });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      const out = await checkout(res.body);
      expect(out.status, JSON.stringify(out.body)).toBe(200);
      expect((await giveBack(res.body)).status).toBe(200);
      rentals.push(res.body);
    }
    const before = (await t.api.get('/api/invoices').query({ kind: 'invoice' }).set(bearer(billing))).body.total;
    const issued = await Promise.all(rentals.map((r) => t.api.post(`/api/rentals/${r.id}/invoice`).set(bearer(billing))));
    expect(issued.map((r) => r.status)).toEqual(rentals.map(() => 201));
    const numbers = issued.map((r) => Number(String(r.body.number).split('-')[1])).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 50 }, (_, i) => before + 1 + i));
  }, 120_000);
});
