import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let manager: string;
const today = todayIn('Europe/Berlin');

beforeAll(async () => {
  t = await createTestApp();
  manager = await t.tokenFor('manager@demo.test');
});
afterAll(() => t.close());

let serial = 0;
/** A tracker calibrated well within its interval, so only the board decides. */
async function tracker() {
  serial += 1;
  const res = await t.api
    .post('/api/assets')
    .set(bearer(manager))
    .send({
      type: 'tracker',
      assetTag: `TRK-R${serial}`,
      serialNumber: `TR${serial}`,
      calibration: { required: true, intervalMonths: 12, lastCalibratedOn: addDays(today, -10) },
    });
  return res.body as { id: string; assetTag: string };
}

describe('lab trips share the booking path', () => {
  it.each([1, 2, 3, 4, 5])('a lab trip racing bookings for the same item: one wins, the others get 409 naming it, never 500 (round %i)', async () => {
    const a = await tracker();
    const sentOn = addDays(today, 20);
    const trip = () =>
      t.api
        .post('/api/lab-trips')
        .set(bearer(manager))
        .send({ provider: 'Fenmoor Calibration Lab', assetIds: [a.id], sentOn });
    const booking = () =>
      t.api
        .post('/api/bookings')
        .set(bearer(manager))
        .send({ assetIds: [a.id], startsOn: addDays(sentOn, 5), endsOn: addDays(sentOn, 7) });
    const replies = await Promise.all([trip(), booking(), trip(), booking(), trip(), booking()]);
    expect(replies.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409, 409]);
    const winner = replies.find((r) => r.status === 201)!;
    const winningBooking = winner.body.bookingId ?? winner.body.id;
    const winningTrip = winner.body.bookingId ? winner.body.id : undefined;
    for (const lost of replies.filter((r) => r.status === 409)) {
      expect(lost.body.error.code).toBe('conflict');
      // A trip that comes after a trip won is told of that trip; anything else, of the booking that holds the days.
      if (lost.body.error.details.trips) {
        expect(lost.body.error.details.trips).toEqual([expect.objectContaining({ id: winningTrip, assetId: a.id, assetTag: a.assetTag })]);
      } else {
        expect(lost.body.error.details.conflicts).toEqual([expect.objectContaining({ assetId: a.id, assetTag: a.assetTag, bookingId: winningBooking })]);
      }
    }
    const [{ n }] = await t.db.query(`SELECT count(*)::int AS n FROM booking_items WHERE asset_id = $1 AND active`, [a.id]);
    expect(n).toBe(1);
  });

  it('a lab trip over a booked window is refused like any booking, with the conflicting booking named', async () => {
    const a = await tracker();
    const held = (
      await t.api
        .post('/api/bookings')
        .set(bearer(manager))
        .send({ assetIds: [a.id], startsOn: addDays(today, 30), endsOn: addDays(today, 32) })
    ).body;
    const res = await t.api
      .post('/api/lab-trips')
      .set(bearer(manager))
      .send({ provider: 'Fenmoor Calibration Lab', assetIds: [a.id], sentOn: addDays(today, 25) });
    expect(res.status).toBe(409);
    expect(res.body.error.details.conflicts).toEqual([
      { assetId: a.id, assetTag: a.assetTag, bookingId: held.id, startsOn: addDays(today, 30), endsOn: addDays(today, 32) },
    ]);
    expect(
      (await t.api.get('/api/lab-trips?state=planned').set(bearer(manager))).body.items.flatMap((x: { items: { assetId: string }[] }) =>
        x.items.map((i) => i.assetId),
      ),
    ).not.toContain(a.id);
  });
});
