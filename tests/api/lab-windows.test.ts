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
});
