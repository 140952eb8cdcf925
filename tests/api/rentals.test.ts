import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let billing: string;
let tech: string;
let manager: string;
let owner: string;
let otherOwner: string;
beforeAll(async () => {
  t = await createTestApp();
  [billing, tech, manager, owner, otherOwner] = await Promise.all(
    ['billing@demo.test', 'tech@demo.test', 'manager@demo.test', 'owner@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)),
  );
});
afterAll(() => t.close());

describe('customers, rate cards and quotes', () => {
  it('lets billing add customers and rate cards; technicians may not', async () => {
    const customer = await t.api
      .post('/api/customers')
      .set(bearer(billing))
      .send({ company: 'Wexley Composite Tooling', billingEmail: 'AP@wexley-tooling.test', billingContact: 'Accounts payable' });
    expect(customer.status).toBe(201);
    expect(customer.body.billingEmail).toBe('ap@wexley-tooling.test');
    expect((await t.api.post('/api/customers').set(bearer(billing)).send({ company: 'Wexley Composite Tooling', billingEmail: 'x@y.test' })).status).toBe(409);
    expect((await t.api.post('/api/customers').set(bearer(tech)).send({ company: 'Nope Ltd', billingEmail: 'n@n.test' })).status).toBe(403);
    expect((await t.api.get(`/api/customers/${customer.body.id}`).set(bearer(otherOwner))).status).toBe(404);
    // The demo seed already prices every type: a second SMR card is refused, the first one can be changed.
    const again = await t.api
      .post('/api/rate-cards')
      .set(bearer(billing))
      .send({ assetType: 'smr', dayMinor: 1500, weekMinor: 7500, monthMinor: 24000, lateFeePerDayMinor: 500 });
    expect(again.status).toBe(409);
    const smrCard = (await t.api.get('/api/rate-cards').set(bearer(billing))).body.items.find((c: { assetType: string }) => c.assetType === 'smr');
    const card = await t.api
      .put(`/api/rate-cards/${smrCard.id}`)
      .set(bearer(billing))
      .send({ assetType: 'smr', dayMinor: 1500, weekMinor: 7500, monthMinor: 24000, lateFeePerDayMinor: 500 });
    expect(card.status).toBe(200);
    const bad = await t.api.post('/api/rate-cards').set(bearer(billing)).send({ dayMinor: 1, weekMinor: 1, monthMinor: 1, lateFeePerDayMinor: 0 });
    expect(bad.body.error.details.fields.assetType).toMatch(/asset type or a kit/);
  });

  it('quotes the cheapest cover per line, with tax and a deposit within the policy', async () => {
    await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({ taxRateBasisPoints: 1900, depositPolicy: { percent: 10, minMinor: 50_000, maxMinor: 2_500_000 } });
    const smrs = (await t.api.get('/api/assets?type=smr&limit=2').set(bearer(billing))).body.items;
    // 13 days of two SMRs: two weeks (15 000) beat a week and six days (16 500), per SMR.
    const q = await t.api
      .get('/api/quotes')
      .query({ assetIds: smrs.map((s: { id: string }) => s.id).join(','), startsOn: '2027-03-01', endsOn: '2027-03-13' })
      .set(bearer(billing));
    expect(q.status).toBe(200);
    expect(q.body).toMatchObject({ days: 13, subtotalMinor: 30000, taxMinor: 5700, totalMinor: 35700, currency: 'EUR' });
    expect(q.body.lines).toEqual([
      expect.objectContaining({ description: 'SMR', quantity: 2, periods: { months: 0, weeks: 2, days: 0 }, unitMinor: 15000, amountMinor: 30000 }),
    ]);
    // Replacement value 2 × 1 600.00 → 10 % = 320.00, below the 500.00 minimum.
    expect(q.body.depositMinor).toBe(50_000);
  });

  it('prices a kit with its own rate card as one line, and names types without a rate card', async () => {
    const kit = (await t.api.get('/api/kits').set(bearer(billing))).body.items.find((k: { name: string }) => k.name === 'Kit Alder');
    await t.db.query(`DELETE FROM rate_cards WHERE asset_type = 'case'`);
    const missing = await t.api.get('/api/quotes').query({ kitId: kit.id, startsOn: '2027-03-01', endsOn: '2027-03-07' }).set(bearer(billing));
    expect(missing.status).toBe(422);
    expect(missing.body.error.code).toBe('no_rate');
    await t.api
      .post('/api/rate-cards')
      .set(bearer(billing))
      .send({ kitId: kit.id, dayMinor: 90_000, weekMinor: 400_000, monthMinor: 1_200_000, lateFeePerDayMinor: 20_000 });
    const q = await t.api.get('/api/quotes').query({ kitId: kit.id, startsOn: '2027-03-01', endsOn: '2027-03-07' }).set(bearer(billing));
    expect(q.body.lines).toEqual([expect.objectContaining({ description: kit.name, quantity: 1, amountMinor: 400_000 })]);
  });
});

describe("who sees customers, prices and a rental's papers", () => {
  it('customers are read by the billing desk, the owner and the shop manager (bookings name them); not by technicians', async () => {
    const customers = await t.api.get('/api/customers').set(bearer(billing));
    expect(customers.status).toBe(200);
    const one = customers.body.items[0].id;
    for (const token of [owner, manager]) {
      expect((await t.api.get('/api/customers').set(bearer(token))).status).toBe(200);
      expect((await t.api.get(`/api/customers/${one}`).set(bearer(token))).status).toBe(200);
    }
    expect((await t.api.get('/api/customers').set(bearer(tech))).status).toBe(403);
    expect((await t.api.get(`/api/customers/${one}`).set(bearer(tech))).status).toBe(403);
    expect((await t.api.put(`/api/customers/${one}`).set(bearer(manager)).send({ company: 'Renamed Ltd', billingEmail: 'r@r.test' })).status).toBe(403);
  });

  it("rate cards and quotes are the billing desk's and the owner's", async () => {
    const smr = (await t.api.get('/api/assets?type=smr&limit=1').set(bearer(billing))).body.items[0];
    const quote = { assetIds: smr.id, startsOn: '2027-05-03', endsOn: '2027-05-04' };
    for (const token of [billing, owner]) {
      expect((await t.api.get('/api/rate-cards').set(bearer(token))).status).toBe(200);
      expect((await t.api.get('/api/quotes').query(quote).set(bearer(token))).status).toBe(200);
    }
    for (const token of [manager, tech]) {
      expect((await t.api.get('/api/rate-cards').set(bearer(token))).status).toBe(403);
      expect((await t.api.get('/api/quotes').query(quote).set(bearer(token))).status).toBe(403);
    }
  });

  it('the agreement and certificate pack need what the rental needs', async () => {
    const [rental] = (await t.api.get('/api/rentals').query({ view: 'to_settle' }).set(bearer(billing))).body.items;
    for (const paper of ['agreement.pdf', 'certificate-pack.pdf']) {
      expect((await t.api.get(`/api/rentals/${rental.id}/${paper}`).set(bearer(billing))).status).toBe(200);
      expect((await t.api.get(`/api/rentals/${rental.id}/${paper}`).set(bearer(owner))).status).toBe(200);
      expect((await t.api.get(`/api/rentals/${rental.id}/${paper}`).set(bearer(manager))).status).toBe(403);
      expect((await t.api.get(`/api/rentals/${rental.id}/${paper}`).set(bearer(tech))).status).toBe(403);
      expect((await t.api.get(`/api/rentals/${rental.id}/${paper}`).set(bearer(otherOwner))).status).toBe(404);
    }
  });
});

describe('billing views of the demo firm', () => {
  it('lists rentals to settle: the one back with a dented SMR, its hold still on the card', async () => {
    const toSettle = await t.api.get('/api/rentals').query({ view: 'to_settle' }).set(bearer(billing));
    expect(toSettle.status).toBe(200);
    expect(toSettle.body.items).toEqual([
      expect.objectContaining({ state: 'returned', depositState: 'authorized', customerCompany: 'Quarrington Rail Fabrication' }),
    ]);
    const open = (await t.api.get('/api/rentals').query({ view: 'open' }).set(bearer(billing))).body.items;
    expect(open.map((r: { state: string }) => r.state).sort()).toEqual(['out', 'returned']);
    expect((await t.api.get('/api/rentals').set(bearer(tech))).status).toBe(403);
  });

  it('revenue per kit and month is the invoices net of credit notes; utilisation counts booked days', async () => {
    const invoices = (await t.api.get('/api/invoices').query({ limit: 500 }).set(bearer(billing))).body.items as { kind: string; subtotalMinor: number }[];
    const net = invoices.reduce((s, i) => s + (i.kind === 'invoice' ? i.subtotalMinor : -i.subtotalMinor), 0);
    const revenue = (await t.api.get('/api/billing/revenue').query({ from: '2000-01', to: '2100-12' }).set(bearer(billing))).body.items as {
      kitName: string;
      month: string;
      revenueMinor: number;
    }[];
    expect(revenue.reduce((s, r) => s + r.revenueMinor, 0)).toBe(net);
    expect(new Set(revenue.map((r) => r.kitName))).toEqual(new Set(['Kit Birch', 'Kit Cedar', 'Loose items']));
    // Kit Birch is out on a job from 5 days ago to 3 days ahead (9 days, dates inclusive) and on nothing else
    // in the 20 days from 10 days ago to 9 days ahead: 9 / 20 (worked by hand).
    const today = todayIn('Europe/Berlin');
    const use = (
      await t.api
        .get('/api/billing/utilisation')
        .query({ from: addDays(today, -10), to: addDays(today, 9) })
        .set(bearer(billing))
    ).body.items;
    expect(use.find((u: { kitName: string }) => u.kitName === 'Kit Birch')).toMatchObject({ bookedDays: 9, availableDays: 20, ratio: 0.45 });
    expect((await t.api.get('/api/billing/revenue').query({ from: '2026-05', to: '2026-01' }).set(bearer(billing))).status).toBe(400);
  });
});
