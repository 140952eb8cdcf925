import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/** Bad input gets a 400 naming the field, and nothing is stored (API.md "Conventions"). */
let t: TestApp;
let owner: string;
let assetId: string;
let customerId: string;
beforeAll(async () => {
  t = await createTestApp();
  owner = await t.tokenFor('owner@demo.test');
  assetId = (await t.api.get('/api/assets?type=accessory&limit=1').set(bearer(owner))).body.items[0].id;
  customerId = (await t.api.get('/api/customers').set(bearer(owner))).body.items[0].id;
});
afterAll(() => t.close());

const fieldsOf = (res: { status: number; body: { error?: { code: string; details?: { fields?: Record<string, string> } } } }) => {
  expect(res.status).toBe(400);
  expect(res.body.error?.code).toBe('invalid_input');
  return res.body.error?.details?.fields ?? {};
};

describe('calendar dates that do not exist', () => {
  // 30 February, month 13, year 0 and 29 February of a common year: each refused before PostgreSQL sees it.
  const impossible = ['2026-02-30', '2026-13-01', '0000-01-01', '2026-02-29'];

  it.each(impossible)('%s is a 400 naming the field on every route that takes a date', async (day) => {
    const cases = [
      [
        'startsOn',
        await t.api
          .post('/api/bookings')
          .set(bearer(owner))
          .send({ assetIds: [assetId], startsOn: day, endsOn: '2031-01-10' }),
      ],
      [
        'startsOn',
        await t.api
          .post('/api/rentals')
          .set(bearer(owner))
          .send({ customerId, assetIds: [assetId], startsOn: day, endsOn: '2031-01-10' }),
      ],
      ['startsOn', await t.api.get(`/api/quotes?assetIds=${assetId}&startsOn=${day}&endsOn=2031-01-10`).set(bearer(owner))],
      ['from', await t.api.get(`/api/billing/utilisation?from=${day}&to=2031-01-10`).set(bearer(owner))],
      ['startsOn', await t.api.get(`/api/availability?startsOn=${day}&endsOn=2031-01-10`).set(bearer(owner))],
      ['to', await t.api.get(`/api/bookings?to=${day}`).set(bearer(owner))],
      [
        'sentOn',
        await t.api
          .post('/api/lab-trips')
          .set(bearer(owner))
          .send({ provider: 'Gauge House', assetIds: [assetId], sentOn: day }),
      ],
      [
        'calibration.lastCalibratedOn',
        await t.api
          .post('/api/assets')
          .set(bearer(owner))
          .send({ type: 'accessory', assetTag: 'DATE-1', serialNumber: 'D1', calibration: { required: true, intervalMonths: 12, lastCalibratedOn: day } }),
      ],
      [
        'startsOn',
        await t.api.post('/api/jobs').set(bearer(owner)).send({ reference: 'J-DATE', customerName: 'Someone', startsOn: day, endsOn: '2031-01-10' }),
      ],
      [
        'performedOn',
        await t.api
          .post(`/api/assets/${assetId}/calibrations`)
          .set(bearer(owner))
          .field('performedOn', day)
          .field('provider', 'Lab')
          .field('certificateNumber', 'C-1')
          .field('asFound', 'in_tolerance')
          .field('asLeft', 'in_tolerance'),
      ],
    ] as const;
    for (const [i, [field, res]] of cases.entries()) expect(fieldsOf(res)[field], `case ${i}: ${field}`).toMatch(/is not a date|between 1900 and 2199/);
  });

  it('a CSV row with such a date is an error on that row and column', async () => {
    const res = await t.api
      .post('/api/assets/import?mode=preview')
      .set(bearer(owner))
      .set('Content-Type', 'text/csv')
      .send('type,assetTag,serialNumber,calibrationRequired,calibrationIntervalMonths,lastCalibratedOn\r\naccessory,CSV-D1,S1,yes,12,2026-02-30\r\n');
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([{ row: 1, column: 'lastCalibratedOn', message: 'is not a date: that month has 28 days' }]);
  });

  it('real edge dates pass: 29 February of a leap year, 31 December', async () => {
    const res = await t.api.get(`/api/quotes?assetIds=${assetId}&startsOn=2028-02-29&endsOn=2028-12-31`).set(bearer(owner));
    expect(res.status).toBe(200);
  });
});

describe('text PostgreSQL cannot store: NUL and lone UTF-16 surrogates', () => {
  const bad = { NUL: 'Kit\u0000 A', 'a lone high surrogate': 'Kit \ud83d A', 'a lone low surrogate': '\ude00 Kit A' };

  it.each(Object.entries(bad))('%s is a 400 naming the field, and nothing is stored', async (_what, value) => {
    const kitsBefore = (await t.api.get('/api/kits').set(bearer(owner))).body.total;
    expect(fieldsOf(await t.api.post('/api/kits').set(bearer(owner)).send({ name: value }))).toEqual({ name: expect.stringMatching(/not text/) });
    expect(fieldsOf(await t.api.post('/api/customers').set(bearer(owner)).send({ company: value, billingEmail: 'ap@example.test' }))).toHaveProperty('company');
    expect(fieldsOf(await t.api.patch(`/api/assets/${assetId}`).set(bearer(owner)).send({ notes: value }))).toHaveProperty('notes');
    expect((await t.api.get('/api/kits').set(bearer(owner))).body.total).toBe(kitsBefore);
  });

  it('a well-formed surrogate pair (an emoji) is text and is kept', async () => {
    const res = await t.api.post('/api/kits').set(bearer(owner)).send({ name: 'Kit \ud83d\udce6 B' });
    expect(res.status).toBe(201);
    expect(res.body.name).toBe('Kit 📦 B');
  });

  it('a NUL in a multipart field (incident description) is a 400 naming it', async () => {
    const res = await t.api
      .post('/api/incidents')
      .set(bearer(owner))
      .field('assetId', assetId)
      .field('kind', 'impact')
      .field('description', 'Dropped\u0000 hard')
      .field('occurredAt', '2026-11-30T10:00:00Z');
    expect(fieldsOf(res)).toHaveProperty('description');
  });

  it('a NUL in a CSV cell, the kit cell included, is an error on that row and column', async () => {
    const csv = 'type,assetTag,serialNumber,notes,kit\r\naccessory,CSV-N1,S1,bad\u0000note,\r\naccessory,CSV-N2,S2,,Kit\u0000 Z\r\n';
    const res = await t.api.post('/api/assets/import?mode=commit').set(bearer(owner)).set('Content-Type', 'text/csv').send(csv);
    expect(res.status).toBe(422);
    expect(res.body.error.details.errors).toEqual([
      { row: 1, column: 'notes', message: expect.stringMatching(/not text/) },
      { row: 2, column: 'kit', message: expect.stringMatching(/not text/) },
    ]);
  });

  it('endpoint() refuses it even where a schema forgot (belt and braces): a user name', async () => {
    const spare = await t.api
      .post('/api/users')
      .set(bearer(owner))
      .send({ email: 'nul-check@demo.test', name: 'Spare', role: 'technician', password: 'a-long-enough-passphrase-7' });
    expect(fieldsOf(await t.api.patch(`/api/users/${spare.body.id}`).set(bearer(owner)).send({ name: 'Sp\u0000re' }))).toEqual({
      name: expect.stringMatching(/not text/),
    });
    expect((await t.api.get(`/api/users`).set(bearer(owner))).body.items.find((u: { id: string }) => u.id === spare.body.id).name).toBe('Spare');
  });
});

describe('e-mail addresses (RFC 5321: at most 254 characters)', () => {
  const local = 'a'.repeat(64);
  const exactly254 = `${local}@${'b'.repeat(63)}.${'c'.repeat(63)}.${'d'.repeat(56)}.test`;

  it('a very long address at sign-in is a 400 for an anonymous caller, not a 500', async () => {
    const res = await t.api.post('/api/auth/login').send({ email: `${'x'.repeat(5000)}@example.test`, password: 'whatever-it-is' });
    expect(fieldsOf(res)).toEqual({ email: 'must be at most 254 characters' });
  });

  it('255 characters is refused for a new user; 254 is an address like any other', async () => {
    expect(exactly254).toHaveLength(254);
    expect(
      fieldsOf(
        await t.api
          .post('/api/users')
          .set(bearer(owner))
          .send({ email: `x${exactly254}`, name: 'Long', role: 'technician', password: 'a-long-enough-passphrase-7' }),
      ),
    ).toHaveProperty('email');
    expect((await t.api.post('/api/auth/login').send({ email: exactly254, password: 'whatever-it-is' })).status).toBe(401);
  });
});

describe("ids in a request that name no record of the caller's firm", () => {
  it('are 404 — unknown or another firm’s alike — before any rule about them is judged', async () => {
    const otherOwner = await t.tokenFor('owner@other.test');
    const theirs = await t.api.post('/api/assets').set(bearer(otherOwner)).send({ type: 'accessory', assetTag: 'THEIRS-1', serialNumber: 'T1' });
    const theirUser = (await t.api.get('/api/auth/me').set(bearer(otherOwner))).body.user.id;
    const unknown = '7d1e2f3a-4b5c-4d6e-8f90-a1b2c3d4e5f6';
    for (const id of [unknown, theirs.body.id]) {
      const answers = {
        'lab trip assetIds': await t.api
          .post('/api/lab-trips')
          .set(bearer(owner))
          .send({ provider: 'Gauge House', assetIds: [id], sentOn: '2031-01-10' }),
        'quote assetIds': await t.api.get(`/api/quotes?assetIds=${id}&startsOn=2031-01-10&endsOn=2031-01-12`).set(bearer(owner)),
        'incident assetId': await t.api
          .post('/api/incidents')
          .set(bearer(owner))
          .field('assetId', id)
          .field('kind', 'impact')
          .field('description', 'Knocked over')
          .field('occurredAt', '2026-11-30T10:00:00Z'),
        'incident bookingId': await t.api
          .post('/api/incidents')
          .set(bearer(owner))
          .field('assetId', assetId)
          .field('bookingId', id)
          .field('kind', 'impact')
          .field('description', 'Knocked over')
          .field('occurredAt', '2026-11-30T10:00:00Z'),
        'rental invoice PDF': await t.api.get(`/api/rentals/${id}/invoice.pdf`).set(bearer(owner)),
      };
      for (const [what, res] of Object.entries(answers)) expect([what, res.status, res.body.error?.code]).toEqual([what, 404, 'not_found']);
    }
    for (const lead of [unknown, theirUser]) {
      const job = await t.api
        .post('/api/jobs')
        .set(bearer(owner))
        .send({ reference: `J-LEAD-${lead.slice(0, 4)}`, customerName: 'Someone', startsOn: '2031-01-10', endsOn: '2031-01-11', leadTechnicianId: lead });
      expect(job.status).toBe(404);
    }
  });
});
