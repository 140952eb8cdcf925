import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, binaryBody, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let manager: string;
let tech: string;
let billing: string;
let otherOwner: string;
const R = { x: 1000, y: 200, z: 50 };
/** Four readings `offsetUm` from the reference along different axes. */
const readingsAt = (offsetUm: number) => {
  const d = offsetUm / 1000;
  return [
    { x: R.x + d, y: R.y, z: R.z },
    { x: R.x - d, y: R.y, z: R.z },
    { x: R.x, y: R.y + d, z: R.z },
    { x: R.x, y: R.y, z: R.z + d },
  ];
};

beforeAll(async () => {
  t = await createTestApp();
  [manager, tech, billing, otherOwner] = await Promise.all(
    ['manager@demo.test', 'tech@demo.test', 'billing@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)),
  );
});
afterAll(() => t.close());

const newTip = async (tag: string, positions = ['vertical']) =>
  (
    await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({ type: 'tip', assetTag: tag, serialNumber: `S-${tag}`, rfidTag: `E2:${tag}`, specs: { lengthMm: 100, positions } })
  ).body;
const lookup = async (code: string) => (await t.api.get('/api/assets/lookup').query({ code }).set(bearer(manager))).body;
const validate = (token: string, tipId: string, position: string, offsetUm: number, extra: object = {}) =>
  t.api
    .post('/api/checks')
    .set(bearer(token))
    .send({ kind: 'tip_validation', assetId: tipId, position, reference: R, readings: readingsAt(offsetUm), ...extra });

describe('tip validation', () => {
  it('computes deviations, mean offset, spread and decides on the largest deviation against the tolerance', async () => {
    const tip = await newTip('TIP-C01');
    const res = await validate(tech, tip.id, 'vertical', 20);
    expect(res.status).toBe(201);
    expect(res.body.result).toMatchObject({
      deviationsUm: [20, 20, 20, 20],
      maxDeviationUm: 20,
      toleranceUm: 60,
      guardBandUm: 0,
      decisionRule: 'simple',
      decision: 'pass',
    });
    // Mean of (+d,0,0), (−d,0,0), (0,d,0), (0,0,d) is (0, d/4, d/4): |P̄ − R| = d·√2/4 = 7.1 µm for d = 20 µm.
    expect(res.body.result.meanOffsetUm).toBeCloseTo(7.1, 1);
    const status = (await t.api.get(`/api/assets/${tip.id}/tip-validation`).set(bearer(tech))).body;
    expect(status.positions).toEqual([expect.objectContaining({ position: 'vertical', state: 'validated' })]);
  });

  it('holds a tip that fails at once, e-mails the manager and owner, and says it is not validated', async () => {
    const tip = await newTip('TIP-C02');
    const res = await validate(tech, tip.id, 'vertical', 80);
    expect(res.body.result.decision).toBe('fail');
    expect((await t.api.get(`/api/assets/${tip.id}`).set(bearer(manager))).body.status).toBe('held');
    expect((await t.api.get(`/api/assets/${tip.id}/tip-validation`).set(bearer(tech))).body.positions[0].state).toBe('failed');
    const [mail] = await t.db.query(`SELECT recipients, subject FROM outbox_messages WHERE subject LIKE 'TIP-C02%'`);
    expect(mail.recipients.sort()).toEqual(['manager@demo.test', 'owner@demo.test']);
  });

  it('applies guarded acceptance with the expanded uncertainty from RSS components (ILAC-G8, GUM)', async () => {
    const owner = await t.tokenFor('owner@demo.test');
    await t.api.patch('/api/settings').set(bearer(owner)).send({ decisionRule: 'guarded' });
    const tip = await newTip('TIP-C03');
    // u = √(3² + 4²) = 5 µm, U = 10 µm; tolerance 60 µm → acceptance limit 50 µm; 55 µm is inside the guard band.
    const res = await validate(tech, tip.id, 'vertical', 55, { uncertaintyComponentsUm: [3, 4] });
    expect(res.body.result).toMatchObject({ expandedUncertaintyUm: 10, guardBandUm: 10, decisionRule: 'guarded', decision: 'fail' });
    await t.api.patch('/api/settings').set(bearer(owner)).send({ decisionRule: 'simple' });
  });

  it.each([
    ['fewer than 3 readings', { readings: readingsAt(5).slice(0, 2) }, ['readings']],
    ['a text coordinate', { readings: [...readingsAt(5).slice(0, 3), { x: 'NaN', y: 1, z: 1 }] }, ['readings.3.x']],
    ['a position the tip is not used in', { position: 'horizontal' }, ['position']],
    ['an unknown position', { position: 'diagonal' }, ['position']],
    ['a wrong kind', { kind: 'flatness' }, ['kind']],
    ['both U and its components', { uncertaintyUm: 4, uncertaintyComponentsUm: [1] }, ['uncertaintyUm']],
  ])('refuses %s with 400 naming the fields', async (_name, patch, fields) => {
    const tip = await lookup('TIP-C01');
    const res = await t.api
      .post('/api/checks')
      .set(bearer(tech))
      .send({ kind: 'tip_validation', assetId: tip.id, position: 'vertical', reference: R, readings: readingsAt(5), ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details.fields)).toEqual(fields);
  });

  it('refuses a tip validation on a tracker', async () => {
    const tracker = (await t.api.get('/api/assets?type=tracker&limit=1').set(bearer(manager))).body.items[0];
    const res = await validate(tech, tracker.id, 'vertical', 5);
    expect(res.status).toBe(400);
    expect(res.body.error.details.fields.assetId).toMatch(/laser tracker, not a probe tip/);
  });

  it('lets billing read checks but not record them', async () => {
    const tip = await lookup('TIP-C01');
    expect((await validate(billing, tip.id, 'vertical', 5)).status).toBe(403);
    expect((await t.api.get(`/api/checks?assetId=${tip.id}`).set(bearer(billing))).body.total).toBe(1);
  });
});

describe("the technician's checks to do", () => {
  it('lists tip positions in the kit they carry without a passing latest validation, until one passes', async () => {
    const mine = (await t.api.get('/api/bookings/mine').set(bearer(tech))).body;
    const booking = mine.now[0];
    const tip = booking.items.find((i: { type: string }) => i.type === 'tip');
    const before = (await t.api.get('/api/checks/to-do').set(bearer(tech))).body.items as { assetId: string; position: string }[];
    expect(before.filter((c) => c.assetId === tip.id)).toEqual([]);
    // 200 µm off in the horizontal position: a fail (the demo tolerance is 60 µm).
    expect((await validate(tech, tip.id, 'horizontal', 200)).body.result.decision).toBe('fail');
    const after = (await t.api.get('/api/checks/to-do').set(bearer(tech))).body.items;
    expect(after).toContainEqual(
      expect.objectContaining({ assetId: tip.id, assetTag: tip.assetTag, position: 'horizontal', lastDecision: 'fail', bookingId: booking.id }),
    );
    expect((await validate(tech, tip.id, 'horizontal', 10)).body.result.decision).toBe('pass');
    expect((await t.api.get('/api/checks/to-do').set(bearer(tech))).body.items.filter((c: { assetId: string }) => c.assetId === tip.id)).toEqual([]);
    // Another firm's technician-to-be sees none of it.
    expect((await t.api.get('/api/checks/to-do').set(bearer(otherOwner))).body.items).toEqual([]);
  });
});

describe('two-face and length checks', () => {
  it('needs the distance for a range-dependent tolerance, then judges the two-face error against A + B·L', async () => {
    const tracker = (await t.api.get('/api/assets?type=tracker&limit=1').set(bearer(manager))).body.items[0];
    const body = { kind: 'two_face', assetId: tracker.id, front: { x: 5000, y: 0, z: 0 }, back: { x: 5000.03, y: 0, z: 0.04 } };
    const missing = await t.api.post('/api/checks').set(bearer(tech)).send(body);
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.fields.distanceM).toMatch(/needed/);
    // Error 50 µm (3-4-5); default tolerance 20 µm + 8 µm/m × 5 m = 60 µm.
    const res = await t.api
      .post('/api/checks')
      .set(bearer(tech))
      .send({ ...body, distanceM: 5 });
    expect(res.body.result).toMatchObject({ errorUm: 50, toleranceUm: 60, decision: 'pass' });
  });

  it('passes a result equal to its limit: 27.3 µm against 15 µm + 6 µm/m × 2.05 m (ILAC-G8:09/2019 simple acceptance)', async () => {
    const owner = await t.tokenFor('owner@demo.test');
    await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({ tolerances: { two_face: { kind: 'range', aUm: 15, bUmPerM: 6 } } });
    const tracker = (await t.api.post('/api/assets').set(bearer(manager)).send({ type: 'tracker', assetTag: 'TRK-LIM1', serialNumber: 'S-LIM1' })).body;
    const faces = (dzMm: number) => ({
      kind: 'two_face',
      assetId: tracker.id,
      front: { x: 3000, y: 10, z: 0 },
      back: { x: 3000, y: 10, z: dzMm },
      distanceM: 2.05,
    });
    try {
      const onTheLimit = await t.api.post('/api/checks').set(bearer(tech)).send(faces(0.0273));
      expect(onTheLimit.status).toBe(201);
      expect(onTheLimit.body.result).toMatchObject({ errorUm: 27.3, toleranceUm: 27.3, decision: 'pass' });
      // 27.35 µm rounds half to even to 27.4 µm: over the limit.
      const over = await t.api.post('/api/checks').set(bearer(tech)).send(faces(0.02735));
      expect(over.body.result).toMatchObject({ errorUm: 27.4, toleranceUm: 27.3, decision: 'fail' });
    } finally {
      await t.api
        .patch('/api/settings')
        .set(bearer(owner))
        .send({ tolerances: { two_face: { kind: 'range', aUm: 20, bUmPerM: 8 } } });
    }
  });

  it('computes the scale bar length at temperature from its certified length and expansion coefficient', async () => {
    const tracker = (await t.api.get('/api/assets?type=tracker&limit=1&offset=1').set(bearer(manager))).body.items[0];
    const bar = (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({ type: 'scale_bar', assetTag: 'BAR-C1', serialNumber: 'SB-C1', specs: { certifiedLengthMm: 1000, expansionPpmPerK: 11.5 } })
    ).body;
    // Steel-like bar at 25 °C should read 1000.0575 mm; reading 1000.100 mm → error +42.5 µm.
    const res = await t.api
      .post('/api/checks')
      .set(bearer(tech))
      .send({
        kind: 'length_check',
        assetId: tracker.id,
        scaleBarId: bar.id,
        endA: { x: 0, y: 0, z: 0 },
        endB: { x: 1000.1, y: 0, z: 0 },
        temperatureC: 25,
        distanceM: 4,
      });
    expect(res.status).toBe(201);
    expect(res.body.result.expectedMm).toBeCloseTo(1000.0575, 6);
    expect(res.body.result.errorUm).toBeCloseTo(42.5, 1);
    expect(res.body.result).toMatchObject({ toleranceUm: 52, decision: 'pass' });
    const notABar = await t.api
      .post('/api/checks')
      .set(bearer(tech))
      .send({
        kind: 'length_check',
        assetId: tracker.id,
        scaleBarId: tracker.id,
        endA: { x: 0, y: 0, z: 0 },
        endB: { x: 1, y: 0, z: 0 },
        temperatureC: 20,
        distanceM: 4,
      });
    expect(notABar.body.error.details.fields.scaleBarId).toMatch(/not a scale bar/);
  });
});

async function jpeg() {
  return sharp({ create: { width: 640, height: 480, channels: 3, background: '#88775f' } })
    .jpeg()
    .toBuffer();
}

describe('incidents, holds and release', () => {
  it('reports a dropped tip with photos: held at once, thumbnail made, manager and owner e-mailed', async () => {
    const tip = await newTip('TIP-D01', ['vertical', 'horizontal']);
    const res = await t.api
      .post('/api/incidents')
      .set(bearer(tech))
      .field('assetId', tip.id)
      .field('kind', 'dropped')
      .field('description', 'Fell onto the concrete floor from the probe stand.')
      .field('occurredAt', '2026-11-30T14:05:00Z')
      .field('location', 'Hangar 3, customer site')
      .attach('photos', await jpeg(), { filename: 'floor.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: 'reported', kind: 'dropped', asset: { status: 'held' } });
    expect(res.body.photos).toHaveLength(1);
    const photo = await t.api.get(res.body.photos[0].thumbnailUrl).set(bearer(manager)).buffer(true);
    expect(photo.headers['content-type']).toBe('image/jpeg');
    expect((await sharp(photo.body).metadata()).width).toBe(320);
    const [mail] = await t.db.query(`SELECT recipients FROM outbox_messages WHERE subject LIKE 'TIP-D01 reported dropped%'`);
    expect(mail.recipients.sort()).toEqual(['manager@demo.test', 'owner@demo.test']);
    expect((await t.api.get(res.body.photos[0].url).set(bearer(otherOwner))).status).toBe(404);
    expect((await t.api.get(`/api/incidents/${res.body.id}`).set(bearer(otherOwner))).status).toBe(404);
  });

  it('gives a real HEIC photo a JPEG thumbnail, decoded by libheif', async () => {
    const tip = await newTip('TIP-D04');
    // tests/fixtures/synthetic-photo.heic: a 480 × 360 synthetic gradient with a blue disc in the middle,
    // encoded by Debian's heif-enc (libheif with x265), so no camera and no real photo is involved.
    const heic = fs.readFileSync(path.resolve('tests/fixtures/synthetic-photo.heic'));
    const res = await t.api
      .post('/api/incidents')
      .set(bearer(tech))
      .field('assetId', tip.id)
      .field('kind', 'impact')
      .field('description', 'Knocked on the stand')
      .field('occurredAt', '2026-11-30T10:00:00Z')
      .attach('photos', heic, { filename: 'IMG_0002.HEIC', contentType: 'image/heic' });
    expect(res.status).toBe(201);
    expect(res.body.photos[0].thumbnailUrl).toBeTruthy();
    const thumb = await t.api.get(res.body.photos[0].thumbnailUrl).set(bearer(manager)).buffer(true).parse(binaryBody);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    // Read back by sharp's own JPEG decoder: 320 wide (4:3 kept), and the middle is the blue disc.
    const { data, info } = await sharp(thumb.body as Buffer)
      .raw()
      .toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([320, 240]);
    const centre = (120 * info.width + 160) * info.channels;
    expect(data[centre + 2]).toBeGreaterThan(180);
  });

  it('keeps a file that only looks like HEIC, without a thumbnail', async () => {
    const tip = await newTip('TIP-D03');
    // ISO base media 'ftyp' box with the 'heic' brand (ISO/IEC 23008-12).
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic'), Buffer.from([0, 0, 0, 0]), Buffer.from('mif1heic'), Buffer.alloc(64)]);
    const res = await t.api
      .post('/api/incidents')
      .set(bearer(tech))
      .field('assetId', tip.id)
      .field('kind', 'impact')
      .field('description', 'Knocked on the stand')
      .field('occurredAt', '2026-11-30T10:00:00Z')
      .attach('photos', heic, { filename: 'IMG_0001.HEIC', contentType: 'image/heic' });
    expect(res.status).toBe(201);
    expect(res.body.photos[0]).toMatchObject({ contentType: 'image/heic', thumbnailUrl: null });
    expect((await t.api.get(res.body.photos[0].url).set(bearer(manager))).headers['content-type']).toBe('image/heic');
  });

  it('refuses a photo that is too large (413) or not a JPEG, PNG or HEIC (415), and writes nothing', async () => {
    const tip = await newTip('TIP-D02');
    const base = () =>
      t.api
        .post('/api/incidents')
        .set(bearer(tech))
        .field('assetId', tip.id)
        .field('kind', 'impact')
        .field('description', 'Knocked against the fixture')
        .field('occurredAt', '2026-11-30T10:00:00Z');
    const big = await base().attach('photos', Buffer.alloc(11 * 1024 * 1024, 1), { filename: 'big.jpg', contentType: 'image/jpeg' });
    expect(big.status).toBe(413);
    const fake = await base().attach('photos', Buffer.from('%PDF-1.4 not a photo'), { filename: 'photo.jpg', contentType: 'image/jpeg' });
    expect(fake.status).toBe(415);
    expect((await t.api.get(`/api/assets/${tip.id}`).set(bearer(manager))).body.status).toBe('ready');
    const missing = await t.api.post('/api/incidents').set(bearer(tech)).field('assetId', tip.id).field('kind', 'exploded');
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.details.fields).sort()).toEqual(['description', 'kind', 'occurredAt']);
  });

  it('releases only on evidence recorded after the hold began: every position of a tip must pass again', async () => {
    const tip = await lookup('TIP-D01');
    const early = await t.api.post(`/api/assets/${tip.id}/release`).set(bearer(manager)).send({});
    expect(early.status).toBe(422);
    expect(early.body.error.code).toBe('release_needs_evidence');
    expect(early.body.error.details.missing).toEqual([
      'no passing vertical tip validation since the hold began',
      'no passing horizontal tip validation since the hold began',
    ]);
    await validate(manager, tip.id, 'vertical', 10);
    const half = await t.api.post(`/api/assets/${tip.id}/release`).set(bearer(manager)).send({});
    expect(half.body.error.details.missing).toEqual(['no passing horizontal tip validation since the hold began']);
    await validate(manager, tip.id, 'horizontal', 12);
    expect((await t.api.post(`/api/assets/${tip.id}/release`).set(bearer(tech)).send({})).status).toBe(403);
    const ok = await t.api.post(`/api/assets/${tip.id}/release`).set(bearer(manager)).send({ note: 'Both positions re-validated' });
    expect(ok.status).toBe(200);
    expect(ok.body.releaseEvidence.evidence).toHaveLength(2);
    expect((await t.api.get(`/api/assets/${tip.id}`).set(bearer(manager))).body.status).toBe('ready');
    const history = (await t.api.get(`/api/assets/${tip.id}/history`).set(bearer(manager))).body.items.map((i: { action: string }) => i.action);
    expect(history).toEqual(expect.arrayContaining(['held', 'released']));
    expect(history).not.toContain('asset.held'); // the custody event says it once
    expect((await t.api.post(`/api/assets/${tip.id}/release`).set(bearer(manager)).send({})).body.error.code).toBe('not_held');
  });

  it('flags a dropped battery as damaged (not to fly) and moves the incident through review to resolved', async () => {
    const battery = (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({ type: 'battery', assetTag: 'BAT-D1', serialNumber: 'BD1', specs: { nominalVoltageV: 14.4, ratedCapacityAh: 6.8 } })
    ).body;
    const incident = (
      await t.api
        .post('/api/incidents')
        .set(bearer(tech))
        .field('assetId', battery.id)
        .field('kind', 'dropped')
        .field('description', 'Slipped out of the case')
        .field('occurredAt', '2026-11-29T09:00:00Z')
    ).body;
    expect((await t.api.get(`/api/assets/${battery.id}`).set(bearer(manager))).body.specs.damaged).toBe(true);
    const [mail] = await t.db.query(`SELECT text_body FROM outbox_messages WHERE subject LIKE 'BAT-D1%'`);
    expect(mail.text_body).toMatch(/do not ship it by air/);
    expect((await t.api.patch(`/api/incidents/${incident.id}`).set(bearer(tech)).send({ state: 'reviewing' })).status).toBe(403);
    const noWords = await t.api.patch(`/api/incidents/${incident.id}`).set(bearer(manager)).send({ state: 'resolved' });
    expect(noWords.status).toBe(400);
    await t.api.patch(`/api/incidents/${incident.id}`).set(bearer(manager)).send({ state: 'reviewing' });
    const done = await t.api
      .patch(`/api/incidents/${incident.id}`)
      .set(bearer(manager))
      .send({ state: 'resolved', resolution: 'Battery scrapped through the recycler', chargeAmountMinor: 38000 });
    expect(done.body).toMatchObject({ state: 'resolved', chargeAmountMinor: 38000 });
    expect((await t.api.patch(`/api/incidents/${incident.id}`).set(bearer(manager)).send({ state: 'reviewing' })).body.error.code).toBe('incident_resolved');
  });
});
