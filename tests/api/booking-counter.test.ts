import { addDays, todayIn } from '../../shared/calibration/due-date';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/* The counter and the calendar told truly: past days, reservations not collected, the checkout window, changing a reservation's items. */

let t: TestApp;
let owner: string;
let manager: string;
let today: string;
beforeAll(async () => {
  t = await createTestApp();
  [owner, manager] = await Promise.all(['owner@demo.test', 'manager@demo.test'].map((e) => t.tokenFor(e)));
  today = (await t.api.get('/api/bookings/today').set(bearer(manager))).body.today;
});
afterAll(() => t.close());

let serial = 0;
/** A fresh tracker, calibrated on `last` with a 12-month interval. */
async function tracker(last = addDays(todayIn('UTC'), -30)) {
  serial += 1;
  const res = await t.api
    .post('/api/assets')
    .set(bearer(manager))
    .send({
      type: 'tracker',
      assetTag: `TRK-C${serial}`,
      serialNumber: `TC${serial}`,
      calibration: { required: true, intervalMonths: 12, lastCalibratedOn: last },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; assetTag: string };
}
const book = (token: string, body: object) => t.api.post('/api/bookings').set(bearer(token)).send(body);
const checklist = (...assets: { id: string }[]) => assets.map((a) => ({ assetId: a.id, present: true, condition: 'good' }));
const checkout = (id: string, body: object) =>
  t.api
    .post(`/api/bookings/${id}/checkout`)
    .set(bearer(manager))
    .send({ counterpart: 'Odile Brackwater', ...body });
/** Time passes: the booking's days move `days` back, as if it had been made that long ago. */
const daysPass = async (bookingId: string, days: number) => {
  for (const table of ['bookings', 'booking_items'])
    await t.db.query(
      `UPDATE ${table} SET starts_on = starts_on - $2::int, ends_on = ends_on - $2::int WHERE ${table === 'bookings' ? 'id' : 'booking_id'} = $1`,
      [bookingId, days],
    );
};

describe('days in the past', () => {
  it('refuses a booking whose days are all before today, and accepts one that runs into today', async () => {
    const a = await tracker();
    const past = await book(manager, { assetIds: [a.id], startsOn: addDays(today, -5), endsOn: addDays(today, -1) });
    expect(past.status).toBe(422);
    expect(past.body.error.code).toBe('dates_past');
    // Today in the demo firm's words (en-GB: day, month, year), not ISO.
    const [year, , day] = today.split('-');
    expect(past.body.error.message.replace(/\s+/g, ' ')).toMatch(new RegExp(`before today \\(${Number(day)} [A-Z][a-z]{2,3} ${year}\\)`));
    expect((await book(manager, { assetIds: [a.id], startsOn: addDays(today, -1), endsOn: today })).status).toBe(201);
  });

  it('lets the owner record past use as history: marked, returned, holding no days; others may not', async () => {
    const a = await tracker(addDays(todayIn('UTC'), -200));
    const days = { assetIds: [a.id], startsOn: addDays(today, -60), endsOn: addDays(today, -55), history: true };
    expect((await book(manager, days)).status).toBe(403);
    const recorded = await book(owner, days);
    expect(recorded.status, JSON.stringify(recorded.body)).toBe(201);
    expect(recorded.body).toMatchObject({ state: 'returned', history: true, startsOn: days.startsOn });
    const [{ active }] = await t.db.query(`SELECT bool_or(active) AS active FROM booking_items WHERE booking_id = $1`, [recorded.body.id]);
    expect(active).toBe(false);
    const notPast = await book(owner, { ...days, endsOn: today });
    expect(notPast.status).toBe(422);
    expect(notPast.body.error.code).toBe('history_not_past');
  });
});

describe('reservations not collected', () => {
  it('leave the checkouts for their own list, stop holding their items, and go out late only with a note and a new last day', async () => {
    const a = await tracker();
    const b = await tracker();
    const lapsed = (await book(manager, { assetIds: [a.id], startsOn: today, endsOn: addDays(today, 2) })).body;
    const other = (await book(manager, { assetIds: [b.id], startsOn: today, endsOn: today })).body;
    await daysPass(lapsed.id, 40);
    await daysPass(other.id, 10);

    const desk = (await t.api.get('/api/bookings/today').set(bearer(manager))).body;
    const ids = (list: { id: string }[]) => list.map((x) => x.id);
    expect(ids(desk.notCollected)).toEqual(expect.arrayContaining([lapsed.id, other.id]));
    expect(ids(desk.checkouts)).not.toContain(lapsed.id);
    const seen = (await t.api.get(`/api/bookings/${lapsed.id}`).set(bearer(manager))).body;
    expect(seen.state).toBe('not_collected');
    const [{ active }] = await t.db.query(`SELECT bool_or(active) AS active FROM booking_items WHERE booking_id = $1`, [lapsed.id]);
    expect(active).toBe(false);

    const noNote = await checkout(lapsed.id, { checklist: checklist(a) });
    expect(noNote.status).toBe(422);
    expect(noNote.body.error.code).toBe('checkout_late');
    const late = await checkout(lapsed.id, { checklist: checklist(a), late: { note: 'Customer postponed; collected now', endsOn: addDays(today, 3) } });
    expect(late.status, JSON.stringify(late.body)).toBe(200);
    expect(late.body).toMatchObject({ state: 'out', startsOn: today, endsOn: addDays(today, 3), checkoutNote: 'Customer postponed; collected now' });
    // Out again, its new days are held: another booking of the tracker for them is a conflict.
    expect((await book(manager, { assetIds: [a.id], startsOn: addDays(today, 1), endsOn: addDays(today, 1) })).status).toBe(409);

    const cancelled = await t.api.post(`/api/bookings/${other.id}/cancel`).set(bearer(manager));
    expect(cancelled.body.state).toBe('cancelled');
    const after = (await t.api.get('/api/bookings/today').set(bearer(manager))).body;
    expect(ids(after.notCollected)).not.toContain(other.id);
  });

  it('are marked by the daily late-returns routine too', async () => {
    const a = await tracker();
    const lapsed = (await book(manager, { assetIds: [a.id], startsOn: today, endsOn: today })).body;
    await daysPass(lapsed.id, 3);
    const run = await t.api.post('/api/admin/routines/late-returns/run').set(bearer(owner));
    expect(run.status, JSON.stringify(run.body)).toBe(200);
    expect(JSON.stringify(run.body)).toContain('notCollected');
    expect((await t.api.get(`/api/bookings/${lapsed.id}`).set(bearer(manager))).body.state).toBe('not_collected');
  });
});

describe('the checkout window', () => {
  it('opens one day before the start; earlier needs a reason, recorded, and the booking then starts today', async () => {
    const a = await tracker();
    const tomorrow = (await book(manager, { assetIds: [a.id], startsOn: addDays(today, 1), endsOn: addDays(today, 3) })).body;
    expect((await checkout(tomorrow.id, { checklist: checklist(a) })).status).toBe(200);

    const b = await tracker();
    const later = (await book(manager, { assetIds: [b.id], startsOn: addDays(today, 5), endsOn: addDays(today, 8) })).body;
    const early = await checkout(later.id, { checklist: checklist(b) });
    expect(early.status).toBe(422);
    expect(early.body.error).toMatchObject({ code: 'checkout_early', details: { opensOn: addDays(today, 4) } });
    const confirmed = await checkout(later.id, { checklist: checklist(b), earlyReason: 'Crew drives out two days early for set-up' });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(200);
    expect(confirmed.body).toMatchObject({
      state: 'out',
      startsOn: today,
      endsOn: addDays(today, 8),
      checkoutNote: 'Crew drives out two days early for set-up',
    });
    const [audit] = await t.db.query(`SELECT details FROM audit_events WHERE subject_id = $1 AND action = 'booking.checked_out'`, [later.id]);
    expect(audit.details.early).toBe('Crew drives out two days early for set-up');

    // A minute later it comes back: nothing special, the kit is ready and the booking returned.
    const back = await t.api
      .post(`/api/bookings/${later.id}/return`)
      .set(bearer(manager))
      .send({ checklist: checklist(b), counterpart: 'Odile Brackwater' });
    expect(back.status).toBe(200);
    expect(back.body.state).toBe('returned');
    expect((await t.api.get(`/api/assets/${b.id}`).set(bearer(manager))).body.status).toBe('ready');
  });

  it('is a setting the owner can widen', async () => {
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ checkoutOpensDaysBefore: 7 })).status).toBe(200);
    expect((await t.api.get('/api/settings').set(bearer(owner))).body.checkoutOpensDaysBefore).toBe(7);
    const a = await tracker();
    const later = (await book(manager, { assetIds: [a.id], startsOn: addDays(today, 6), endsOn: addDays(today, 8) })).body;
    expect((await checkout(later.id, { checklist: checklist(a) })).status).toBe(200);
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ checkoutOpensDaysBefore: 1 })).status).toBe(200);
  });
});

describe("changing a reservation's items", () => {
  it('adds, removes and swaps under the same refusals, alternatives and overlap rule', async () => {
    const [a, b, c, held, taken] = [await tracker(), await tracker(), await tracker(), await tracker(), await tracker()];
    const days = { startsOn: addDays(today, 20), endsOn: addDays(today, 22) };
    const booking = (await book(manager, { assetIds: [a.id, b.id], ...days })).body;
    const change = (body: object) => t.api.post(`/api/bookings/${booking.id}/items`).set(bearer(manager)).send(body);

    const swapped = await change({ add: [c.id], remove: [b.id] });
    expect(swapped.status, JSON.stringify(swapped.body)).toBe(200);
    expect([...swapped.body.assetIds].sort()).toEqual([a.id, c.id].sort());
    // B's days are free again.
    expect((await book(manager, { assetIds: [b.id], ...days })).status).toBe(201);

    await t.api.post(`/api/assets/${held.id}/hold`).set(bearer(manager)).send({ summary: 'Beam wanders' });
    const refused = await change({ add: [held.id] });
    expect(refused.status).toBe(422);
    expect(refused.body.error.details.blocked).toEqual([{ assetId: held.id, assetTag: held.assetTag, reason: 'held' }]);
    expect(refused.body.error.details.alternatives[held.id].length).toBeGreaterThan(0);

    await book(manager, { assetIds: [taken.id], ...days });
    const clash = await change({ add: [taken.id] });
    expect(clash.status).toBe(409);
    expect(clash.body.error.details.conflicts[0].assetId).toBe(taken.id);

    expect((await change({ remove: [a.id, c.id] })).body.error.code).toBe('booking_empty');
    expect((await change({ add: [] })).status).toBe(400);
    const items = (await t.api.get(`/api/bookings/${booking.id}`).set(bearer(manager))).body.assetIds;
    expect([...items].sort()).toEqual([a.id, c.id].sort());
  });
});

describe('lab trips at the counter', () => {
  it('a planned trip for three items whose calibration runs out is not a blocked booking', async () => {
    // Due in about a week: calibrated a year ago less a week (12-month interval).
    const soon = addDays(addDays(today, 7), -365);
    const items = [await tracker(soon), await tracker(soon), await tracker(soon)];
    const trip = await t.api
      .post('/api/lab-trips')
      .set(bearer(manager))
      .send({ provider: 'Harrowgate Lab', assetIds: items.map((i) => i.id), sentOn: addDays(today, 2), expectedBackOn: addDays(today, 20) });
    expect(trip.status, JSON.stringify(trip.body)).toBe(201);
    const desk = (await t.api.get('/api/bookings/today').set(bearer(manager))).body;
    expect(desk.blocked.map((b: { id: string }) => b.id)).not.toContain(trip.body.bookingId);
    // The same items on an ordinary booking over those days would be blocked.
    const job = await book(manager, { assetIds: [items[0].id], startsOn: addDays(today, 21), endsOn: addDays(today, 22) });
    expect(job.body.error.code).toBe('booking_blocked');
  });
});

describe("the firm's people for Lead technician and Taken by", () => {
  it('lists active people by role and name to anyone who books, without their e-mail', async () => {
    const res = await t.api.get('/api/users/staff').query({ role: 'technician' }).set(bearer(manager));
    expect(res.status).toBe(200);
    const [{ name }] = await t.db.query(`SELECT name FROM users WHERE email = 'tech@demo.test'`);
    expect(res.body.items.map((p: { name: string }) => p.name)).toContain(name);
    expect(res.body.items.every((p: { role: string; email?: string }) => p.role === 'technician' && p.email === undefined)).toBe(true);
    expect((await t.api.get('/api/users/staff').query({ role: 'wizard' }).set(bearer(manager))).status).toBe(400);
  });
});

describe('incidents opened at return', () => {
  it("take the job's site as their place and link to the booking", async () => {
    const a = await tracker();
    const job = (
      await t.api.post('/api/jobs').set(bearer(manager)).send({
        reference: 'J-SITE-1',
        customerName: 'Thornwick Castings',
        siteAddress: 'Hall 3, Thornwick Castings, Mirebrook',
        startsOn: today,
        endsOn: today,
      })
    ).body;
    const booking = (await book(manager, { assetIds: [a.id], jobId: job.id, startsOn: today, endsOn: today })).body;
    expect((await checkout(booking.id, { checklist: checklist(a) })).status).toBe(200);
    const back = await t.api
      .post(`/api/bookings/${booking.id}/return`)
      .set(bearer(manager))
      .send({ counterpart: 'Odile Brackwater', checklist: [{ assetId: a.id, present: true, condition: 'damaged', note: 'Cracked window' }] });
    expect(back.status).toBe(200);
    const incident = (await t.api.get(`/api/incidents/${back.body.incidents[0].incidentId}`).set(bearer(manager))).body;
    expect(incident).toMatchObject({ bookingId: booking.id, location: 'Hall 3, Thornwick Castings, Mirebrook', description: 'Cracked window' });
  });

  it('take the photos of damage taken at return, and name the booking and the customer', async () => {
    const [dented, lost, fine] = [await tracker(), await tracker(), await tracker()];
    const job = (
      await t.api.post('/api/jobs').set(bearer(manager)).send({ reference: 'J-PHOTO-1', customerName: 'Ashgrove Turbines', startsOn: today, endsOn: today })
    ).body;
    const booking = (await book(manager, { assetIds: [dented.id, lost.id, fine.id], jobId: job.id, startsOn: today, endsOn: today })).body;
    expect((await checkout(booking.id, { checklist: checklist(dented, lost, fine) })).status).toBe(200);
    const lines = [
      { assetId: dented.id, present: true, condition: 'damaged', note: 'Dent in the case lid' },
      { assetId: lost.id, present: false, condition: 'good' },
      { assetId: fine.id, present: true, condition: 'good' },
    ];
    const returning = (photoAssetIds: string[]) =>
      t.api
        .post(`/api/bookings/${booking.id}/return`)
        .set(bearer(manager))
        .field('counterpart', 'Odile Brackwater')
        .field('checklist', JSON.stringify(lines))
        .field('photoAssetIds', photoAssetIds.join(','));
    // A photo of an item marked good, or photos without their items, lose nothing: 400 and the booking stays out.
    const stray = await returning([fine.id]).attach('photos', await jpeg(), { filename: 'fine.jpg', contentType: 'image/jpeg' });
    expect(stray.status, JSON.stringify(stray.body)).toBe(400);
    expect(stray.body.error.details.fields.photoAssetIds).toBeDefined();
    const unnamed = await returning([]).attach('photos', await jpeg(), { filename: 'lid.jpg', contentType: 'image/jpeg' });
    expect(unnamed.status).toBe(400);
    expect((await t.db.query(`SELECT state FROM bookings WHERE id = $1`, [booking.id]))[0].state).toBe('out');

    const back = await returning([dented.id, dented.id])
      .attach('photos', await jpeg(), { filename: 'lid.jpg', contentType: 'image/jpeg' })
      .attach('photos', await jpeg('#5f6f88'), { filename: 'hinge.jpg', contentType: 'image/jpeg' });
    expect(back.status, JSON.stringify(back.body)).toBe(200);
    expect(back.body.incidents).toHaveLength(2);
    const incidentOf = async (assetId: string) =>
      (await t.api.get(`/api/incidents/${back.body.incidents.find((i: { assetId: string }) => i.assetId === assetId).incidentId}`).set(bearer(manager))).body;
    const damage = await incidentOf(dented.id);
    expect(damage).toMatchObject({ bookingId: booking.id, customerName: 'Ashgrove Turbines', kind: 'impact', description: 'Dent in the case lid' });
    expect(damage.photos.map((p: { fileName: string }) => p.fileName)).toEqual(['lid.jpg', 'hinge.jpg']);
    const photo = await t.api.get(damage.photos[1].url).set(bearer(manager));
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expect((await t.api.get(damage.photos[0].thumbnailUrl).set(bearer(manager))).status).toBe(200);
    const missing = await incidentOf(lost.id);
    expect(missing).toMatchObject({ bookingId: booking.id, customerName: 'Ashgrove Turbines', kind: 'missing', photos: [] });
  });
});

/** A plain JPEG made by sharp (the photos' decoder is also sharp, but only the stored bytes and names are compared). */
function jpeg(background = '#88775f') {
  return sharp({ create: { width: 320, height: 240, channels: 3, background } })
    .jpeg()
    .toBuffer();
}
