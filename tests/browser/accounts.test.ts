import { Secret, TOTP } from 'otpauth';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { eventually, waitUntil } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

async function signIn(page: Page, email: string, password = 'nestkeeper-demo') {
  await page.goto(`${rig.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).first();
const nav = (page: Page) => page.getByRole('navigation', { name: 'Main navigation' });

/** The code an authenticator app shows for this key (otpauth, as the app would compute it), `ahead` steps of 30 s later. */
const appCode = (key: string, ahead = 0) =>
  new TOTP({ secret: Secret.fromBase32(key), algorithm: 'SHA1', digits: 6, period: 30 }).generate({ timestamp: Date.now() + ahead * 30_000 });

/** Reads the key shown beside the QR code, types the app's code and keeps the recovery codes. */
async function setUpSecondStep(page: Page) {
  await page.getByRole('button', { name: 'Set up the second step' }).click();
  const key = (await page.getByTestId('second-step-secret').innerText()).trim();
  expect(await page.getByRole('img', { name: /QR code/ }).getAttribute('src')).toMatch(/^data:image\/png;base64,/);
  await page.getByLabel('Code from the app').fill(appCode(key));
  await page.getByRole('button', { name: 'Confirm and turn on' }).click();
  await eventually(() => page.getByRole('list', { name: 'Recovery codes' }).getByRole('listitem').count()).toBe(10);
  await page.getByRole('button', { name: 'I have kept them safe' }).click();
  return key;
}

/** The newest message the SMTP sink received for this address. The outbox is delivered on each look: a reset request
 * queues its mail after answering. */
async function sinkMail(to: string, subject: RegExp) {
  return waitUntil(`mail to ${to}`, async () => {
    await rig.deliverMail();
    const rows: { subject: string; text_body: string }[] = await rig.db.query(
      `SELECT subject, text_body FROM mail_sink_messages WHERE $1 = ANY(recipients) ORDER BY received_at DESC`,
      [to],
    );
    return rows.find((r) => subject.test(r.subject));
  });
}

describe('accounts a firm runs by itself, in a real browser', () => {
  // The invitation's link, as the owner's Mailbox shows it; the next test opens it in the invitee's browser.
  let invitationLink = '';

  it('the owner invites a technician and finds the mailed link in the Mailbox', async () => {
    const context = await rig.newContext();
    const owner = await context.newPage();
    await signIn(owner, 'owner@demo.test');
    await nav(owner).getByRole('link', { name: 'Users' }).click();
    const invite = owner.getByRole('form', { name: 'Invite someone' });
    await invite.getByLabel('E-mail').fill('wren.talbot@demo.test');
    await invite.getByLabel('Role').selectOption('technician');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await eventually(() => owner.getByRole('list', { name: 'Pending invitations' }).innerText()).toMatch(/wren\.talbot@demo\.test/);

    await rig.deliverMail();
    await nav(owner).getByRole('link', { name: 'Mailbox' }).click();
    await owner.getByRole('button', { name: /invited you to Brackenmoor Dimensional Works/ }).click();
    const reader = owner.getByRole('region', { name: 'Reader' });
    await eventually(() => reader.innerText()).toMatch(/Did not expect this\? Ignore this mail/);
    invitationLink = (await reader.getByRole('link', { name: /\/join#/ }).getAttribute('href'))!;
    expect(invitationLink.startsWith(`${rig.baseUrl}/join#`)).toBe(true);
    await context.close();
  });

  it('the invitee accepts from that link and is signed in; the link then says it was used', async () => {
    expect(invitationLink).not.toBe('');
    const context = await rig.newContext();
    const invitee = await context.newPage();
    await invitee.goto(invitationLink);
    await eventually(() => invitee.locator('main').innerText()).toMatch(/invites you as Field technician/);
    await invitee.getByLabel('Your name').fill('Wren Talbot');
    await invitee.getByLabel('New password', { exact: true }).fill('saltmarsh-copper-kettle-19');
    await invitee.getByLabel('Repeat new password').fill('saltmarsh-copper-kettle-19');
    await invitee.getByRole('button', { name: 'Join and sign in' }).click();
    await eventually(() => heading(invitee).innerText()).toBe('My kit');
    await eventually(() => invitee.getByRole('banner').innerText()).toMatch(/Wren Talbot/);

    await invitee.goto(invitationLink);
    await eventually(() => invitee.getByRole('alert').first().innerText()).toMatch(/used already/);
    await context.close();
  });

  it('a forgotten password is reset from the sign-in page; the session open elsewhere stops working', async () => {
    const oldContext = await rig.newContext();
    const old = await oldContext.newPage();
    await signIn(old, 'manager@demo.test');
    await eventually(() => heading(old).innerText()).toBe('Shop floor today');

    const context = await rig.newContext();
    const page = await context.newPage();
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    // The sign-in form has an "E-mail" field too: wait for the new page before typing.
    await eventually(() => heading(page).innerText()).toBe('Forgot your password?');
    await page.getByLabel('E-mail').fill('manager@demo.test');
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/Check your mail/);

    const mail = await sinkMail('manager@demo.test', /Set a new password/);
    expect(mail.text_body).toMatch(/Did not ask for this\?/);
    const href = /(http:\/\/\S+\/reset-password#\S+)/.exec(mail.text_body)![1];
    await page.goto(href);
    await page.getByLabel('New password', { exact: true }).fill('harbour-flint-meadow-42');
    await page.getByLabel('Repeat new password').fill('harbour-flint-meadow-42');
    await page.getByRole('button', { name: 'Set new password' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/Your new password is set/);

    // The other browser's session ended with the reset: its next page load goes to sign-in.
    await old.reload();
    await old.waitForURL(/\/sign-in/);
    await signIn(page, 'manager@demo.test', 'harbour-flint-meadow-42');
    await eventually(() => heading(page).innerText()).toBe('Shop floor today');
    await oldContext.close();
    await context.close();
  });

  it('a technician turns on the second step from My account, then signs in with a code from the app', async () => {
    const context = await rig.newContext();
    const page = await context.newPage();
    await signIn(page, 'tech@demo.test');
    await eventually(() => heading(page).innerText()).toBe('My kit');
    await nav(page).getByRole('link', { name: 'My account' }).click();
    await eventually(() => heading(page).innerText()).toBe('My account');
    await page.getByRole('button', { name: 'Turn on the second step' }).click();
    const key = await setUpSecondStep(page);
    await eventually(() => page.getByRole('region', { name: 'Second step' }).innerText()).toMatch(/On[\s\S]*Recovery codes left: 10 of 10/);
    await expect(page.getByRole('region', { name: 'Where you are signed in' }).innerText()).resolves.toMatch(/This device/);

    await page.getByRole('button', { name: 'Sign out', exact: true }).click();
    await page.waitForURL(/\/sign-in/);
    await signIn(page, 'tech@demo.test');
    // The code of the next time step: the one typed at setup is spent.
    await page.getByLabel('Code from your authenticator app').fill(appCode(key, 1));
    await page.getByRole('button', { name: 'Confirm and sign in' }).click();
    await eventually(() => heading(page).innerText()).toBe('My kit');
    await context.close();
  });

  it('when the firm requires it, the billing clerk must set up the second step before anything else', async () => {
    const ownerContext = await rig.newContext();
    const owner = await ownerContext.newPage();
    await signIn(owner, 'owner@demo.test');
    await nav(owner).getByRole('link', { name: 'Settings' }).click();
    await owner.getByLabel('Owners and billing clerks must sign in with a second step').check();
    await owner.getByRole('button', { name: 'Save sign-in rules' }).click();
    // The owner is one of those roles: the app asks them first.
    await eventually(() => heading(owner).innerText()).toBe('Set up your second step');
    await ownerContext.close();

    const context = await rig.newContext({ viewport: { width: 375, height: 812 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await signIn(page, 'billing@demo.test');
    await eventually(() => heading(page).innerText()).toBe('Set up your second step');
    expect(await page.getByRole('navigation', { name: 'Main navigation' }).count()).toBe(0);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await setUpSecondStep(page);
    await eventually(() => heading(page).innerText()).toBe('Billing desk');
    await context.close();
  });
});
