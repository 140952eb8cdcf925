import { addDays } from '../../shared/calibration/due-date';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/* The lab window finder: windows before the due date first, a plain word when there is none, no second trip for an item already planned. */

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
/** A tracker due `dueIn` days from today (12-month interval). */
async function trackerDueIn(dueIn: number) {
  serial += 1;
  const res = await t.api
    .post('/api/assets')
    .set(bearer(manager))
    .send({
      type: 'tracker',
      assetTag: `TRK-L${serial}`,
      serialNumber: `TL${serial}`,
      calibration: { required: true, intervalMonths: 12, lastCalibratedOn: addDays(addDays(today, dueIn), -365) },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; assetTag: string; calibration: { dueOn: string } };
}
const windowsOf = async (id: string) => (await t.api.get(`/api/assets/${id}/lab-windows`).set(bearer(owner))).body;

describe('the lab window finder', () => {
  it('marks windows that start on or before the due date and puts them first', async () => {
    const a = await trackerDueIn(20);
    const w = await windowsOf(a.id);
    expect(w.noneBeforeDue).toBe(false);
    expect(w.gaps[0]).toMatchObject({ startsOn: today, beforeDue: true });
    for (const [i, gap] of w.gaps.entries()) if (!gap.beforeDue) expect(w.gaps.slice(i).every((g: { beforeDue: boolean }) => !g.beforeDue)).toBe(true);
  });

  it('says when no window starts before the due date', async () => {
    const a = await trackerDueIn(5);
    // Booked from today until after its due date (booked as the firm's own use before the due date moved up).
    await t.db.query(`UPDATE assets SET due_on = $2 WHERE id = $1`, [a.id, addDays(today, 60)]);
    expect(
      (
        await t.api
          .post('/api/bookings')
          .set(bearer(manager))
          .send({ assetIds: [a.id], startsOn: today, endsOn: addDays(today, 9) })
      ).status,
    ).toBe(201);
    await t.db.query(`UPDATE assets SET due_on = $2 WHERE id = $1`, [a.id, addDays(today, 5)]);
    const w = await windowsOf(a.id);
    expect(w.noneBeforeDue).toBe(true);
    expect(w.gaps[0].startsOn).toBe(addDays(today, 10));
    expect(w.gaps.every((g: { beforeDue: boolean }) => !g.beforeDue)).toBe(true);
  });

  it('shows the trip already planned and refuses a second one for the same item', async () => {
    const a = await trackerDueIn(25);
    const b = await trackerDueIn(25);
    expect((await windowsOf(a.id)).plannedTrip).toBeNull();
    // Dates of the owner's own choosing.
    const trip = await t.api
      .post('/api/lab-trips')
      .set(bearer(owner))
      .send({ provider: 'Fenmoor Calibration Lab', assetIds: [a.id], sentOn: addDays(today, 4), expectedBackOn: addDays(today, 11) });
    expect(trip.status, JSON.stringify(trip.body)).toBe(201);
    expect(trip.body).toMatchObject({ sentOn: addDays(today, 4), expectedBackOn: addDays(today, 11) });
    expect((await windowsOf(a.id)).plannedTrip).toMatchObject({ id: trip.body.id, state: 'planned', sentOn: addDays(today, 4) });
    const again = await t.api
      .post('/api/lab-trips')
      .set(bearer(owner))
      .send({ provider: 'Fenmoor Calibration Lab', assetIds: [b.id, a.id], sentOn: addDays(today, 14) });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain(a.assetTag);
    expect((await windowsOf(b.id)).plannedTrip).toBeNull();
  });

  it('finds one window free for every item of a trip and plans one lab booking holding them all', async () => {
    const a = await trackerDueIn(30);
    const b = await trackerDueIn(12);
    const c = await trackerDueIn(40);
    // b is out on a job from today for ten days, c on another from day 12 to day 14: a alone could go today.
    const job = (from: number, to: number, id: string) =>
      t.api
        .post('/api/bookings')
        .set(bearer(manager))
        .send({ assetIds: [id], startsOn: addDays(today, from), endsOn: addDays(today, to) });
    expect((await job(0, 9, b.id)).status).toBe(201);
    expect((await job(12, 14, c.id)).status).toBe(201);
    expect((await windowsOf(a.id)).gaps[0].startsOn).toBe(today);
    const ids = [a.id, b.id, c.id];
    const res = await t.api.get(`/api/lab-windows?assetIds=${ids.join(',')}`).set(bearer(owner));
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const w = res.body;
    expect(w.assets.map((x: { assetTag: string }) => x.assetTag).sort()).toEqual([a.assetTag, b.assetTag, c.assetTag].sort());
    // The earliest due date of the three is b's; sending all today breaks both jobs (14 days of turnaround).
    expect(w.dueOn).toBe(b.calibration.dueOn);
    expect(w.threatenedIfSentNow).toHaveLength(2);
    // The two days between b's job and c's are shorter than a lab's turnaround: the first window opens after c's job.
    expect(w.turnaroundDays).toBeGreaterThan(2);
    expect(w.gaps[0]).toMatchObject({ startsOn: addDays(today, 15), endsOn: null, beforeDue: false });
    expect(w.noneBeforeDue).toBe(true);
    expect(w.plannedTrips).toEqual([]);

    const trip = await t.api.post('/api/lab-trips').set(bearer(owner)).send({ provider: 'Fenmoor Calibration Lab', assetIds: ids, sentOn: w.gaps[0].startsOn });
    expect(trip.status, JSON.stringify(trip.body)).toBe(201);
    const held = await t.db.query(`SELECT asset_id FROM booking_items WHERE booking_id = $1`, [trip.body.bookingId]);
    expect(held.map((r: { asset_id: string }) => r.asset_id).sort()).toEqual([...ids].sort());
    const after = (await t.api.get(`/api/lab-windows?assetIds=${ids.join(',')}`).set(bearer(owner))).body;
    expect(after.plannedTrips.map((p: { id: string }) => p.id)).toEqual([trip.body.id, trip.body.id, trip.body.id]);
  });

  it('refuses a window query without items, or with a malformed or unknown one', async () => {
    expect((await t.api.get('/api/lab-windows?assetIds=').set(bearer(owner))).status).toBe(400);
    expect((await t.api.get('/api/lab-windows?assetIds=not-an-id').set(bearer(owner))).status).toBe(400);
    expect((await t.api.get(`/api/lab-windows?assetIds=${crypto.randomUUID()}`).set(bearer(owner))).status).toBe(404);
  });
});
