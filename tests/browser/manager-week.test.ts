import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually } from '../support/eventually';
import { parseTypedDate } from '../../shared/formatting/typed-date';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe("the shop manager's week, told truly", () => {
  it('books from a job, swaps an item, checks out a reservation not collected, sees an early return drawn truly and a three-item lab trip not blocked', async () => {
    const today = todayIn('Europe/Berlin');
    const api = await rig.apiAs('manager@demo.test');
    const tracker = async (assetTag: string, lastCalibratedOn = today) => {
      const res = await api('/assets', {
        type: 'tracker',
        assetTag,
        serialNumber: `SN-${assetTag}`,
        calibration: { required: true, intervalMonths: 12, lastCalibratedOn },
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return res.body as { id: string; assetTag: string };
    };
    const [first, second, lapsedItem, earlyItem] = [await tracker('TRK-W01'), await tracker('TRK-W02'), await tracker('TRK-W03'), await tracker('TRK-W04')];
    // Due in a week (calibrated a year ago less a week): these three go to the lab together.
    const dueSoon = addDays(addDays(today, 7), -365);
    const labItems = [await tracker('TRK-W05', dueSoon), await tracker('TRK-W06', dueSoon), await tracker('TRK-W07', dueSoon)];
    const job = (await api('/jobs', { reference: 'J-WEEK-1', customerName: 'Thornwick Castings', startsOn: addDays(today, 3), endsOn: addDays(today, 6) }))
      .body;

    // A reservation whose days passed without checkout (made ten days ago for that day).
    const lapsed = (await api('/bookings', { assetIds: [lapsedItem.id], startsOn: today, endsOn: today, note: 'Pick-up by Brisk Survey' })).body;
    await rig.db.query(`UPDATE bookings SET starts_on = starts_on - 10, ends_on = ends_on - 10 WHERE id = $1`, [lapsed.id]);
    await rig.db.query(`UPDATE booking_items SET starts_on = starts_on - 10, ends_on = ends_on - 10 WHERE booking_id = $1`, [lapsed.id]);
    // Booked for a week, back the same day.
    const early = (await api('/bookings', { assetIds: [earlyItem.id], startsOn: today, endsOn: addDays(today, 6) })).body;
    const walk = { counterpart: 'Odile Brackwater', checklist: [{ assetId: earlyItem.id, present: true, condition: 'good' }] };
    expect((await api(`/bookings/${early.id}/checkout`, walk)).status).toBe(200);
    expect((await api(`/bookings/${early.id}/return`, walk)).status).toBe(200);
    // The owner ticks the three due-soon trackers in the calibration review and plans one trip: one window free for all three.
    const owner = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    await owner.page.goto(`${rig.baseUrl}/calibration`);
    for (const item of labItems) await owner.page.getByLabel(`Choose ${item.assetTag} for one lab trip`).check();
    await owner.page.getByRole('link', { name: 'Plan one trip' }).click();
    await owner.page.getByRole('heading', { level: 1, name: 'Plan one lab trip: 3 items' }).waitFor();
    await owner.page.getByLabel('Lab', { exact: true }).fill('Fenmoor Calibration Lab');
    await owner.page.getByRole('button', { name: 'Plan this trip for all 3' }).first().click();
    await owner.page.getByRole('heading', { name: 'Trip planned' }).waitFor();
    await owner.context.close();
    const trips: { booking_id: string; items: string[] }[] = await rig.db.query(
      `SELECT t.booking_id, array_agg(a.asset_tag ORDER BY a.asset_tag) AS items
         FROM lab_trips t JOIN lab_trip_items i ON i.lab_trip_id = t.id JOIN assets a ON a.id = i.asset_id
        WHERE a.id = ANY($1) GROUP BY t.id`,
      [labItems.map((i) => i.id)],
    );
    expect(trips).toEqual([{ booking_id: expect.any(String), items: ['TRK-W05', 'TRK-W06', 'TRK-W07'] }]);
    const tripBooking = trips[0].booking_id;
    expect((await rig.db.query(`SELECT count(*)::int AS n FROM booking_items WHERE booking_id = $1`, [tripBooking]))[0].n).toBe(3);

    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');

    // Monday: a booking from the job starts with the job's days.
    await nav.getByRole('link', { name: 'Jobs' }).click();
    await page.getByRole('heading', { level: 1, name: 'Jobs' }).waitFor();
    await page.getByText('J-WEEK-1').first().click();
    await page.getByRole('link', { name: 'Book kit for this job' }).click();
    await page.getByRole('heading', { level: 1, name: 'Book kit' }).waitFor();
    // The fields show the job's days the firm's way (never ISO), and that text reads back as those days.
    await eventually(async () => parseTypedDate(await page.getByLabel('Starts on').inputValue(), 'en-GB')).toBe(job.startsOn);
    expect(await page.getByLabel('Starts on').inputValue()).not.toMatch(/^\d{4}-/);
    expect(parseTypedDate(await page.getByLabel('Ends on').inputValue(), 'en-GB')).toBe(job.endsOn);
    await page.getByLabel('Add separate items').fill('TRK-W01');
    await page.getByRole('button', { name: 'Add TRK-W01' }).click();
    await page.getByRole('button', { name: 'Book', exact: true }).click();
    await page.waitForURL(/\/bookings\/[0-9a-f-]{36}$/);
    const bookingId = page.url().split('/').pop()!;
    const [made] = await rig.db.query(`SELECT job_id, to_char(starts_on, 'YYYY-MM-DD') AS starts_on FROM bookings WHERE id = $1`, [bookingId]);
    expect(made).toEqual({ job_id: job.id, starts_on: job.startsOn });

    // Tuesday: the tracker is swapped for another before it goes.
    await page.getByRole('button', { name: 'Change items' }).click();
    await page.getByRole('button', { name: 'Take off TRK-W01' }).click();
    await page.getByLabel('Add separate items').fill('TRK-W02');
    await page.getByRole('button', { name: 'Add TRK-W02' }).click();
    await page.getByRole('button', { name: 'Save items' }).click();
    const tagsOn = async () =>
      (await rig.db.query(`SELECT a.asset_tag FROM booking_items bi JOIN assets a ON a.id = bi.asset_id WHERE bi.booking_id = $1`, [bookingId])).map(
        (r: { asset_tag: string }) => r.asset_tag,
      );
    await eventually(tagsOn).toEqual([second.assetTag]);
    expect(first.assetTag).toBe('TRK-W01');

    // Wednesday: last week's pick-up never came. It is not collected, not "going out today"; it goes out late with a note.
    await nav.getByRole('link', { name: 'Home' }).click();
    const notCollected = page.getByRole('region', { name: 'Not collected' });
    await notCollected.locator(`a[href="/bookings/${lapsed.id}"]`).waitFor();
    expect(await page.getByRole('region', { name: 'Going out today' }).locator(`a[href="/bookings/${lapsed.id}"]`).count()).toBe(0);
    // The three-item lab trip renews their calibration: it is not a blocked booking.
    expect(await page.getByRole('region', { name: 'Blocked bookings' }).locator(`a[href="/bookings/${tripBooking}"]`).count()).toBe(0);
    await notCollected.locator(`a[href="/bookings/${lapsed.id}"]`).click();
    await page.getByRole('link', { name: 'Check out late' }).click();
    await page.getByLabel(`Present: ${lapsedItem.assetTag}`).check();
    await page.getByLabel('Taken by').fill('Brisk Survey driver');
    await page.getByLabel('Why it goes late').fill('Customer postponed by a week');
    await page.getByLabel('New last day').fill(addDays(today, 2));
    await page.getByRole('button', { name: 'Hand over late' }).click();
    await eventually(
      async () =>
        (await rig.db.query(`SELECT state, checkout_note, to_char(starts_on, 'YYYY-MM-DD') AS starts_on FROM bookings WHERE id = $1`, [lapsed.id]))[0],
    ).toEqual({ state: 'out', checkout_note: 'Customer postponed by a week', starts_on: today });

    // Thursday: the board draws the week-long booking that came back the same day over that day only, the rest faint.
    await page.goto(`${rig.baseUrl}/board?from=${today}`);
    const bar = page.locator(`a[href="/bookings/${early.id}"]`);
    await bar.waitFor();
    expect(await bar.getAttribute('aria-label')).toMatch(/back early on/);
    const barBox = (await bar.boundingBox())!;
    const remainder = page.locator('[data-planned-remainder]');
    await eventually(() => remainder.count()).toBeGreaterThan(0);
    // The solid bar covers one day; the planned remainder starts where it ends.
    const boxes = await remainder.evaluateAll((els) => els.map((e) => e.getBoundingClientRect().toJSON() as { x: number; y: number; width: number }));
    const mine = boxes.find((b) => Math.abs(b.y - barBox.y) < 2 && b.x > barBox.x);
    expect(mine).toBeDefined();
    expect(mine!.width).toBeGreaterThan(barBox.width * 4);
    await context.close();
  });

  it("lists the firm's technicians, shows held items as such in the search, previews only what is marked at return, and reprints the hand-over sheet", async () => {
    const today = todayIn('Europe/Berlin');
    const api = await rig.apiAs('manager@demo.test');
    const [{ name: techName }] = await rig.db.query(`SELECT name FROM users WHERE email = 'tech@demo.test'`);
    const [held] = await rig.db.query(`SELECT asset_tag FROM assets WHERE status = 'held' ORDER BY asset_tag LIMIT 1`);
    const free = (await api(`/availability?type=smr&startsOn=${today}&endsOn=${addDays(today, 1)}&limit=2`)).body.items as { id: string; assetTag: string }[];
    const smrs = free.map((x) => ({ id: x.id, asset_tag: x.assetTag }));
    expect(smrs).toHaveLength(2);
    const siteJob = (await api('/jobs', { reference: 'J-WEEK-2', customerName: 'Marrowgate Aero', startsOn: today, endsOn: addDays(today, 1) })).body;
    const out = (await api('/bookings', { assetIds: smrs.map((s) => s.id), jobId: siteJob.id, startsOn: today, endsOn: addDays(today, 1) })).body;
    const walk = { counterpart: 'Odile Brackwater', checklist: smrs.map((s) => ({ assetId: s.id, present: true, condition: 'good' })) };
    expect((await api(`/bookings/${out.id}/checkout`, walk)).status, JSON.stringify(out)).toBe(200);

    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    await nav.getByRole('link', { name: 'Jobs' }).click();
    await page.getByRole('button', { name: 'New job' }).click();
    expect(await page.getByLabel('Lead technician').locator('option').allInnerTexts()).toContain(techName);
    await page.keyboard.press('Escape');

    await page.goto(`${rig.baseUrl}/bookings/new`);
    await page.getByLabel('Add separate items').fill(held.asset_tag);
    await eventually(() => page.locator('main').innerText()).toMatch(new RegExp(`${held.asset_tag}[\\s\\S]*On hold`));
    expect(await page.getByRole('button', { name: `Add ${held.asset_tag}` }).count()).toBe(0);

    await page.goto(`${rig.baseUrl}/bookings/${out.id}`);
    expect(await page.getByRole('link', { name: 'Hand-over sheet (PDF)' }).getAttribute('href')).toBe(`/api/bookings/${out.id}/handover-sheet.pdf`);
    await page.getByRole('link', { name: 'Take back' }).click();
    await page.getByRole('group', { name: 'Suggested people' }).getByRole('button', { name: techName }).waitFor();
    // Nothing ticked yet: nothing is called missing.
    expect(await page.locator('main').innerText()).not.toMatch(/missing|What taking back will do/);
    await page.getByLabel(`Present: ${smrs[0].asset_tag}`).check();
    await eventually(() => page.locator('main').innerText()).toMatch(new RegExp(`Not ticked present yet: ${smrs[1].asset_tag}\\.`));
    expect(await page.locator('main').innerText()).not.toMatch(new RegExp(`Not ticked present yet: [^.]*${smrs[0].asset_tag}`));

    // One SMR came back dented: its photos go with the incident, which names the booking and the job's customer.
    await page.getByLabel(`Present: ${smrs[1].asset_tag}`).check();
    await page.getByLabel(`Condition: ${smrs[1].asset_tag}`).selectOption('damaged');
    const photo = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#8a7a5c' } })
      .jpeg()
      .toBuffer();
    await page.getByLabel(`Photos of ${smrs[1].asset_tag}`).setInputFiles({ name: 'dent.jpg', mimeType: 'image/jpeg', buffer: photo });
    await page.getByRole('group', { name: 'Suggested people' }).getByRole('button', { name: techName }).click();
    await page.getByRole('button', { name: 'Take back' }).click();
    await page.getByRole('link', { name: 'open its incident' }).click();
    await page.getByText('Marrowgate Aero', { exact: true }).waitFor();
    await eventually(() => page.locator('main').innerText()).toMatch(/dent\.jpg/);
    const [incident] = await rig.db.query(
      `SELECT i.booking_id, i.customer_name, count(p.id)::int AS photos FROM incidents i LEFT JOIN incident_photos p ON p.incident_id = i.id
        WHERE i.asset_id = $1 GROUP BY i.id`,
      [smrs[1].id],
    );
    expect(incident).toEqual({ booking_id: out.id, customer_name: 'Marrowgate Aero', photos: 1 });
    await context.close();
  });
});
