import { format, parseISO } from 'date-fns';
import { addDays } from '../../shared/calibration/due-date';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EquipmentRecordView } from '../../shared/records/views';
import { pdfText } from '../support/pdf';
import { bearer, binaryBody, createTestApp, type TestApp } from '../support/test-app';

/*
 * One firm, two voices: the demo firm (en-GB, Europe/Berlin) switches to en-US and America/Chicago, and its papers and
 * refusals change with it. Expected strings are written by hand: day-month-year for en-GB and month-day-year for en-US
 * (CLDR's medium dates, from memory); 14:30 UTC on 7 December is 15:30 in Berlin (CET, UTC+1) and 8:30 AM in Chicago
 * (CST, UTC−6: US daylight saving ends on the first Sunday of November, 15 U.S.C. §260a).
 */

let t: TestApp;
let owner: string;
let manager: string;
beforeAll(async () => {
  t = await createTestApp();
  [owner, manager] = await Promise.all(['owner@demo.test', 'manager@demo.test'].map((e) => t.tokenFor(e)));
});
afterAll(() => t.close());

const oneLine = (text: string) => text.replace(/\s+/g, ' ');
const book = (body: object) => t.api.post('/api/bookings').set(bearer(manager)).send(body);
const pdf = async (path: string) => pdfText((await t.api.get(path).set(bearer(manager)).buffer(true).parse(binaryBody)).body as Buffer);
const record = async (id: string) => (await t.api.get(`/api/assets/${id}/record`).set(bearer(manager))).body as EquipmentRecordView;

describe('changing the firm to en-US and America/Chicago', () => {
  let tracker: { id: string; assetTag: string };
  let bookingId: string;
  let recordBefore: EquipmentRecordView;

  beforeAll(async () => {
    const created = await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({
        type: 'tracker',
        assetTag: 'TRK-US1',
        serialNumber: 'US-1',
        calibration: { required: true, intervalMonths: 24, lastCalibratedOn: '2026-06-01' },
      });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    tracker = created.body;
    const booked = await book({ assetIds: [tracker.id], startsOn: '2027-12-07', endsOn: '2027-12-11' });
    expect(booked.status, JSON.stringify(booked.body)).toBe(201);
    bookingId = booked.body.id;
    // Handed over at a known moment, so the sheet's time can be checked by hand.
    await t.db.query(`UPDATE bookings SET checked_out_at = '2027-12-07T14:30:00Z' WHERE id = $1`, [bookingId]);
    recordBefore = await record(tracker.id);
  });

  it('prints the demo firm in en-GB and Berlin time first', async () => {
    const sheet = await pdf(`/api/bookings/${bookingId}/handover-sheet.pdf`);
    expect(sheet).toContain('Handed over 7 Dec 2027, 15:30 CET');
    expect(sheet).toContain('7 – 11 Dec 2027, both days included');
    const clash = await book({ assetIds: [tracker.id], startsOn: '2027-12-10', endsOn: '2027-12-12' });
    expect(clash.status).toBe(409);
    expect(oneLine(clash.body.error.message)).toBe(`Already booked: TRK-US1 (booked 7 – 11 Dec 2027).`);
  });

  it('then prints the hand-over sheet in US dates and Chicago time, naming the zone', async () => {
    const changed = await t.api.patch('/api/settings').set(bearer(owner)).send({ locale: 'en-US', timeZone: 'America/Chicago' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    const sheet = await pdf(`/api/bookings/${bookingId}/handover-sheet.pdf`);
    expect(sheet).toContain('Handed over Dec 7, 2027, 8:30 AM CST');
    expect(sheet).toContain('Dec 7 – 11, 2027, both days included');
    expect(sheet).not.toContain('Dec 2027');
  });

  it('writes the equipment record in US dates with the same content hash, and prints it in Chicago time', async () => {
    const after = await record(tracker.id);
    const plan = (r: EquipmentRecordView) => r.items.find((i) => i.clause === '6.4.13 e)')?.value;
    // Calibrated 1 Jun 2026 with a 24-month interval: due 1 Jun 2028 (worked by hand).
    expect(plan(recordBefore)).toContain('last 1 Jun 2026');
    expect(plan(recordBefore)).toContain('due 1 Jun 2028');
    expect(plan(after)).toContain('last Jun 1, 2026');
    expect(plan(after)).toContain('due Jun 1, 2028');
    expect(after.contentHash).toBe(recordBefore.contentHash);
    const text = await pdf(`/api/assets/${tracker.id}/record.pdf`);
    expect(text).toContain('due Jun 1, 2028');
    // Printed now: Chicago's zone is CST or CDT depending on the season.
    expect(text).toMatch(/printed [A-Z][a-z]{2} \d{1,2}, \d{4}, \d{1,2}:\d{2} (AM|PM) C[SD]T by Nestkeeper/);
    expect(text).toContain(`content SHA-256 ${after.contentHash}`);
  });

  it("names dates in refusals in the firm's format and keeps ISO dates in the details", async () => {
    const clash = await book({ assetIds: [tracker.id], startsOn: '2027-12-10', endsOn: '2027-12-12' });
    expect(clash.status).toBe(409);
    expect(oneLine(clash.body.error.message)).toBe('Already booked: TRK-US1 (booked Dec 7 – 11, 2027).');
    expect(clash.body.error.details.conflicts[0]).toMatchObject({ startsOn: '2027-12-07', endsOn: '2027-12-11' });

    const { today } = (await t.api.get('/api/bookings/today').set(bearer(manager))).body as { today: string };
    const yesterday = addDays(today, -1);
    const past = await book({ assetIds: [tracker.id], startsOn: yesterday, endsOn: yesterday });
    expect(past.status).toBe(422);
    expect(past.body.error.code).toBe('dates_past');
    // date-fns writes the US date from its own locale data, not from Intl.
    expect(oneLine(past.body.error.message)).toContain(`is before today (${format(parseISO(today), 'MMM d, yyyy')})`);
    expect(past.body.error.message).not.toContain(today);
  });
});
