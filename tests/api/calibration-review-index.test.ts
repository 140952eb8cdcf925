import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/**
 * The review reads the partial index `assets_calibration_due` since issue 21. Its answers must be what the review
 * answered before: the statements below are the earlier ones, kept here verbatim as the reference, run on the demo
 * firm plus the edge cases (undated, retired, due today, due on the window's last day, both ends of a timeline week).
 */
let t: TestApp;
let owner: string;
let manager: string;
let org: string;
const today = todayIn('Europe/Berlin');

const before = {
  counts: `SELECT count(*) FILTER (WHERE due_on IS NULL OR due_on < $2::date)::int AS overdue, count(*) FILTER (WHERE due_on >= $2::date)::int AS "dueSoon"
             FROM assets WHERE organization_id = $1 AND calibration_required AND status <> 'retired' AND coalesce(due_on, '-infinity'::date) <= $3::date`,
  timeline: `SELECT to_char(w, 'YYYY-MM-DD') AS "weekStart", count(a.id)::int AS count
             FROM generate_series(date_trunc('week', $2::date), date_trunc('week', $2::date) + interval '51 weeks', interval '1 week') AS w
             LEFT JOIN assets a ON a.organization_id = $1 AND a.calibration_required AND a.status <> 'retired'
                               AND a.due_on >= w::date AND a.due_on < (w + interval '1 week')::date
            GROUP BY w ORDER BY w`,
  dueTags: `SELECT a.asset_tag FROM assets a
        WHERE a.organization_id = $1 AND a.calibration_required AND a.status <> 'retired' AND coalesce(a.due_on, '-infinity'::date) <= $2::date
        ORDER BY a.due_on NULLS FIRST, a.asset_tag`,
};

let serial = 0;
async function item(dueOn: string | null, retire = false) {
  serial += 1;
  const res = await t.api
    .post('/api/assets')
    .set(bearer(manager))
    .send({
      type: 'smr',
      assetTag: `SMR-R${serial}`,
      serialNumber: `R${serial}`,
      specs: { diameterMm: 38.1 },
      calibration: { required: true, intervalMonths: 12 },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  // The due date is what the edge case needs, whatever the interval arithmetic gives.
  await t.db.query(`UPDATE assets SET due_on = $2 WHERE id = $1`, [res.body.id, dueOn]);
  if (retire) await t.db.query(`UPDATE assets SET status = 'retired' WHERE id = $1`, [res.body.id]);
}

beforeAll(async () => {
  t = await createTestApp();
  [owner, manager] = await Promise.all(['owner@demo.test', 'manager@demo.test'].map((e) => t.tokenFor(e)));
  [{ id: org }] = await t.db.query(`SELECT organization_id AS id FROM users WHERE email = 'owner@demo.test'`);
  const dueSoonDays = (await t.api.get('/api/settings').set(bearer(owner))).body.dueSoonDays as number;
  const monday = addDays(today, -((new Date(`${today}T00:00:00Z`).getUTCDay() + 6) % 7));
  for (const due of [null, addDays(today, -400), addDays(today, -1), today, addDays(today, dueSoonDays), addDays(today, dueSoonDays + 1)]) await item(due);
  for (const due of [monday, addDays(monday, 6), addDays(monday, 7), addDays(monday, 363), addDays(monday, 364), addDays(monday, -1)]) await item(due);
  await item(addDays(today, -3), true);
});
afterAll(() => t.close());

describe('the calibration review on its index answers as before', () => {
  it('lists, counts and draws the year as the earlier statements did', async () => {
    const review = (await t.api.get('/api/calibration/review').set(bearer(owner))).body;
    const windowEnd = addDays(review.today, review.dueSoonDays);
    const [counts] = await t.db.query(before.counts, [org, review.today, windowEnd]);
    expect(review.counts).toEqual(counts);
    expect(counts.overdue).toBeGreaterThan(0);
    expect(counts.dueSoon).toBeGreaterThan(0);
    expect(review.timeline).toEqual(await t.db.query(before.timeline, [org, review.today]));
    expect(review.timeline.reduce((sum: number, w: { count: number }) => sum + w.count, 0)).toBeGreaterThan(0);
    const tags = (await t.db.query(before.dueTags, [org, windowEnd])).map((r: { asset_tag: string }) => r.asset_tag);
    expect([...review.overdue, ...review.dueSoon].map((i: { assetTag: string }) => i.assetTag)).toEqual(tags.slice(0, review.listLimit));
    expect(tags).toContain('SMR-R1'); // undated: first, as overdue
    expect(tags).not.toContain(`SMR-R${serial}`); // retired
  });

  it('gives the CSV every item in the window, in the same order', async () => {
    const review = (await t.api.get('/api/calibration/review').set(bearer(owner))).body;
    const csv = (await t.api.get('/api/calibration/review.csv').set(bearer(owner))).text;
    const tags = (await t.db.query(before.dueTags, [org, addDays(review.today, review.dueSoonDays)])).map((r: { asset_tag: string }) => r.asset_tag);
    const csvTags = tags.filter((tag: string) => csv.includes(tag));
    expect(csvTags).toEqual(tags);
    const positions = tags.map((tag: string) => csv.indexOf(tag));
    expect(positions).toEqual([...positions].sort((a, b) => a - b));
  });
});
