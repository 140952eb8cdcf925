import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { phone, signedIn } from '../support/browser-session';
import { eventually, waitUntil } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

async function clerkApi(path: string, body?: unknown) {
  return (await (await rig.apiAs('billing@demo.test'))(path, body)).body;
}

let offset = 40;
/** A rental of one free SMR for Ostby Mould & Die (a demo customer), made as the clerk would. */
async function newRental(): Promise<{ id: string; number: string }> {
  const today = todayIn('Europe/Berlin');
  const [startsOn, endsOn] = [addDays(today, offset), addDays(today, offset + 4)];
  offset += 6;
  const [smr] = (await clerkApi(`/availability?type=smr&startsOn=${startsOn}&endsOn=${endsOn}&limit=1`)).items;
  const customer = (await clerkApi('/customers?limit=50')).items.find((c: { company: string }) => c.company === 'Ostby Mould & Die');
  return clerkApi('/rentals', { customerId: customer.id, assetIds: [smr.id], startsOn, endsOn });
}

/** The renter's link as the mail to the customer carries it (the outbox the SMTP delivery sends from). */
const mailedLink = (number: string) =>
  waitUntil(`the renter's mail for ${number}`, async () => {
    const [mail] = await rig.db.query(`SELECT text_body FROM outbox_messages WHERE subject = $1 ORDER BY created_at DESC LIMIT 1`, [
      `Rental ${number}: your agreement and deposit`,
    ]);
    return mail && /(http:\/\/\S+\/renter\/[\w-]+)/.exec(mail.text_body)?.[1];
  });

async function typeCard(page: Page, number: string) {
  await page.getByLabel('Card number').fill(number);
  await page.getByLabel('Expiry').fill('12 / 34');
  await page.getByLabel('CVC').fill('123');
  await page.getByRole('button', { name: /^Authorize/ }).click();
}

describe('the renter’s side in a real browser', () => {
  it('the clerk sends the link; the renter accepts the agreement on a phone and authorizes the card on the provider’s page; the clerk’s page follows', async () => {
    const rental = await newRental();
    const clerk = await signedIn(rig, 'billing@demo.test', 'Billing desk');
    await clerk.page.goto(`${rig.baseUrl}/rentals/${rental.id}`);
    // Test keys: the shortcut is there and says so.
    await clerk.page.getByText('Test mode', { exact: true }).waitFor();
    await clerk.page.getByRole('button', { name: 'Send the renter a link' }).click();
    await clerk.page.getByText('Waiting for the renter').waitFor();
    await clerk.page.getByRole('img', { name: /QR code of the payment page/ }).waitFor();

    const renter = await rig.newContext(phone);
    const page = await renter.newPage();
    await page.goto(await mailedLink(rental.number));
    await page.getByRole('heading', { level: 1, name: `Rental ${rental.number}` }).waitFor();
    await page.getByRole('heading', { name: /Items and calibration/ }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(375);
    await page.getByRole('button', { name: 'Accept the agreement' }).click();
    await page.getByText('Type your full name.').waitFor();
    await page.getByLabel('Your full name').fill('Mara Ostby');
    // With the keyboard: space ticks the box, Enter on the button sends.
    await page.getByRole('checkbox', { name: /I have read the rental agreement/ }).focus();
    await page.keyboard.press('Space');
    await page.getByRole('button', { name: 'Accept the agreement' }).focus();
    await page.keyboard.press('Enter');
    await page.getByText('Agreement accepted').waitFor();

    await page.getByRole('link', { name: 'Place the deposit on your card' }).click();
    await page.getByLabel('Card number').waitFor();
    await typeCard(page, '4242 4242 4242 4242');
    await page.waitForURL(/\/renter\/[\w-]{40,}$/);
    await page.getByText('Deposit authorized').waitFor();
    await eventually(() => page.locator('main').innerText()).toMatch(/Visa ending 4242/);

    // The clerk did not reload: the rental page asked again by itself.
    await eventually(() => clerk.page.locator('main').innerText()).toMatch(/Visa ending 4242/);
    await eventually(() => clerk.page.locator('main').innerText()).toMatch(/Accepted by Mara Ostby/);
    await renter.close();
    await clerk.context.close();
  }, 120_000);

  it('a declined card shows as declined to the clerk, who is offered a new link', async () => {
    const rental = await newRental();
    const clerk = await signedIn(rig, 'billing@demo.test', 'Billing desk');
    await clerk.page.goto(`${rig.baseUrl}/rentals/${rental.id}`);
    await clerk.page.getByRole('button', { name: 'Send the renter a link' }).click();
    await clerk.page.getByText('Waiting for the renter').waitFor();

    const renter = await rig.newContext(phone);
    const page = await renter.newPage();
    await page.goto(await mailedLink(rental.number));
    await page.getByRole('link', { name: 'Place the deposit on your card' }).click();
    await typeCard(page, '4000 0000 0000 0002');
    await page.getByRole('alert').getByText('Your card was declined.').waitFor();

    await clerk.page.getByText('Declined', { exact: true }).waitFor();
    await clerk.page.getByRole('button', { name: 'Send a new link' }).waitFor();
    await renter.close();
    await clerk.context.close();
  }, 120_000);
});
