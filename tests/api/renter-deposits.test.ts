import { createHash } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payment-fake';
import { eventTable, signPayload } from '../../server/fakes/payments/events';
import type { DepositRequestReply, RentalView, RenterRentalView } from '../../shared/billing/views';
import { eventually } from '../support/eventually';
import { bearer, binaryBody, createTestApp, webhookSecret, type TestApp } from '../support/test-app';

const WEBHOOK_SECRET = webhookSecret();
let t: TestApp;
let fake: PaymentFake;
let server: Server;
let billing: string;
let manager: string;
let owner: string;
let tech: string;
let customerId: string;
const RENTER = 'hangar-office@tessaly.test';

beforeAll(async () => {
  fake = await startPaymentFake({ port: 0, webhookSecret: WEBHOOK_SECRET, webhookRetryDelaysMs: [100, 100] });
  t = await createTestApp({ PAYMENT_API_PORT: String(fake.port), PAYMENT_WEBHOOK_SECRET: WEBHOOK_SECRET, PAYMENT_TIMEOUT_MS: '2000' });
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  fake.store.settings.webhookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/payments`;
  [billing, manager, owner, tech] = await Promise.all(
    ['billing@demo.test', 'manager@demo.test', 'owner@demo.test', 'tech@demo.test'].map((e) => t.tokenFor(e)),
  );
  await t.api
    .patch('/api/settings')
    .set(bearer(owner))
    // The rentals here start months ahead; the counter may hand them over any day before (the checkout window is tested elsewhere).
    .send({ depositPolicy: { percent: 10, minMinor: 40_000, maxMinor: 2_500_000 }, checkoutOpensDaysBefore: 365 });
  customerId = (
    await t.api.post('/api/customers').set(bearer(billing)).send({ company: 'Tessaly Airframe Jigs', billingEmail: RENTER, billingContact: 'Oda Brennick' })
  ).body.id;
});
afterAll(async () => {
  server?.close();
  server?.closeAllConnections();
  await fake?.close();
  await t?.close();
});

let day = 0;
async function newRental(): Promise<RentalView> {
  const start = new Date(Date.UTC(2027, 3, 5 + day));
  day += 5;
  const startsOn = start.toISOString().slice(0, 10);
  const endsOn = new Date(start.getTime() + 3 * 86_400_000).toISOString().slice(0, 10);
  // On the shelf now, so a checkout here never meets an SMR another test of this file has out.
  const ready = new Set((await t.db.query(`SELECT id FROM assets WHERE status = 'ready'`)).map((a: { id: string }) => a.id));
  const free = (await t.api.get('/api/availability').query({ type: 'smr', startsOn, endsOn, limit: 50 }).set(bearer(billing))).body.items
    .filter((a: { id: string }) => ready.has(a.id))
    .slice(0, 1);
  const res = await t.api
    .post('/api/rentals')
    .set(bearer(billing))
    .send({ customerId, assetIds: free.map((a: { id: string }) => a.id), startsOn, endsOn });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}
const requestLink = (r: RentalView) => t.api.post(`/api/rentals/${r.id}/deposit/request`).set(bearer(billing));
const view = async (r: RentalView): Promise<RentalView> => (await t.api.get(`/api/rentals/${r.id}`).set(bearer(billing))).body;
const renterPage = async (token: string): Promise<RenterRentalView> => (await t.api.get(`/api/renter/${token}`)).body;
const checkout = (r: RentalView) =>
  t.api
    .post(`/api/bookings/${r.bookingId}/checkout`)
    .set(bearer(manager))
    .send({ counterpart: 'Oda Brennick', checklist: r.items.map((i) => ({ assetId: i.id, present: true, condition: 'good' })) });
/** The renter's link, read from the mail the request queued (as the renter would find it). */
async function mailedToken(r: RentalView): Promise<string> {
  const [mail] = await t.db.query(`SELECT text_body FROM outbox_messages WHERE $1 = ANY(recipients) AND subject LIKE $2 ORDER BY created_at DESC LIMIT 1`, [
    RENTER,
    `%${r.number}%agreement and deposit%`,
  ]);
  return /\/renter\/([\w-]{40,})/.exec(mail.text_body)![1]!;
}
/** The renter types a card on the provider's hosted page; the redirect is not followed (what it returns is the caller's to look at). */
const typeCard = (url: string, cardNumber: string, expiry = '12 / 34', cvc = '123') =>
  fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ cardNumber, expiry, cvc }),
  });
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const deliver = (payload: string) =>
  fetch(fake.store.settings.webhookUrl!, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'stripe-signature': signPayload(payload, WEBHOOK_SECRET, Math.floor(Date.now() / 1000)) },
    body: payload,
  }).then(async (r) => ({ status: r.status, body: await r.json() }));

describe('the renter places the deposit on the provider’s hosted page', () => {
  let rental: RentalView;
  let reply: DepositRequestReply;
  let token: string;

  it('the clerk requests the link: 201 with the hosted page and its expiry, the renter’s link mailed, only its hash kept', async () => {
    rental = await newRental();
    const res = await requestLink(rental);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    reply = res.body;
    expect(reply.url).toMatch(new RegExp(`^http://127\\.0\\.0\\.1:${fake.port}/pay/cs_test_`));
    // The provider's default lifetime of a Checkout Session: 24 hours (create reference, expires_at).
    expect(Date.parse(reply.expiresAt) - Date.now()).toBeGreaterThan(23 * 3600_000);
    token = await mailedToken(rental);
    expect(reply.renterUrl).toContain(token);
    const stored = await t.db.query(`SELECT token_sha256 FROM renter_links WHERE rental_id = $1`, [rental.id]);
    expect(stored).toEqual([{ token_sha256: sha256(Buffer.from(token)) }]);
    expect(JSON.stringify(await t.db.query(`SELECT * FROM renter_links`))).not.toContain(token);
    expect((await view(rental)).deposit.request).toMatchObject({ state: 'waiting', url: reply.url, sentTo: RENTER });
    // The session asks for manual capture and a card saved for later off-session use.
    const intentData = fake.store
      .table<{ capture_method: string; setup_future_usage: string }>('checkout_session_intent_data')
      .get(reply.url.split('/').pop()!);
    expect(intentData).toMatchObject({ capture_method: 'manual', setup_future_usage: 'off_session' });
    expect((await t.api.post(`/api/rentals/${rental.id}/deposit/request`).set(bearer(tech))).status).toBe(403);
  });

  it('the renter’s page shows the firm, the rental, its terms, each item’s calibration against the last day and the papers, without sign-in', async () => {
    const page = await renterPage(token);
    expect(page).toMatchObject({
      firm: { name: expect.any(String), locale: 'en-GB', timeZone: 'Europe/Berlin', currency: 'EUR' },
      number: rental.number,
      endsOn: rental.endsOn,
      depositMinor: rental.depositMinor,
    });
    expect(page.terms.join(' ')).toMatch(/Late return/);
    expect(page.items).toHaveLength(1);
    const item = page.items[0]!;
    expect(item.coversRental).toBe(!item.calibrationRequired || (item.validThrough !== null && item.validThrough >= rental.endsOn));
    expect(page.deposit.request).toMatchObject({ state: 'waiting', url: reply.url });
    const pdf = await t.api.get(`/api/renter/${token}/agreement.pdf`).buffer(true).parse(binaryBody);
    expect(pdf.status).toBe(200);
    // The fingerprint shown is the SHA-256 of the very bytes the renter downloads (Node's crypto as the independent hash).
    expect(page.agreement.sha256).toBe(sha256(pdf.body as Buffer));
    expect((await t.api.get(`/api/renter/${token}/certificate-pack.pdf`)).status).toBe(200);
    expect((await t.api.get(`/api/renter/${'x'.repeat(43)}`)).status).toBe(404);
  });

  it('closing the hosted page without paying changes nothing: still waiting, checkout blocked', async () => {
    const page = await fetch(reply.url);
    expect(page.status).toBe(200);
    const html = await page.text();
    for (const label of ['Card number', 'Expiry', 'CVC']) expect(html).toContain(`>${label}</label>`);
    expect((await view(rental)).deposit).toMatchObject({ state: 'none', request: { state: 'waiting' } });
    expect((await checkout(rental)).body.error.code).toBe('deposit_required');
  });

  it('the accept step stores who, when, from where and the SHA-256 of the exact agreement; a stale fingerprint is refused', async () => {
    const stale = await t.api.post(`/api/renter/${token}/agreement`).send({ fullName: 'Oda Brennick', agreed: true, agreementSha256: '0'.repeat(64) });
    expect(stale.status).toBe(409);
    const page = await renterPage(token);
    const unticked = await t.api
      .post(`/api/renter/${token}/agreement`)
      .send({ fullName: 'Oda Brennick', agreed: false, agreementSha256: page.agreement.sha256 });
    expect(unticked.status).toBe(400);
    expect(unticked.body.error.details.fields.agreed).toMatch(/tick/);
    const noName = await t.api.post(`/api/renter/${token}/agreement`).send({ fullName: 'Oda', agreed: true, agreementSha256: page.agreement.sha256 });
    expect(noName.body.error.details.fields.fullName).toMatch(/first and last name/);
    const accepted = await t.api
      .post(`/api/renter/${token}/agreement`)
      .set('user-agent', 'renter-phone')
      .send({ fullName: 'Oda Brennick', agreed: true, agreementSha256: page.agreement.sha256 });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    expect(accepted.body.agreement.accepted).toMatchObject({ fullName: 'Oda Brennick' });
    expect((await view(rental)).agreement).toMatchObject({
      fullName: 'Oda Brennick',
      agreementSha256: page.agreement.sha256,
      ipAddress: expect.stringMatching(/127\.0\.0\.1/),
    });
    const [kept] = await t.db.query(`SELECT agreement_pdf FROM agreement_acceptances WHERE rental_id = $1`, [rental.id]);
    expect(sha256(kept.agreement_pdf)).toBe(page.agreement.sha256);
    const audit = await t.db.query(`SELECT details FROM audit_events WHERE action = 'rental.agreement_accepted' AND subject_id = $1::text`, [rental.id]);
    expect(audit).toHaveLength(1);
    expect(audit[0].details).toMatchObject({ fullName: 'Oda Brennick', agreementSha256: page.agreement.sha256 });
  });

  it('records the authorization from the signed event, confirmed with the provider, before the renter is even back', async () => {
    const paid = await typeCard(reply.url, '4242 4242 4242 4242');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(/\/renter\/returned\?session=cs_test_/);
    // The redirect is never followed: the webhook alone records it.
    await eventually(async () => (await view(rental)).deposit.state).toBe('authorized');
    const r = await view(rental);
    expect(r.deposit.authorization).toMatchObject({ amountMinor: rental.depositMinor, cardLast4: '4242', cardBrand: 'visa', initiatedBy: 'customer' });
    expect(r.deposit.request).toMatchObject({ state: 'authorized', url: null });
    const [{ payment_method_id }] = await t.db.query(`SELECT payment_method_id FROM rentals WHERE id = $1`, [rental.id]);
    expect(payment_method_id).toMatch(/^pm_/);
    // Saved for off-session use (renewals, charges above the authorization): attached to the customer's record at the provider.
    const [{ payment_customer_id }] = await t.db.query(`SELECT payment_customer_id FROM customers WHERE id = $1`, [customerId]);
    expect(fake.store.table<{ customer: string | null }>('payment_methods').get(payment_method_id)?.customer).toBe(payment_customer_id);
    expect((await renterPage(token)).deposit).toMatchObject({ state: 'authorized', card: 'Visa ending 4242' });
    expect((await checkout(rental)).status).toBe(200);
  });

  it('a webhook delivered twice, or the same event under a new id, changes nothing more', async () => {
    const completed = [...eventTable(fake.store).values()].find(
      (e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === reply.url.split('/').pop(),
    )!;
    const again = await deliver(JSON.stringify(completed));
    expect(again).toMatchObject({ status: 200, body: { duplicate: true } });
    const renamed = await deliver(JSON.stringify({ ...completed, id: 'evt_replayed_by_someone' }));
    expect(renamed.body).toMatchObject({ duplicate: false, outcome: 'already up to date' });
    const rows = await t.db.query(`SELECT id FROM deposit_authorizations WHERE rental_id = $1`, [rental.id]);
    expect(rows).toHaveLength(1);
  });
});

describe('faults', () => {
  it('a declined card is shown as declined on the hosted page and the rental; the page stays open for another card', async () => {
    const r = await newRental();
    const reply: DepositRequestReply = (await requestLink(r)).body;
    const declined = await typeCard(reply.url, '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined.');
    await eventually(async () => (await view(r)).deposit.request?.state).toBe('declined');
    expect((await view(r)).deposit.request?.declineMessage).toBe('Your card was declined.');
    const poor = await typeCard(reply.url, '4000000000009995');
    expect(await poor.text()).toContain('insufficient funds');
    await eventually(async () => (await view(r)).deposit.request?.declineMessage).toBe('Your card has insufficient funds.');
    expect((await view(r)).deposit.state).toBe('none');
    // A card that is not one of the published test numbers is refused by the page itself.
    expect(await (await typeCard(reply.url, '4111 1111 1111 1112')).text()).toContain('test card numbers');
  });

  it('a forged event claiming a completed page that the provider still has open is not believed', async () => {
    const r = await newRental();
    const reply: DepositRequestReply = (await requestLink(r)).body;
    const sessionId = reply.url.split('/').pop()!;
    const forged = JSON.stringify({
      id: 'evt_forged_completion',
      object: 'event',
      type: 'checkout.session.completed',
      api_version: '2026-10-28.endive',
      created: Math.floor(Date.now() / 1000),
      data: { object: { id: sessionId, object: 'checkout.session', status: 'complete' } },
    });
    const answer = await deliver(forged);
    expect(answer.body.outcome).toMatch(/^not confirmed: .* is open/);
    expect((await view(r)).deposit).toMatchObject({ state: 'none', request: { state: 'waiting' } });
  });

  it('the page expires: the clerk sees it, the hosted page says so, and a new link replaces the old one', async () => {
    const r = await newRental();
    const first: DepositRequestReply = (await requestLink(r)).body;
    const oldToken = await mailedToken(r);
    await fetch(`http://127.0.0.1:${fake.port}/__fake/clock`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ advanceSeconds: 24 * 3600 + 60 }),
    });
    await eventually(async () => (await t.db.query(`SELECT state FROM deposit_requests WHERE rental_id = $1`, [r.id]))[0].state).toBe('expired');
    expect((await view(r)).deposit.request).toMatchObject({ state: 'expired', url: null });
    expect(await (await fetch(first.url)).text()).toContain('expired');
    expect((await typeCard(first.url, '4242424242424242')).status).toBe(409);
    const second = await requestLink(r);
    expect(second.status).toBe(201);
    expect(second.body.url).not.toBe(first.url);
    expect((await t.api.get(`/api/renter/${oldToken}`)).status).toBe(410);
    expect((await renterPage(await mailedToken(r))).deposit.request).toMatchObject({ state: 'waiting', url: second.body.url });
  });

  it('sending again closes the page sent before at the provider, so the card cannot be authorized twice', async () => {
    const r = await newRental();
    const first: DepositRequestReply = (await requestLink(r)).body;
    const again = await requestLink(r);
    expect(again.status).toBe(201);
    expect(await (await fetch(first.url)).text()).toContain('expired');
    const states = await t.db.query(`SELECT state FROM deposit_requests WHERE rental_id = $1 ORDER BY created_at`, [r.id]);
    expect(states.map((s: { state: string }) => s.state)).toEqual(['replaced', 'open']);
  });

  it('the provider down when the link is requested: a clear 502 to retry, nothing half-written; the retry works', async () => {
    const r = await newRental();
    const before = async () =>
      (
        await t.db.query(
          `SELECT (SELECT count(*) FROM deposit_requests WHERE rental_id = $1)::int AS requests, (SELECT count(*) FROM renter_links WHERE rental_id = $1)::int AS links,
                  (SELECT count(*) FROM outbox_messages WHERE subject LIKE $2)::int AS mails, (SELECT count(*) FROM audit_events WHERE subject_id = $1::text AND action = 'deposit.requested')::int AS audits`,
          [r.id, `%${r.number}%`],
        )
      )[0];
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ path: '/v1/checkout/sessions', method: 'POST', mode: '500', times: 10 }),
    });
    const down = await requestLink(r);
    await fetch(`http://127.0.0.1:${fake.port}/__fake/faults`, { method: 'DELETE' });
    expect(down.status).toBe(502);
    expect(down.body.error).toMatchObject({ code: 'payment_unavailable', message: expect.stringMatching(/Try again/) });
    expect(await before()).toEqual({ requests: 0, links: 0, mails: 0, audits: 0 });
    const retry = await requestLink(r);
    expect(retry.status).toBe(201);
    expect(await before()).toEqual({ requests: 1, links: 1, mails: 1, audits: 1 });
  });
});

describe('the counter’s gate', () => {
  it('needs the accepted agreement as well as the authorization, or the owner’s override with a reason (audited)', async () => {
    const r = await newRental();
    expect((await t.api.post(`/api/rentals/${r.id}/deposit`).set(bearer(billing)).send({ paymentMethod: 'pm_card_visa' })).status).toBe(200);
    const blocked = await checkout(r);
    expect(blocked.status).toBe(422);
    expect(blocked.body.error.code).toBe('agreement_required');
    expect((await t.api.post(`/api/rentals/${r.id}/handover-override`).set(bearer(billing)).send({ reason: 'Signed on paper at the counter' })).status).toBe(
      403,
    );
    expect((await t.api.post(`/api/rentals/${r.id}/handover-override`).set(bearer(owner)).send({ reason: 'ok' })).status).toBe(400);
    const overridden = await t.api.post(`/api/rentals/${r.id}/handover-override`).set(bearer(owner)).send({ reason: 'Signed on paper at the counter' });
    expect(overridden.body.handoverOverride).toMatchObject({ reason: 'Signed on paper at the counter' });
    expect((await checkout(r)).status).toBe(200);
    expect(await t.db.query(`SELECT details FROM audit_events WHERE action = 'rental.handover_override' AND subject_id = $1::text`, [r.id])).toEqual([
      { details: { reason: 'Signed on paper at the counter' } },
    ]);
  });
});

describe('live keys', () => {
  it('with a live key the test-card shortcut is gone and the mode says live', async () => {
    const live = await createTestApp({ PAYMENT_API_KEY: 'sk_live_nestkeeperexample', PAYMENT_PUBLISHABLE_KEY: 'pk_live_nestkeeperexample' });
    try {
      const clerk = await live.tokenFor('billing@demo.test');
      expect((await live.api.get('/api/billing/payment-mode').set(bearer(clerk))).body).toEqual({ mode: 'live', publishableKey: 'pk_live_nestkeeperexample' });
      const rentalId = (await live.db.query(`SELECT id FROM rentals LIMIT 1`))[0].id;
      expect((await live.api.post(`/api/rentals/${rentalId}/deposit`).set(bearer(clerk)).send({ paymentMethod: 'pm_card_visa' })).status).toBe(404);
    } finally {
      await live.close();
    }
    expect((await t.api.get('/api/billing/payment-mode').set(bearer(billing))).body).toMatchObject({ mode: 'test' });
  });
});
