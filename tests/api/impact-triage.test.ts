import { renderPdf } from '../../server/documents/pdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: string;
let manager: string;
let certificate: Buffer;

beforeAll(async () => {
  t = await createTestApp();
  [owner, manager] = await Promise.all(['owner@demo.test', 'manager@demo.test'].map((e) => t.tokenFor(e)));
  certificate = await renderPdf({ size: 'A4' }, (doc) => doc.text('Calibration certificate (test document)'));
});
afterAll(() => t.close());

let serial = 0;
async function tracker() {
  serial += 1;
  const res = await t.api
    .post('/api/assets')
    .set(bearer(manager))
    .send({
      type: 'tracker',
      assetTag: `TRK-T${serial}`,
      serialNumber: `TT${serial}`,
      calibration: { required: true, intervalMonths: 12, lastCalibratedOn: '2026-01-10' },
    });
  return res.body as { id: string; assetTag: string };
}
const calibrate = (assetId: string, performedOn: string, asFound: string, asFoundErrorUm?: string) => {
  const req = t.api.post(`/api/assets/${assetId}/calibrations`).set(bearer(manager));
  const fields = { performedOn, provider: 'Fenmoor Calibration Lab', certificateNumber: `FCL-${serial}-${performedOn}`, asFound, asLeft: 'in_tolerance' };
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  if (asFoundErrorUm !== undefined) req.field('asFoundErrorUm', asFoundErrorUm);
  return req.attach('certificate', certificate, { filename: 'certificate.pdf', contentType: 'application/pdf' });
};
type Tol = { tolerance: { kind: 'fixed'; um: number } | { kind: 'range'; aUm: number; bUmPerM: number }; distanceM?: number | null; note?: string } | null;
async function jobUsing(assetId: string, reference: string, tightestTolerance: Tol, contactEmail = `${reference.toLowerCase()}@customer.test`) {
  const job = await t.api
    .post('/api/jobs')
    .set(bearer(manager))
    .send({ reference, customerName: `Customer of ${reference}`, contactEmail, startsOn: '2026-03-01', endsOn: '2026-03-05', tightestTolerance });
  expect(job.status).toBe(201);
  // Past use written as the history a firm enters (as tests/api/calibration.test.ts does).
  const [{ id, organization_id }] = await t.db.query(
    `INSERT INTO bookings (organization_id, starts_on, ends_on, state, purpose, job_id, created_by)
     SELECT organization_id, '2026-03-01', '2026-03-05', 'returned', 'job', $1, id FROM users WHERE email = 'manager@demo.test' RETURNING id, organization_id`,
    [job.body.id],
  );
  await t.db.query(
    `INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active) VALUES ($1, $2, $3, '2026-03-01', '2026-03-05', false)`,
    [organization_id, id, assetId],
  );
  return { jobId: job.body.id as string, bookingId: id as string };
}
type Booking = { bookingId: string; jobReference: string; suggestion: { suggestion: string; toleranceUm: number | null; allowanceUm: number | null } };
const R = { x: 1000, y: 200, z: 50 };
/** Four readings `um` micrometres from the reference along different axes (the largest deviation is `um`). */
const readingsAt = (um: number) => [
  { x: R.x + um / 1000, y: R.y, z: R.z },
  { x: R.x - um / 1000, y: R.y, z: R.z },
  { x: R.x, y: R.y + um / 1000, z: R.z },
  { x: R.x, y: R.y, z: R.z + um / 1000 },
];
const newTip = async (tag: string) =>
  (
    await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({ type: 'tip', assetTag: tag, serialNumber: `S-${tag}`, rfidTag: `E2:${tag}`, specs: { lengthMm: 100, positions: ['vertical'] } })
  ).body as { id: string };
const validate = (tipId: string, um: number, performedAt: string) =>
  t.api
    .post('/api/checks')
    .set(bearer(manager))
    .send({ kind: 'tip_validation', assetId: tipId, position: 'vertical', reference: R, readings: readingsAt(um), performedAt });
const review = async (assetId: string) => (await t.api.get(`/api/assets/${assetId}/impact`).set(bearer(owner))).body;
const byRef = (r: { bookings: Booking[] }, ref: string) => r.bookings.find((b) => b.jobReference === ref)!;

describe("a job's tightest tolerance", () => {
  it('is optional, can be added afterwards, and an A + B·L tolerance needs its distance (400)', async () => {
    const base = { reference: 'J-TOL-1', customerName: 'Ostby Press Tools', startsOn: '2026-03-01', endsOn: '2026-03-02' };
    const created = await t.api.post('/api/jobs').set(bearer(manager)).send(base);
    expect(created.status).toBe(201);
    expect(created.body.tightestTolerance).toBeNull();
    const missing = await t.api
      .put(`/api/jobs/${created.body.id}`)
      .set(bearer(manager))
      .send({ ...base, tightestTolerance: { tolerance: { kind: 'range', aUm: 10, bUmPerM: 5 } } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.fields['tightestTolerance.distanceM']).toMatch(/A \+ B·L/);
    const later = { tolerance: { kind: 'range', aUm: 10, bUmPerM: 5 }, distanceM: 3.5, note: 'die face flatness' };
    const updated = await t.api
      .put(`/api/jobs/${created.body.id}`)
      .set(bearer(manager))
      .send({ ...base, tightestTolerance: later });
    expect(updated.status).toBe(200);
    expect((await t.api.get(`/api/jobs/${created.body.id}`).set(bearer(manager))).body.tightestTolerance).toEqual(later);
  });
});

describe('impact triage by each job tolerance', () => {
  it('suggests per booking at the 4:1 boundary, rounded to 0.1 µm half to even, and evaluates A + B·L at the job distance', async () => {
    const a = await tracker();
    await calibrate(a.id, '2026-02-01', 'in_tolerance');
    // As-found error 6.2 µm. Allowances, tolerance ÷ 4 rounded half to even (by hand, ASTM E29 rounding method):
    await jobUsing(a.id, 'J-B25', { tolerance: { kind: 'fixed', um: 25 }, note: 'bore position ±25 µm' }); // 6.25 → 6.2: equal, no effect
    await jobUsing(a.id, 'J-B246', { tolerance: { kind: 'fixed', um: 24.6 } }); // 6.15 → 6.2 (half to even): equal, no effect
    await jobUsing(a.id, 'J-B242', { tolerance: { kind: 'fixed', um: 24.2 } }); // 6.05 → 6.0: re-measure
    await jobUsing(a.id, 'J-R40', { tolerance: { kind: 'range', aUm: 4.8, bUmPerM: 5 }, distanceM: 4 }); // 4.8 + 5 × 4 = 24.8 → 6.2: no effect
    await jobUsing(a.id, 'J-R39', { tolerance: { kind: 'range', aUm: 4.8, bUmPerM: 5 }, distanceM: 3.9 }); // 24.3 → 6.075 → 6.1: re-measure
    await jobUsing(a.id, 'J-NONE', null);
    expect((await calibrate(a.id, '2026-06-15', 'out_of_tolerance', '6.2')).status).toBe(201);

    const r = await review(a.id);
    expect(r).toMatchObject({ asFound: { errorUm: 6.2, source: 'certificate' }, triageRatio: 4, remeasureCount: 2 });
    expect(byRef(r, 'J-B25').suggestion).toMatchObject({ suggestion: 'no_effect_likely', toleranceUm: 25, allowanceUm: 6.2 });
    expect(byRef(r, 'J-B246').suggestion).toMatchObject({ suggestion: 'no_effect_likely', toleranceUm: 24.6, allowanceUm: 6.2 });
    expect(byRef(r, 'J-B242').suggestion).toMatchObject({ suggestion: 'remeasure_advised', allowanceUm: 6 });
    expect(byRef(r, 'J-R40').suggestion).toMatchObject({ suggestion: 'no_effect_likely', toleranceUm: 24.8, allowanceUm: 6.2, distanceM: 4 });
    expect(byRef(r, 'J-R39').suggestion).toMatchObject({ suggestion: 'remeasure_advised', toleranceUm: 24.3, allowanceUm: 6.1, distanceM: 3.9 });
    expect(byRef(r, 'J-NONE').suggestion).toMatchObject({ suggestion: 'cannot_judge', toleranceUm: null });
  });

  it('follows the firm ratio setting', async () => {
    const a = await tracker();
    await calibrate(a.id, '2026-02-01', 'in_tolerance');
    await jobUsing(a.id, 'J-RATIO', { tolerance: { kind: 'fixed', um: 25 } });
    expect((await calibrate(a.id, '2026-06-15', 'out_of_tolerance', '3')).status).toBe(201);
    expect(byRef(await review(a.id), 'J-RATIO').suggestion.suggestion).toBe('no_effect_likely');
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ triageRatio: 0.5 })).status).toBe(400);
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ triageRatio: 10 })).body.triageRatio).toBe(10);
    try {
      expect(byRef(await review(a.id), 'J-RATIO').suggestion).toMatchObject({ suggestion: 'remeasure_advised', allowanceUm: 2.5, ratio: 10 });
    } finally {
      await t.api.patch('/api/settings').set(bearer(owner)).send({ triageRatio: 4 });
    }
  });

  it('cannot judge when the certificate records no as-found value', async () => {
    const a = await tracker();
    await calibrate(a.id, '2026-02-01', 'in_tolerance');
    await jobUsing(a.id, 'J-NOVAL', { tolerance: { kind: 'fixed', um: 25 } });
    expect((await calibrate(a.id, '2026-06-15', 'out_of_tolerance', '')).status).toBe(201);
    const r = await review(a.id);
    expect(r.asFound).toEqual({ errorUm: null, source: 'certificate' });
    expect(byRef(r, 'J-NOVAL').suggestion).toMatchObject({ suggestion: 'cannot_judge', asFoundErrorUm: null, toleranceUm: null });
  });

  it('keeps the numbers and rule with each accepted assessment, a person may change one, and notices differ by group', async () => {
    const a = await tracker();
    await calibrate(a.id, '2026-02-01', 'in_tolerance');
    await jobUsing(a.id, 'J-OK', { tolerance: { kind: 'fixed', um: 40 }, note: 'jig pickup ±40 µm' }, 'ok@customer.test');
    await jobUsing(a.id, 'J-RE', { tolerance: { kind: 'fixed', um: 20 }, note: 'bore position ±20 µm' }, 're@customer.test');
    const unsure = await jobUsing(a.id, 'J-UNK', null, 'unk@customer.test');
    await calibrate(a.id, '2026-06-15', 'out_of_tolerance', '8.4');
    const r = await review(a.id);

    const accepted = await t.api.post(`/api/impact-reviews/${r.id}/accept-suggestions`).set(bearer(owner));
    expect(accepted.status).toBe(200);
    expect(accepted.body.assessedCount).toBe(3);
    expect(byRef(accepted.body, 'J-OK')).toMatchObject({
      assessment: 'no_effect',
      triage: { suggestion: 'no_effect_likely', asFoundErrorUm: 8.4, allowanceUm: 10 },
    });
    expect(byRef(accepted.body, 'J-RE')).toMatchObject({ assessment: 'remeasure_offered', triage: { suggestion: 'remeasure_advised', allowanceUm: 5 } });
    expect(byRef(accepted.body, 'J-UNK')).toMatchObject({ assessment: 'customer_notified', triage: { suggestion: 'cannot_judge' } });
    const audit = await t.db.query(`SELECT details FROM audit_events WHERE action = 'impact_review.assessed' AND details->>'reviewId' = $1`, [r.id]);
    expect(audit.map((e: { details: { triage: { ratio: number } } }) => e.details.triage.ratio)).toEqual([4, 4, 4]);

    const changed = await t.api
      .put(`/api/impact-reviews/${r.id}/bookings/${unsure.bookingId}`)
      .set(bearer(owner))
      .send({ assessment: 'remeasure_offered', note: 'Customer asked for a re-measure' });
    expect(byRef(changed.body, 'J-UNK')).toMatchObject({ assessment: 'remeasure_offered', triage: { suggestion: 'cannot_judge' } });

    const drafts = (await t.api.post(`/api/impact-reviews/${r.id}/notices`).set(bearer(owner)).send({})).body.drafts as {
      to: string;
      group: string;
      subject: string;
      text: string;
    }[];
    const to = (addr: string) => drafts.find((d) => d.to === addr)!;
    expect(to('ok@customer.test')).toMatchObject({ group: 'no_effect', subject: expect.stringMatching(/no effect on your results is likely/) });
    expect(to('ok@customer.test').text).toMatch(/8\.4 µm against your tolerance of 40\.0 µm; up to 10\.0 µm would be a quarter of it/);
    expect(to('re@customer.test')).toMatchObject({ group: 'remeasure_offered', subject: expect.stringMatching(/we propose a re-measurement/) });
    expect(to('re@customer.test').text).toMatch(/re-measure the affected features at no cost/);
    expect(to('unk@customer.test').group).toBe('remeasure_offered');
  });

  it('weighs the failing check result when a field check opened the review', async () => {
    const tip = await newTip('TIP-TRI1');
    expect((await validate(tip.id, 20, '2026-02-01T09:00:00Z')).body.result.decision).toBe('pass');
    await jobUsing(tip.id, 'J-TIP', { tolerance: { kind: 'fixed', um: 280 }, note: 'hole pattern ±0.28 mm' });
    const failed = await validate(tip.id, 70, '2026-06-15T09:00:00Z'); // 70 µm against the firm's 60 µm for tips
    expect(failed.body.result).toMatchObject({ decision: 'fail', maxDeviationUm: 70 });
    const r = await review(tip.id);
    expect(r.asFound).toEqual({ errorUm: 70, source: 'check' });
    // 280 ÷ 4 = 70.0 µm: equal to the allowance (by hand).
    expect(byRef(r, 'J-TIP').suggestion).toMatchObject({ suggestion: 'no_effect_likely', errorSource: 'check', allowanceUm: 70 });
  });
});

describe('tip drift forecast', () => {
  it('forecasts a tip drifting toward its limit, lists it as failing soon, and holds nothing', async () => {
    const tip = await newTip('TIP-DRIFT1');
    const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString();
    for (const [n, um] of [
      [-60, 30],
      [-40, 38],
      [-20, 46],
      [-1, 54],
    ] as const)
      expect((await validate(tip.id, um, day(n))).body.result.decision).toBe('pass');
    const mine = (await t.api.get(`/api/assets/${tip.id}/tip-forecast`).set(bearer(manager))).body;
    expect(mine.items).toEqual([
      expect.objectContaining({ position: 'vertical', failsSoon: true, forecast: expect.objectContaining({ state: 'forecast', limitUm: 60 }) }),
    ]);
    const soon = (await t.api.get('/api/checks/forecasts').set(bearer(owner))).body;
    expect(soon.items.map((f: { assetTag: string }) => f.assetTag)).toContain('TIP-DRIFT1');
    expect((await t.api.get(`/api/assets/${tip.id}`).set(bearer(manager))).body.status).toBe('ready');

    // The technician leading the next job with this tip sees it in "Checks to do", as a forecast rather than a refusal.
    const tech = await t.tokenFor('tech@demo.test');
    const me = (await t.api.get('/api/auth/me').set(bearer(tech))).body.user;
    const job = await t.api
      .post('/api/jobs')
      .set(bearer(manager))
      .send({ reference: 'J-DRIFT', customerName: 'Ostby Press Tools', startsOn: day(1).slice(0, 10), endsOn: day(3).slice(0, 10), leadTechnicianId: me.id });
    const booked = await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [tip.id], jobId: job.body.id, startsOn: day(1).slice(0, 10), endsOn: day(3).slice(0, 10) });
    expect(booked.status).toBe(201);
    const todo = (await t.api.get('/api/checks/to-do').set(bearer(tech))).body.items;
    expect(todo.filter((c: { assetId: string }) => c.assetId === tip.id)).toEqual([
      expect.objectContaining({ reason: 'forecast', lastDecision: 'pass', forecastOn: mine.items[0].forecast.reachesOn }),
    ]);

    const short = await newTip('TIP-DRIFT2');
    for (const n of [-20, -10, -1]) await validate(short.id, 40, day(n));
    const few = (await t.api.get(`/api/assets/${short.id}/tip-forecast`).set(bearer(manager))).body;
    expect(few.items[0]).toMatchObject({ failsSoon: false, forecast: { state: 'not_enough_history', validations: 3 } });
  });
});
