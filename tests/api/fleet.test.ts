import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeQrFromPdf, pdfText } from '../support/pdf';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let manager: string;
let tech: string;
let billing: string;
let otherOwner: string;
beforeAll(async () => {
  t = await createTestApp();
  [manager, tech, billing, otherOwner] = await Promise.all(
    ['manager@demo.test', 'tech@demo.test', 'billing@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)),
  );
});
afterAll(() => t.close());

const tip = (tag: string, rfid: string) => ({
  type: 'tip',
  assetTag: tag,
  serialNumber: `SN-${tag}`,
  manufacturer: 'Thistlegate Instruments',
  model: 'Stylus 6 mm',
  rfidTag: rfid,
  calibration: { required: true, intervalMonths: 12, lastCalibratedOn: '2026-01-31' },
  specs: { lengthMm: 150, positions: ['vertical'] },
});
const post = (token: string, body: unknown) =>
  t.api
    .post('/api/assets')
    .set(bearer(token))
    .send(body as object);

describe('registering assets', () => {
  it('creates a tip with its plan, computes the due date, and logs who did it', async () => {
    const res = await post(manager, tip('TIP-T01', 'E2:AA:01'));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ assetTag: 'TIP-T01', status: 'ready', rfidTag: 'E2:AA:01', specs: { lengthMm: 150, positions: ['vertical'] } });
    // 2026-01-31 + 12 months; the state depends on today, so only its form is checked here.
    expect(res.body.calibration).toMatchObject({ required: true, intervalMonths: 12, lastCalibratedOn: '2026-01-31', dueOn: '2027-01-31' });
    expect(['current', 'due_soon', 'overdue']).toContain(res.body.calibration.state);
    const history = await t.api.get(`/api/assets/${res.body.id}/history`).set(bearer(manager));
    // The registration once: its custody event (asset.created on the audit trail says the same and is not listed again).
    expect(history.body.items.map((i: { action: string }) => i.action)).toEqual(['registered']);
    expect(history.body.items[0]).toMatchObject({ actorName: 'Idris Penvale', summary: expect.stringMatching(/^Taken into the fleet/) });
  });

  it.each([
    ['a tip without length or positions', { ...tip('TIP-X1', 'E2:X1'), specs: {} }, ['specs.lengthMm', 'specs.positions']],
    [
      'a battery with a negative capacity',
      { type: 'battery', assetTag: 'BAT-X1', serialNumber: 'S1', specs: { nominalVoltageV: 14.4, ratedCapacityAh: -2 } },
      ['specs.ratedCapacityAh'],
    ],
    ['an SMR with a text diameter', { type: 'smr', assetTag: 'SMR-X1', serialNumber: 'S2', specs: { diameterMm: '1.5 inch' } }, ['specs.diameterMm']],
    [
      'a scale bar without its certified length',
      { type: 'scale_bar', assetTag: 'BAR-X1', serialNumber: 'S3', specs: { expansionPpmPerK: 0.5 } },
      ['specs.certifiedLengthMm'],
    ],
    [
      'an RFID tag on a battery',
      { type: 'battery', assetTag: 'BAT-X2', serialNumber: 'S4', rfidTag: 'E2:01', specs: { nominalVoltageV: 14.4, ratedCapacityAh: 6 } },
      ['rfidTag'],
    ],
    ['firmware on a nest', { type: 'nest', assetTag: 'NST-X1', serialNumber: 'S5', firmwareVersion: '1.0' }, ['firmwareVersion']],
    [
      'a plan without an interval',
      { type: 'tracker', assetTag: 'TRK-X1', serialNumber: 'S6', calibration: { required: true } },
      ['calibration.intervalMonths'],
    ],
    ['an unknown type and no serial', { type: 'laser', assetTag: 'X-1' }, ['type', 'serialNumber']],
    ['an unknown spec field', { type: 'smr', assetTag: 'SMR-X2', serialNumber: 'S7', specs: { diameterMm: 38.1, colour: 'red' } }, ['specs']],
  ])('refuses %s with 400 naming the fields', async (_name, body, fields) => {
    const res = await post(manager, body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details.fields).sort()).toEqual([...fields].sort());
  });

  it('refuses a duplicate asset tag or RFID tag with 409 naming the clash', async () => {
    const dupTag = await post(manager, tip('TIP-T01', 'E2:AA:99'));
    expect(dupTag.status).toBe(409);
    expect(dupTag.body.error.details.fields.assetTag).toMatch(/TIP-T01/);
    const dupRfid = await post(manager, tip('TIP-T02', 'E2:AA:01'));
    expect(dupRfid.status).toBe(409);
    expect(dupRfid.body.error.details.fields.rfidTag).toMatch(/TIP-T01/);
  });

  it('lets another firm use the same asset tag', async () => {
    expect((await t.api.post('/api/assets').set(bearer(otherOwner)).send(tip('TIP-T01', 'E2:AA:01'))).status).toBe(201);
  });

  it('lets technicians and billing read but not register or change', async () => {
    expect((await post(tech, tip('TIP-T03', 'E2:AA:03'))).status).toBe(403);
    expect((await post(billing, tip('TIP-T03', 'E2:AA:03'))).status).toBe(403);
    expect((await t.api.get('/api/assets').set(bearer(tech))).status).toBe(200);
    const one = (await t.api.get('/api/assets?q=TIP-T01').set(bearer(billing))).body.items[0];
    expect((await t.api.patch(`/api/assets/${one.id}`).set(bearer(billing)).send({ location: 'Van' })).status).toBe(403);
  });
});

describe('editing and retiring', () => {
  it('edits fields, recomputes the due date, re-checks specs and logs the change', async () => {
    const created = (await post(manager, tip('TIP-E01', 'E2:EE:01'))).body;
    const res = await t.api
      .patch(`/api/assets/${created.id}`)
      .set(bearer(manager))
      .send({ location: 'Van 2', calibration: { required: true, intervalMonths: 6, lastCalibratedOn: '2026-08-31' } });
    expect(res.status).toBe(200);
    expect(res.body.location).toBe('Van 2');
    expect(res.body.calibration.dueOn).toBe('2027-02-28'); // month-end clamp
    const bad = await t.api
      .patch(`/api/assets/${created.id}`)
      .set(bearer(manager))
      .send({ specs: { lengthMm: 0, positions: ['diagonal'] } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual(['specs.lengthMm', 'specs.positions.0']);
    expect((await t.api.patch(`/api/assets/${created.id}`).set(bearer(manager)).send({ type: 'battery' })).status).toBe(400);
    const history = (await t.api.get(`/api/assets/${created.id}/history`).set(bearer(manager))).body.items;
    const update = history.find((i: { action: string }) => i.action === 'asset.updated');
    expect(update.details.changes.location).toEqual({ from: null, to: 'Van 2' });
    expect(history.some((i: { action: string }) => i.action === 'moved')).toBe(true);
  });

  it('retires an asset (never deletes it), takes it out of its kit, and freezes its record', async () => {
    const a = (await post(manager, tip('TIP-R01', 'E2:RR:01'))).body;
    const kit = (
      await t.api
        .post('/api/kits')
        .set(bearer(manager))
        .send({ name: 'Retire test kit', memberIds: [a.id] })
    ).body;
    expect(kit.memberCount).toBe(1);
    expect((await t.api.post(`/api/assets/${a.id}/retire`).set(bearer(manager)).send({ reason: '' })).status).toBe(400);
    const retired = await t.api.post(`/api/assets/${a.id}/retire`).set(bearer(manager)).send({ reason: 'Stylus ball chipped beyond repair' });
    expect(retired.body).toMatchObject({ status: 'retired', retiredReason: 'Stylus ball chipped beyond repair', kit: null });
    expect((await t.api.get(`/api/kits/${kit.id}`).set(bearer(manager))).body.memberCount).toBe(0);
    const edit = await t.api.patch(`/api/assets/${a.id}`).set(bearer(manager)).send({ location: 'Bin' });
    expect(edit.status).toBe(422);
    expect(edit.body.error.code).toBe('asset_retired');
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).status).toBe(200);
    expect((await t.api.delete(`/api/assets/${a.id}`).set(bearer(manager))).status).toBe(404);
  });
});

describe('finding assets', () => {
  it('looks up by asset tag (any case), RFID tag, or the QR payload', async () => {
    const a = (await post(manager, tip('TIP-L01', 'E2:LL:01'))).body;
    for (const code of ['TIP-L01', 'tip-l01', 'E2:LL:01', 'e2:ll:01', a.qrPayload]) {
      const res = await t.api.get('/api/assets/lookup').query({ code }).set(bearer(tech));
      expect(res.status, code).toBe(200);
      expect(res.body.id).toBe(a.id);
    }
    const none = await t.api.get('/api/assets/lookup').query({ code: 'NOPE-1' }).set(bearer(tech));
    expect(none.status).toBe(404);
    expect(none.body.error.message).toMatch(/NOPE-1/);
    expect((await t.api.get('/api/assets/lookup').query({ code: 'TIP-L01' }).set(bearer(otherOwner))).status).toBe(404);
  });

  it('filters by type, status, calibration state and kit, searches, sorts and pages', async () => {
    const all = (await t.api.get('/api/assets?limit=500').set(bearer(manager))).body;
    expect(all.total).toBeGreaterThanOrEqual(80);
    const tips = (await t.api.get('/api/assets?type=tip&limit=500').set(bearer(manager))).body;
    expect(tips.items.every((a: { type: string }) => a.type === 'tip')).toBe(true);
    for (const state of ['overdue', 'due_soon', 'current', 'not_required']) {
      const res = (await t.api.get(`/api/assets?calibration=${state}&limit=500`).set(bearer(manager))).body;
      expect(res.total, state).toBeGreaterThan(0);
      expect(
        res.items.every((a: { calibration: { state: string } }) => a.calibration.state === state),
        state,
      ).toBe(true);
    }
    const both = (await t.api.get('/api/assets?calibration=overdue,due_soon&limit=1').set(bearer(manager))).body.total;
    const overdue = (await t.api.get('/api/assets?calibration=overdue&limit=1').set(bearer(manager))).body.total;
    const soon = (await t.api.get('/api/assets?calibration=due_soon&limit=1').set(bearer(manager))).body.total;
    expect(both).toBe(overdue + soon);
    const search = (await t.api.get('/api/assets?q=carrow').set(bearer(manager))).body;
    expect(search.total).toBeGreaterThan(0);
    expect(search.items.every((a: { manufacturer: string }) => a.manufacturer === 'Carrow & Finch')).toBe(true);
    expect((await t.api.get('/api/assets?q=100%25').set(bearer(manager))).body.total).toBe(0);
    const byDue = (await t.api.get('/api/assets?sort=dueOn&calibration=current,due_soon&limit=500').set(bearer(manager))).body.items.map(
      (a: { calibration: { dueOn: string } }) => a.calibration.dueOn,
    );
    expect(byDue).toEqual([...byDue].sort());
    const page2 = (await t.api.get('/api/assets?limit=10&offset=10').set(bearer(manager))).body;
    expect(page2.items[0].assetTag).toBe(all.items[10].assetTag);
    const loose = (await t.api.get('/api/assets?kitId=none&limit=500').set(bearer(manager))).body.items;
    expect(loose.every((a: { kit: unknown }) => a.kit === null)).toBe(true);
    const bad = await t.api.get('/api/assets?calibration=fine&sort=colour').set(bearer(manager));
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual(['calibration.0', 'sort']);
  });

  it("keeps another firm's assets out of every list and page", async () => {
    const mine = (await t.api.get('/api/assets?limit=1').set(bearer(manager))).body.items[0];
    expect((await t.api.get(`/api/assets/${mine.id}`).set(bearer(otherOwner))).status).toBe(404);
    expect((await t.api.get(`/api/assets/${mine.id}/label.pdf`).set(bearer(otherOwner))).status).toBe(404);
    expect((await t.api.patch(`/api/assets/${mine.id}`).set(bearer(otherOwner)).send({ location: 'x' })).status).toBe(404);
    const theirs = (await t.api.get('/api/assets?limit=500').set(bearer(otherOwner))).body.items;
    expect(theirs.map((a: { assetTag: string }) => a.assetTag)).toEqual(['TIP-T01']);
  });
});

describe('labels and records', () => {
  it('prints a label whose QR code (decoded by MuPDF + jsQR) looks up the same asset, with tag, serial and due date', async () => {
    const a = (await post(manager, tip('TIP-Q01', 'E2:QQ:01'))).body;
    const res = await t.api.get(`/api/assets/${a.id}/label.pdf`).set(bearer(tech)).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const payload = decodeQrFromPdf(res.body);
    expect(payload).toBe(a.qrPayload);
    expect((await t.api.get('/api/assets/lookup').query({ code: payload }).set(bearer(tech))).body.id).toBe(a.id);
    const text = pdfText(res.body);
    expect(text).toContain('TIP-Q01');
    expect(text).toContain('S/N SN-TIP-Q01');
    // The demo firm writes dates in en-GB: day, short month, year.
    expect(text).toContain('Calibration due 31 Jan 2027');
  });

  it("puts a kit's labels on one page, each QR code readable", async () => {
    const kit = (await t.api.get('/api/kits').set(bearer(manager))).body.items[0];
    const res = await t.api.get(`/api/kits/${kit.id}/labels.pdf`).set(bearer(manager)).buffer(true);
    const { pdfPageCount } = await import('../support/pdf');
    expect(pdfPageCount(res.body)).toBe(1);
    const mm = 72 / 25.4;
    const firstLabel = { x: 10 * mm, y: 18 * mm, w: (595.28 - 20 * mm) / 3, h: 36 * mm };
    const payload = decodeQrFromPdf(res.body, firstLabel);
    const first = (await t.api.get(`/api/kits/${kit.id}`).set(bearer(manager))).body.members[0];
    expect(payload).toBe(first.qrPayload);
  });

  it('gives every ISO/IEC 17025 §6.4.13 item a) to h) in the equipment record, also as PDF', async () => {
    const tracker = (await t.api.get('/api/assets?type=tracker&limit=1').set(bearer(manager))).body.items[0];
    const record = (await t.api.get(`/api/assets/${tracker.id}/record`).set(bearer(manager))).body;
    expect(record.items.map((i: { clause: string }) => i.clause)).toEqual(['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h'].map((l) => `6.4.13 ${l})`));
    expect(record.items[0].value).toContain(`firmware ${tracker.firmwareVersion}`);
    expect(record.items[1].value).toContain(tracker.serialNumber);
    const pdf = await t.api.get(`/api/assets/${tracker.id}/record.pdf`).set(bearer(manager)).buffer(true);
    expect(pdfText(pdf.body)).toContain('6.4.13 h)');
  });
});

describe('kits', () => {
  it('creates a kit, refuses an asset that is already in another kit (409 naming it), and reports readiness', async () => {
    const a = (await post(manager, { ...tip('TIP-K01', 'E2:KK:01'), calibration: { required: false } })).body;
    const b = (await post(manager, { type: 'case', assetTag: 'CASE-K01', serialNumber: 'CK1' })).body;
    const kit = await t.api
      .post('/api/kits')
      .set(bearer(manager))
      .send({ name: 'Kit Test One', memberIds: [a.id, b.id] });
    expect(kit.status).toBe(201);
    expect(kit.body).toMatchObject({ memberCount: 2, readiness: { ready: true, reasons: [] } });
    expect(kit.body.members.map((m: { assetTag: string }) => m.assetTag).sort()).toEqual(['CASE-K01', 'TIP-K01']);

    const clash = await t.api
      .post('/api/kits')
      .set(bearer(manager))
      .send({ name: 'Kit Test Two', memberIds: [a.id] });
    expect(clash.status).toBe(409);
    expect(clash.body.error.details.conflicts).toEqual([{ assetId: a.id, assetTag: 'TIP-K01', kitId: kit.body.id, kitName: 'Kit Test One' }]);
    expect((await t.api.post('/api/kits').set(bearer(manager)).send({ name: 'Kit Test One' })).status).toBe(409);

    await t.api
      .patch(`/api/assets/${a.id}`)
      .set(bearer(manager))
      .send({ calibration: { required: true, intervalMonths: 12, lastCalibratedOn: '2020-01-01' } });
    const after = (await t.api.get(`/api/kits/${kit.body.id}`).set(bearer(manager))).body;
    expect(after.readiness).toEqual({ ready: false, reasons: [{ assetId: a.id, assetTag: 'TIP-K01', reason: 'calibration_overdue' }] });

    const renamed = await t.api
      .patch(`/api/kits/${kit.body.id}`)
      .set(bearer(manager))
      .send({ name: 'Kit Test Renamed', memberIds: [b.id] });
    expect(renamed.body).toMatchObject({ name: 'Kit Test Renamed', memberCount: 1, readiness: { ready: true } });
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).body.kit).toBeNull();
    expect((await t.api.post('/api/kits').set(bearer(tech)).send({ name: 'Tech kit' })).status).toBe(403);
  });

  it("lists a kit's batteries with watt-hours and IATA class on the shipping sheet", async () => {
    const battery = (wh: [number, number], tag: string, damaged = false) =>
      post(manager, { type: 'battery', assetTag: tag, serialNumber: `S-${tag}`, specs: { nominalVoltageV: wh[0], ratedCapacityAh: wh[1], damaged } });
    const ids = [
      (await battery([14.4, 6.8], 'BAT-S1')).body.id,
      (await battery([14.4, 10.4], 'BAT-S2')).body.id,
      (await battery([14.4, 6.8], 'BAT-S3', true)).body.id,
      (await battery([10.8, 9.263], 'BAT-S4')).body.id,
    ];
    const kit = (await t.api.post('/api/kits').set(bearer(manager)).send({ name: 'Shipping kit', memberIds: ids })).body;
    const sheet = (await t.api.get(`/api/kits/${kit.id}/shipping-sheet`).set(bearer(tech))).body;
    // Wh = V × Ah (arithmetic): 97.92, 149.76, 97.92 and 100.0404 Wh; IATA DGR classes at 100 and 160 Wh.
    const lines = sheet.lines as { assetTag: string; wattHours: number; class: string }[];
    expect(lines.map((l) => [l.assetTag, l.class])).toEqual([
      ['BAT-S1', 'up_to_100_wh'],
      ['BAT-S2', 'over_100_to_160_wh'],
      ['BAT-S3', 'damaged_do_not_fly'],
      ['BAT-S4', 'over_100_to_160_wh'],
    ]);
    [97.92, 149.76, 97.92, 100.0404].forEach((wh, i) => expect(lines[i].wattHours).toBeCloseTo(wh, 9));
    expect(sheet.totalWattHours).toBeCloseTo(445.6404, 9);
    const pdf = pdfText((await t.api.get(`/api/kits/${kit.id}/shipping-sheet.pdf`).set(bearer(tech)).buffer(true)).body);
    expect(pdf).toContain('445.6 Wh');
    // Over 100 Wh, so never printed as "100.0 Wh".
    expect(pdf).toContain('100.04 Wh');
    expect(pdf).not.toContain('100.0 Wh');
    expect(pdf).toMatch(/do not ship them by air/);
  });
});

describe('settings', () => {
  it('lets the owner widen the due-soon window, which moves items from current to due soon', async () => {
    const owner = await t.tokenFor('owner@demo.test');
    const before = (await t.api.get('/api/assets?calibration=due_soon&limit=1').set(bearer(manager))).body.total;
    expect((await t.api.patch('/api/settings').set(bearer(manager)).send({ dueSoonDays: 90 })).status).toBe(403);
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ timeZone: 'Mars/Olympus' })).status).toBe(400);
    const res = await t.api.patch('/api/settings').set(bearer(owner)).send({ dueSoonDays: 120 });
    expect(res.body.dueSoonDays).toBe(120);
    expect((await t.api.get('/api/assets?calibration=due_soon&limit=1').set(bearer(manager))).body.total).toBeGreaterThan(before);
  });
});
