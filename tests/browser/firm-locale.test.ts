import fs from 'node:fs';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually, waitUntil } from '../support/eventually';
import { parseTypedDate } from '../../shared/formatting/typed-date';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

/** Expected text is written with luxon's own token formatting (English month names), not with the app's Intl formatter. */
const luxonDay = (isoDate: string) => DateTime.fromISO(isoDate, { zone: 'utc' });

describe("the firm's locale and time zone, set on the settings page", () => {
  it('en-US and America/Chicago change the dates and times every screen shows, and a date typed in US style is stored as the right day', async () => {
    const [booking] = await rig.db.query(
      `SELECT id, to_char(starts_on, 'YYYY-MM-DD') AS starts_on, checked_out_at FROM bookings
        WHERE checked_out_at IS NOT NULL AND starts_on <> ends_on ORDER BY checked_out_at LIMIT 1`,
    );
    expect(booking).toBeDefined();
    const checkedOut = DateTime.fromJSDate(booking.checked_out_at);
    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview");

    // Before: the demo firm writes en-GB in Berlin time ("7 Dec 2026", 24-hour clock).
    await page.goto(`${rig.baseUrl}/bookings/${booking.id}`);
    const checkedOutLine = page.locator('dd', { hasText: 'taken by' });
    await eventually(() => checkedOutLine.innerText()).toContain(checkedOut.setZone('Europe/Berlin').toFormat('d LLL yyyy, HH:mm'));

    await nav.getByRole('link', { name: 'Settings' }).click();
    const voice = page.getByRole('form', { name: 'Locale and time zone' });
    await voice.getByLabel('Locale').selectOption('en-US');
    // The sample says how it will read before anything is saved.
    await eventually(() => voice.getByTestId('voice-sample').innerText()).toMatch(/^Dec 3, 2026 · €1,250\.00 · /);
    // Only a name from the IANA list is taken.
    await voice.getByLabel('Time zone').fill('Chicago');
    await voice.getByRole('button', { name: 'Save locale and time zone' }).click();
    await voice.getByText('Choose a time zone from the list, such as Europe/Berlin or America/Chicago.').waitFor();
    await voice.getByLabel('Time zone').fill('America/Chicago');
    await voice.getByRole('button', { name: 'Save locale and time zone' }).click();
    await voice.getByText('Saved. Screens, e-mails and PDFs now write dates, times and money this way.').waitFor();
    const api = await rig.apiAs('owner@demo.test');
    await eventually(async () => (await api('/settings')).body).toMatchObject({ locale: 'en-US', timeZone: 'America/Chicago' });

    // After: the same booking in US style, its checkout in Chicago's clock with the zone named (this browser runs in UTC).
    await page.goto(`${rig.baseUrl}/bookings/${booking.id}`);
    const chicago = checkedOut.setZone('America/Chicago');
    // ICU puts a narrow no-break space before AM/PM.
    await eventually(() => checkedOutLine.innerText()).toMatch(
      new RegExp(`${chicago.toFormat('LLL d, yyyy, h:mm')}[\\s\u202f]${chicago.toFormat('a')} C[SD]T`),
    );
    expect(await page.locator('main').innerText()).toContain(luxonDay(booking.starts_on).toFormat('LLL d'));
    expect(await page.locator('main').innerText()).toContain('All times in America/Chicago, the firm’s time zone.');

    // A job typed with US dates: "Mar 1, 2027" in the shown style, "3/2/2027" in the numeric one (month first).
    const firstDay = luxonDay(addDays(todayIn('America/Chicago'), 90));
    const lastDay = firstDay.plus({ days: 1 });
    await page.goto(`${rig.baseUrl}/jobs`);
    await page.getByRole('button', { name: 'New job' }).click();
    await page.getByLabel('Reference').fill('J-US-DATES');
    await page.getByLabel('Customer name').fill('Ostby Press Tools');
    await page.getByLabel('First day on site').fill(firstDay.toFormat('LLL d, yyyy'));
    await page.getByLabel('Last day on site').fill(lastDay.toFormat('M/d/yyyy'));
    await page.getByLabel('Last day on site').blur();
    // Once read, the field shows the day the firm's way.
    expect(await page.getByLabel('Last day on site').inputValue()).toBe(lastDay.toFormat('LLL d, yyyy'));
    await page.getByRole('button', { name: 'Add job' }).click();
    await eventually(
      async () =>
        (await rig.db.query(`SELECT to_char(starts_on, 'YYYY-MM-DD') AS s, to_char(ends_on, 'YYYY-MM-DD') AS e FROM jobs WHERE reference = 'J-US-DATES'`))[0],
    ).toEqual({ s: firstDay.toISODate(), e: lastDay.toISODate() });
    await context.close();
  }, 180_000);

  it('a date field refuses text that is no date, and its calendar picks a day with the keyboard', async () => {
    const { context, page } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    await page.goto(`${rig.baseUrl}/jobs`);
    await page.getByRole('button', { name: 'New job' }).click();
    await page.getByLabel('Reference').fill('J-PICKED');
    await page.getByLabel('Customer name').fill('Ostby Press Tools');
    await page.getByLabel('First day on site').fill('31/02/2027');
    await page.getByRole('button', { name: 'Add job' }).click();
    await page.getByText(/^Enter a date such as .+, or as YYYY-MM-DD\.$/).waitFor();
    // The calendar: opened from its button, arrow keys move a day, Enter picks it.
    const first = page.getByLabel('First day on site');
    await first.fill('');
    const firstField = page.locator('div', { has: first }).last();
    await firstField.getByRole('button', { name: 'Open calendar' }).click();
    const calendar = page.getByRole('dialog', { name: 'Calendar' });
    await calendar.waitFor();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('Enter');
    await calendar.waitFor({ state: 'detached' });
    const picked = await first.inputValue();
    expect(picked).not.toBe('');
    await page.getByLabel('Last day on site').fill(addDays(todayIn('America/Chicago'), 400));
    await page.getByRole('button', { name: 'Add job' }).click();
    const stored = await waitUntil(
      'the job with a picked day',
      async () => (await rig.db.query(`SELECT to_char(starts_on, 'YYYY-MM-DD') AS s FROM jobs WHERE reference = 'J-PICKED'`))[0],
    );
    // The field showed the picked day the firm's way, and that text reads back as the stored day.
    const api = await rig.apiAs('owner@demo.test');
    expect(parseTypedDate(picked, (await api('/settings')).body.locale)).toBe(stored.s);
    await context.close();
  }, 120_000);
});

describe('unsaved settings', () => {
  it('leaving the settings page with a changed section asks first; staying keeps the change, leaving drops it; closing the tab asks too', async () => {
    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    await nav.getByRole('link', { name: 'Settings' }).click();
    const dueDates = page.getByRole('form', { name: 'Due dates and checkout' });
    await dueDates.getByLabel('Due-soon window (days)').fill('21');

    await nav.getByRole('link', { name: 'Users' }).click();
    const ask = page.getByRole('dialog', { name: 'Leave without saving?' });
    await ask.waitFor();
    expect(await ask.innerText()).toContain('“Due dates and checkout” has changes that are not saved.');
    await ask.getByRole('button', { name: 'Stay on this page' }).click();
    await ask.waitFor({ state: 'hidden' });
    expect(new URL(page.url()).pathname).toBe('/settings');
    expect(await dueDates.getByLabel('Due-soon window (days)').inputValue()).toBe('21');

    // Closing the tab: the browser's own "leave site?" question.
    const asked = new Promise<string>((resolve) => page.once('dialog', (dialog) => (resolve(dialog.type()), void dialog.dismiss())));
    await page.close({ runBeforeUnload: true });
    expect(await asked).toBe('beforeunload');
    expect(page.isClosed()).toBe(false);

    await nav.getByRole('link', { name: 'Users' }).click();
    await ask.getByRole('button', { name: 'Leave and discard changes' }).click();
    await page.getByRole('heading', { level: 1, name: 'Users' }).waitFor();
    const api = await rig.apiAs('owner@demo.test');
    expect((await api('/settings')).body.dueSoonDays).not.toBe(21);

    // A saved section leaves freely.
    await nav.getByRole('link', { name: 'Settings' }).click();
    await dueDates.getByLabel('Due-soon window (days)').fill('21');
    await dueDates.getByRole('button', { name: 'Save due dates and checkout' }).click();
    await dueDates.getByText('Saved. Due states everywhere now use them.').waitFor();
    await nav.getByRole('link', { name: 'Users' }).click();
    await page.getByRole('heading', { level: 1, name: 'Users' }).waitFor();
    await context.close();
  }, 120_000);
});

describe('the booking board read aloud', () => {
  it("every control's accessible name contains the words it shows (WCAG 2.5.3, axe-core's label-content-name-mismatch)", async () => {
    const { context, page, nav } = await signedIn(rig, 'manager@demo.test', 'Shop floor today', { bypassCSP: true });
    await nav.getByRole('link', { name: 'Bookings' }).click();
    await page.getByRole('heading', { level: 1, name: 'Bookings' }).waitFor();
    await page.locator('[data-bar]').first().waitFor();
    const bars = await page
      .locator('[data-bar]')
      .evaluateAll((links) =>
        links.map((a) => ({ name: a.getAttribute('aria-label') ?? '', shown: (a as HTMLElement).innerText.replace(/[◂▸]/g, '').replace(/\s+/g, ' ').trim() })),
      );
    expect(bars.length).toBeGreaterThan(5);
    // The seed has a late job on the board: its "Late" mark is part of what is shown.
    expect(bars.some((b) => /late$/i.test(b.shown))).toBe(true);
    for (const bar of bars) expect(bar.name.toLowerCase(), bar.name).toContain(bar.shown.toLowerCase());

    await page.evaluate(fs.readFileSync('node_modules/axe-core/axe.min.js', 'utf8'));
    const mismatches = await page.evaluate(async () => {
      const axe = (window as unknown as { axe: { run: (c: Document, o: object) => Promise<{ violations: { nodes: { html: string }[] }[] }> } }).axe;
      const result = await axe.run(document, { runOnly: ['label-content-name-mismatch'] });
      return result.violations.flatMap((v) => v.nodes.map((n) => n.html));
    });
    expect(mismatches).toEqual([]);
    await context.close();
  }, 120_000);
});
