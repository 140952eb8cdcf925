import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FieldCopyView } from '../../shared/field/views';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let tech: string;
let otherOwner: string;
let copy: FieldCopyView;
const R = { x: 1000, y: 200, z: 50 };
/** Four readings `offsetUm` from the reference along different axes (the largest deviation is `offsetUm`). */
const readingsAt = (offsetUm: number) => {
  const d = offsetUm / 1000;
  return [
    { x: R.x + d, y: R.y, z: R.z },
    { x: R.x - d, y: R.y, z: R.z },
    { x: R.x, y: R.y + d, z: R.z },
    { x: R.x, y: R.y, z: R.z + d },
  ];
};
const count = async (table: string) => Number((await t.db.query(`SELECT count(*)::int AS n FROM ${table}`))[0].n);

beforeAll(async () => {
  t = await createTestApp();
  [tech, otherOwner] = await Promise.all(['tech@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)));
  copy = (await t.api.get('/api/field/copy').set(bearer(tech))).body;
});
afterAll(() => t.close());

const usableTip = () => copy.items.find((i) => i.type === 'tip' && i.status === 'out' && ((i.specs.positions as string[]) ?? []).length > 0)!;

describe('the field copy', () => {
  it('holds the kit the technician carries now and next with every item, its tags, status and due date, and the check rules', async () => {
    expect(copy.bookings.now.length).toBeGreaterThan(0);
    expect(copy.bookings.next.length).toBeGreaterThan(0);
    const itemIds = new Set(copy.items.map((i) => i.id));
    for (const b of [...copy.bookings.now, ...copy.bookings.next]) for (const id of b.assetIds) expect(itemIds.has(id)).toBe(true);
    const tip = usableTip();
    expect(tip.rfidTag).toBeTruthy();
    expect(tip).toHaveProperty('calibration.dueOn');
    expect(copy.checkRules.decisionRule).toBe('simple');
    expect(copy.checkRules.tolerances.tip_validation).toBeTruthy();
    expect(copy.tipValidations.every((v) => itemIds.has(v.assetId))).toBe(true);
    expect(Date.parse(copy.madeAt)).not.toBeNaN();
  });

  it('is for people who record checks: the billing clerk is refused', async () => {
    const billing = await t.tokenFor('billing@demo.test');
    expect((await t.api.get('/api/field/copy').set(bearer(billing))).status).toBe(403);
  });
});

describe('field records sent again', () => {
  it('a check sent twice with its phone-made id is stored once; the resend answers the stored check (200)', async () => {
    const tip = usableTip();
    const id = randomUUID();
    const performedAt = new Date(Date.now() - 3 * 3600_000).toISOString();
    const body = {
      id,
      kind: 'tip_validation',
      assetId: tip.id,
      position: (tip.specs.positions as string[])[0],
      reference: R,
      readings: readingsAt(10),
      performedAt,
    };
    const before = await count('field_checks');
    const first = await t.api.post('/api/checks').set(bearer(tech)).send(body);
    expect(first.status).toBe(201);
    expect(first.body.id).toBe(id);
    // The time the work was done stays apart from the time it arrived.
    expect(first.body.performedAt).toBe(performedAt);
    expect(Date.parse(first.body.recordedAt)).toBeGreaterThan(Date.parse(performedAt));
    const again = await t.api.post('/api/checks').set(bearer(tech)).send(body);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(await count('field_checks')).toBe(before + 1);
  });

  it('two sends racing each other still make one check, one hold and one mail for a failure', async () => {
    const tip = copy.items.filter((i) => i.type === 'tip' && i.status === 'out')[1];
    const id = randomUUID();
    const body = { id, kind: 'tip_validation', assetId: tip.id, position: (tip.specs.positions as string[])[0], reference: R, readings: readingsAt(500) };
    const [checks, holds] = await Promise.all(['field_checks', 'holds'].map(count));
    const replies = await Promise.all([1, 2, 3].map(() => t.api.post('/api/checks').set(bearer(tech)).send(body)));
    expect(replies.map((r) => r.status).sort()).toEqual([200, 200, 201]);
    expect(new Set(replies.map((r) => r.body.result.decision))).toEqual(new Set(['fail']));
    expect(await count('field_checks')).toBe(checks + 1);
    expect(await count('holds')).toBe(holds + 1);
    const onHoldMails = await t.db.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE subject = $1`, [
      `${tip.assetTag} is on hold: tip validation failed`,
    ]);
    expect(onHoldMails[0].n).toBe(1);
    expect((await t.api.get(`/api/assets/${tip.id}`).set(bearer(tech))).body.status).toBe('held');
  });

  it('a damage report with a photo sent twice is stored once, photo included', async () => {
    const item = copy.items.find((i) => i.type === 'smr' && i.status === 'out')!;
    const id = randomUUID();
    const photo = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#6f7d8c' } })
      .jpeg()
      .toBuffer();
    const send = () =>
      t.api
        .post('/api/incidents')
        .set(bearer(tech))
        .field('id', id)
        .field('assetId', item.id)
        .field('kind', 'dropped')
        .field('description', 'Rolled off the nest onto the hull plate.')
        .field('occurredAt', '2026-12-01T09:30:00Z')
        .attach('photos', photo, { filename: 'hull.jpg', contentType: 'image/jpeg' });
    const [incidents, photos] = await Promise.all(['incidents', 'incident_photos'].map(count));
    const first = await send();
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ id, occurredAt: '2026-12-01T09:30:00.000Z' });
    const again = await send();
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(id);
    expect(again.body.photos).toHaveLength(1);
    expect(await count('incidents')).toBe(incidents + 1);
    expect(await count('incident_photos')).toBe(photos + 1);
  });

  it("another firm cannot reach a record through its id: the same id there is refused, and the first firm's record is untouched", async () => {
    const tip = usableTip();
    const id = randomUUID();
    const body = { id, kind: 'tip_validation', assetId: tip.id, position: (tip.specs.positions as string[])[0], reference: R, readings: readingsAt(10) };
    expect((await t.api.post('/api/checks').set(bearer(tech)).send(body)).status).toBe(201);
    const theirs = await t.api.post('/api/assets').set(bearer(otherOwner)).send({ type: 'tracker', assetTag: 'TRK-X1', serialNumber: 'X1' });
    const res = await t.api
      .post('/api/checks')
      .set(bearer(otherOwner))
      .send({ id, kind: 'two_face', assetId: theirs.body.id, front: R, back: R, toleranceUm: 50 });
    expect(res.status).toBe(409);
    expect(JSON.stringify(res.body)).not.toContain(tip.id);
    expect((await t.api.get(`/api/checks/${id}`).set(bearer(tech))).body.kind).toBe('tip_validation');
  });

  it('a record id that is not a UUID is a 400 on the field', async () => {
    const tip = usableTip();
    const res = await t.api
      .post('/api/checks')
      .set(bearer(tech))
      .send({ id: 'phone-1', kind: 'tip_validation', assetId: tip.id, position: 'vertical', reference: R, readings: readingsAt(10) });
    expect(res.status).toBe(400);
    expect(res.body.error.details.fields.id).toBeTruthy();
  });
});
