import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserRig, type BrowserRig } from '../support/browser';
import { signedIn } from '../support/browser-session';
import { eventually, waitUntil } from '../support/eventually';

let rig: BrowserRig;
beforeAll(async () => {
  rig = await startBrowserRig();
});
afterAll(() => rig?.close());

describe("the owner's impact triage in a real browser", () => {
  it('opens the review from home, accepts the suggested triage, and edits one of the two notices, sends both after one confirmation, and finds the edited words in the SMTP sink', async () => {
    // Arrange: the demo's TRK-001 review (9.5 µm as found) lists job J-2611 (±25 µm). Add a use on J-2620 (±100 µm) inside its window.
    const [review] = await rig.db.query(
      `SELECT r.id, r.asset_id, to_char(r.found_on - 20, 'YYYY-MM-DD') AS starts, to_char(r.found_on - 16, 'YYYY-MM-DD') AS ends
         FROM impact_reviews r JOIN assets a ON a.id = r.asset_id WHERE a.asset_tag = 'TRK-001' AND r.state = 'open'`,
    );
    const [{ id: bookingId, organization_id: org }] = await rig.db.query(
      `INSERT INTO bookings (organization_id, starts_on, ends_on, state, purpose, job_id, created_by)
       SELECT j.organization_id, $1, $2, 'returned', 'job', j.id, u.id FROM jobs j, users u WHERE j.reference = 'J-2620' AND u.email = 'manager@demo.test'
       RETURNING id, organization_id`,
      [review.starts, review.ends],
    );
    await rig.db.query(`INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active) VALUES ($1, $2, $3, $4, $5, false)`, [
      org,
      bookingId,
      review.asset_id,
      review.starts,
      review.ends,
    ]);
    await rig.db.query(`INSERT INTO impact_review_items (organization_id, review_id, booking_id) VALUES ($1, $2, $3)`, [org, review.id, bookingId]);
    await rig.db.query(`DELETE FROM outbox_messages`);

    const { context, page } = await signedIn(rig, 'owner@demo.test', "Owner's overview");
    const lookingAhead = page.getByRole('region', { name: /Looking ahead/ });
    await lookingAhead.getByText('1 to re-measure').waitFor();
    await lookingAhead.getByRole('link', { name: /Impact review: TRK-001/ }).click();
    await page.getByRole('heading', { level: 1, name: 'Impact review: TRK-001' }).waitFor();
    await page.getByText('Suggested: Re-measure advised').waitFor();
    await page.getByText('Suggested: No effect likely').waitFor();
    await page.getByText('9.5 µm, from the certificate', { exact: false }).waitFor();

    await page.getByRole('button', { name: 'Accept the suggested triage' }).click();
    await page.getByText('2 of 2 assessed').first().waitFor();
    expect(await page.getByLabel('Assessment: J-2611').inputValue()).toBe('remeasure_offered');
    expect(await page.getByLabel('Assessment: J-2620').inputValue()).toBe('no_effect');

    // Draft, read and edit the notice to Quarrington Rail, then send both after one confirmation.
    await page.getByRole('button', { name: 'Draft notices' }).click();
    const text = page.getByLabel('Text of the notice to works@quarrington-rail.test');
    expect(await text.inputValue()).toMatch(
      /^Dear .+,\n\nOn \d{1,2} [A-Z][a-z]{2} \d{4} the calibration laboratory found that the laser tracker TRK-001, serial \S+, was out of tolerance/,
    );
    await text.fill(`${await text.inputValue()}\n\nOur engineer Tamsin Vell will ring you this week to go through the figures.`);
    await page.getByLabel('Subject of the notice to works@quarrington-rail.test').fill('TRK-001 and your job J-2620: no effect on your results is likely');
    await page.getByRole('button', { name: 'Send 2 notices…' }).click();
    const confirm = page.getByRole('dialog', { name: 'Send 2 notices?' });
    await confirm.getByText(/2 notices go to quality@larkspur-aero\.test and works@quarrington-rail\.test; sent from Brackenmoor Dimensional Works/).waitFor();
    await confirm.getByRole('button', { name: 'Send now' }).click();
    await page.getByText(/^2 notices queued at /).waitFor();
    await page.getByText('works@quarrington-rail.test: waiting to send').waitFor();

    await rig.deliverMail();
    type Received = { recipients: string[]; subject: string; text: string; headers: Record<string, string> };
    const rows = await waitUntil('both notices in the SMTP sink', async () => {
      const found: Received[] = await rig.db.query(
        `SELECT recipients, subject, text_body AS text, headers FROM mail_sink_messages WHERE subject LIKE '%TRK-001%'`,
      );
      return found.length === 2 ? found : null;
    });
    const to = (address: string) => rows.find((m) => m.recipients.includes(address))!;
    const remeasure = to('quality@larkspur-aero.test');
    const noEffect = to('works@quarrington-rail.test');
    expect(remeasure.headers.from).toMatch(/Brackenmoor Dimensional Works"? <no-reply@/);
    expect(remeasure.subject).toMatch(/J-2611\): we propose a re-measurement/);
    const flat = (s: string) => s.replace(/\s+/g, ' ');
    expect(flat(remeasure.text)).toMatch(/9\.5 µm against your tolerance of 25\.0 µm; up to 6\.2 µm would be a quarter of it/);
    expect(flat(remeasure.text)).toMatch(/re-measure the affected features at no cost to you/);
    expect(noEffect.subject).toBe('TRK-001 and your job J-2620: no effect on your results is likely');
    expect(flat(noEffect.text)).toMatch(/9\.5 µm against your tolerance of 100\.0 µm; up to 25\.0 µm would be a quarter of it/);
    expect(flat(noEffect.text)).toMatch(/Our engineer Tamsin Vell will ring you this week to go through the figures\./);
    await page.getByText(/^works@quarrington-rail\.test: sent \d/).waitFor();
    const kept = await rig.db.query(`SELECT triage->>'suggestion' AS s, triage->>'ratio' AS ratio FROM impact_review_items WHERE review_id = $1 ORDER BY 1`, [
      review.id,
    ]);
    expect(kept).toEqual([
      { s: 'no_effect_likely', ratio: '4' },
      { s: 'remeasure_advised', ratio: '4' },
    ]);
    await context.close();
  }, 120_000);

  it('records a job with an A + B·L tolerance at its distance from the job form, and one with none', async () => {
    const { context, page } = await signedIn(rig, 'manager@demo.test', 'Shop floor today');
    const addJob = async (reference: string, tolerance?: () => Promise<void>) => {
      await page.goto(`${rig.baseUrl}/jobs`);
      await page.getByRole('button', { name: 'New job' }).click();
      await page.getByLabel('Reference').fill(reference);
      await page.getByLabel('Customer name').fill('Ostby Press Tools');
      await page.getByLabel('First day on site').fill('2027-03-01');
      await page.getByLabel('Last day on site').fill('2027-03-02');
      await tolerance?.();
      await page.getByRole('button', { name: 'Add job' }).click();
    };
    const stored = (reference: string) =>
      eventually(async () => (await rig.db.query(`SELECT tightest_tolerance AS t FROM jobs WHERE reference = $1`, [reference]))[0]);
    await addJob('J-BT-NONE');
    await stored('J-BT-NONE').toEqual({ t: null });
    await addJob('J-BT-RANGE', async () => {
      await page.getByLabel('Tolerance', { exact: true }).selectOption('range');
      await page.getByLabel('A (µm)').fill('20');
      await page.getByLabel('B (µm/m)').fill('6');
      await page.getByLabel('Which feature').fill('casing flange profile');
      await page.getByRole('button', { name: 'Add job' }).click();
      await page.getByText('Say how far from the tracker the job measured (m).').waitFor();
      await page.getByLabel('Distance from the tracker (m)').fill('4.5');
    });
    await stored('J-BT-RANGE').toEqual({ t: { tolerance: { kind: 'range', aUm: 20, bUmPerM: 6 }, distanceM: 4.5, note: 'casing flange profile' } });
    await context.close();
  }, 120_000);
});
