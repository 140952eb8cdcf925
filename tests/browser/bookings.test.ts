import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('booking board in a real browser', () => {
  it('a manager books a kit, is told its tracker falls due mid-job, takes the alternative, checks out and takes back with one item missing', async () => {
    const today = todayIn('Europe/Berlin');
    const startsOn = addDays(today, 22);
    const endsOn = addDays(today, 26);
    // Arrange: Kit Alder's tracker falls due in the middle of the job, and a spare tracker is free and calibrated.
    await rig.db.query(`UPDATE assets SET due_on = $1 WHERE asset_tag = 'TRK-001'`, [addDays(today, 24)]);
    const login = await fetch(`${rig.baseUrl}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'manager@demo.test', password: 'nestkeeper-demo' }),
    });
    const { token } = await login.json();
    const spare = await fetch(`${rig.baseUrl}/api/assets`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify({
        type: 'tracker',
        assetTag: 'TRK-090',
        serialNumber: 'TR-SPARE-90',
        calibration: { required: true, intervalMonths: 12, lastCalibratedOn: today },
      }),
    });
    expect(spare.status).toBe(201);
    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    await nav.getByRole('link', { name: 'Bookings' }).click();
    await page.getByRole('heading', { level: 1, name: 'Bookings' }).waitFor();
    await page.getByRole('link', { name: 'Book Kit Alder' }).click();
    await page.getByRole('heading', { level: 1, name: 'Book kit' }).waitFor();
    // Typed the way a person in the firm writes dates (en-GB, month in words), as the fields show them.
    await page.getByLabel('Starts on').fill(DateTime.fromISO(startsOn).toFormat('d LLLL yyyy'));
    await page.getByLabel('Ends on').fill(DateTime.fromISO(endsOn).toFormat('d LLLL yyyy'));
    await eventually(() => page.locator('main').innerText()).toMatch(/TRK-001/);
    await eventually(() => page.locator('main').innerText()).toMatch(/TRK-001 falls due on .*, during this booking/);
    await page.getByRole('button', { name: 'Book', exact: true }).click();
    const alternative = page.getByRole('button', { name: /^Use TRK-\d+ instead$/ }).first();
    await alternative.waitFor();
    const chosen = (await alternative.innerText()).match(/TRK-\d+/)![0];
    await alternative.click();
    // Taking the alternative books again straight away (BookForm's swap submits the form).
    await page.waitForURL(/\/bookings\/[0-9a-f-]{36}$/);
    const bookingId = page.url().split('/').pop()!;
    const items: { asset_tag: string }[] = await rig.db.query(
      `SELECT a.asset_tag FROM booking_items bi JOIN assets a ON a.id = bi.asset_id WHERE bi.booking_id = $1`,
      [bookingId],
    );
    const tags = items.map((i) => i.asset_tag);
    expect(tags).toContain(chosen);
    expect(tags).not.toContain('TRK-001');
    expect(chosen).toBe('TRK-090');

    await page.getByRole('link', { name: 'Check out' }).click();
    for (const tag of tags) await page.getByLabel(`Present: ${tag}`).check();
    await page.getByLabel('Taken by').fill('Tamsin Quillfeather');
    await page.getByRole('button', { name: 'Hand over' }).click();
    // Three weeks ahead, checkout has not opened: handing over now needs a reason, which the booking keeps.
    await page.getByRole('heading', { name: 'Hand over before checkout opens?' }).waitFor();
    await page.getByLabel('Why it goes early').fill('Crew drives out early to set up');
    await page.getByRole('button', { name: 'Hand over early' }).click();
    await eventually(async () => (await rig.db.query(`SELECT state, checkout_note FROM bookings WHERE id = $1`, [bookingId]))[0]).toEqual({
      state: 'out',
      checkout_note: 'Crew drives out early to set up',
    });

    await page.goto(`${rig.baseUrl}/bookings/${bookingId}`);
    await page.getByRole('link', { name: 'Take back' }).click();
    const missing = tags.find((t) => t.startsWith('NST-'))!;
    for (const tag of tags) if (tag !== missing) await page.getByLabel(`Present: ${tag}`).check();
    await page.getByLabel(`Present: ${missing}`).uncheck();
    await page.getByLabel('Brought back by').fill('Tamsin Quillfeather');
    await page.getByRole('button', { name: 'Take back' }).click();
    await eventually(async () => (await rig.db.query(`SELECT state FROM bookings WHERE id = $1`, [bookingId]))[0].state).toBe('returned');
    await eventually(() => page.locator('main').innerText()).toMatch(new RegExp(missing));
    const [incident] = await rig.db.query(`SELECT i.kind, a.status FROM incidents i JOIN assets a ON a.id = i.asset_id WHERE i.booking_id = $1`, [bookingId]);
    expect(incident).toEqual({ kind: 'missing', status: 'held' });
    await context.close();
  }, 120_000);

  // How fast it draws is measured by `npm run bench:bookings` (tests/bench/board-drawing.ts), not asserted here.
  it('draws the whole demo fleet (about 90 rows) over 8 weeks', async () => {
    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    await nav.getByRole('link', { name: 'Bookings' }).click();
    await page.getByRole('heading', { level: 1, name: 'Bookings' }).waitFor();
    await page.getByLabel('Weeks shown').selectOption('8');
    await eventually(() => page.locator('[role="rowheader"], th[scope="row"]').count()).toBeGreaterThanOrEqual(90);
    await context.close();
  });
});
