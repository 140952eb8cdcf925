import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assetStatuses, type AssetStatus } from '../../shared/assets/vocabulary';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { Scoped } from '../../server/db/scoped';
import { renderPdf } from '../../server/documents/pdf';
import { assetMoves, moveAssets, noteCustody, seedAssets } from '../../server/fleet';
import { pdfText } from '../support/pdf';
import { bearer, binaryBody, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let manager: string;
let org: string;
let actor: { userId: string };
const today = todayIn('Europe/Berlin');

beforeAll(async () => {
  t = await createTestApp();
  manager = await t.tokenFor('manager@demo.test');
  const [row] = await t.db.query(`SELECT id, organization_id FROM users WHERE email = 'manager@demo.test'`);
  org = row.organization_id;
  actor = { userId: row.id };
});
afterAll(() => t.close());

const inTx = <T>(work: (tx: Scoped) => Promise<T>) => t.db.transaction((manager) => work(new Scoped(manager, org)));

let serial = 0;
/** A fresh accessory standing in `status`, with no custody or audit rows yet. */
async function itemIn(status: AssetStatus) {
  serial += 1;
  const assetTag = `CUS-${String(serial).padStart(3, '0')}`;
  const [id] = await inTx((tx) => seedAssets(tx, [{ type: 'accessory', assetTag, serialNumber: `CU${serial}`, status, location: 'Shelf C', specs: {} }]));
  return { id, assetTag };
}
const statusOf = async (id: string) => (await t.db.query(`SELECT status FROM assets WHERE id = $1`, [id]))[0].status;
/** Custody and audit rows of the item, with the transaction that wrote each (xmin). */
const custodyOf = (id: string) => t.db.query(`SELECT kind, note, location, xmin::text AS tx FROM custody_events WHERE asset_id = $1`, [id]);
const auditOf = (id: string) => t.db.query(`SELECT action, details, xmin::text AS tx FROM audit_events WHERE subject_type = 'asset' AND subject_id = $1`, [id]);

// The moves the product makes, written out from its flows (DESIGN.md §3 and the services that move items),
// not read from the module: checkout, return, holds and releases, incidents, failed checks, lab trips, retiring.
const expectedMoves: [AssetStatus, AssetStatus, string][] = [
  ['ready', 'out', 'checked_out'],
  ['ready', 'held', 'held'],
  ['ready', 'at_lab', 'sent_to_lab'],
  ['ready', 'retired', 'retired'],
  ['out', 'ready', 'returned'],
  ['out', 'held', 'held'],
  ['held', 'ready', 'released'],
  ['held', 'at_lab', 'sent_to_lab'],
  ['held', 'retired', 'retired'],
  ['at_lab', 'ready', 'back_from_lab'],
  ['at_lab', 'held', 'held'],
  ['at_lab', 'retired', 'retired'],
];
const refusedMoves = assetStatuses.flatMap((from) =>
  assetStatuses.filter((to) => !expectedMoves.some(([f, x]) => f === from && x === to)).map((to) => [from, to] as const),
);

describe('the custody table', () => {
  it('allows exactly the moves the product makes', () => {
    const written = Object.entries(assetMoves).flatMap(([from, tos]) => Object.entries(tos).map(([to, kind]) => [from, to, kind]));
    expect(written.sort()).toEqual([...expectedMoves].sort());
    expect(refusedMoves).toHaveLength(25 - expectedMoves.length);
  });

  it.each(expectedMoves)('moves %s → %s, writing one "%s" custody event and one audit line in the same transaction', async (from, to, kind) => {
    const item = await itemIn(from);
    await inTx((tx) => moveAssets(tx, actor, [item.id], to, { why: 'Test move', bookingId: null }));
    expect(await statusOf(item.id)).toBe(to);
    const custody = await custodyOf(item.id);
    const audit = await auditOf(item.id);
    expect(custody).toEqual([{ kind, note: 'Test move', location: 'Shelf C', tx: expect.any(String) }]);
    expect(audit).toEqual([{ action: `asset.${kind}`, details: { from, to, note: 'Test move' }, tx: custody[0].tx }]);
    const [{ tx: statusTx }] = await t.db.query(`SELECT xmin::text AS tx FROM assets WHERE id = $1`, [item.id]);
    expect(statusTx).toBe(custody[0].tx);
  });

  it.each(refusedMoves)('refuses %s → %s with a 422 naming the item and its states, and changes nothing', async (from, to) => {
    const item = await itemIn(from);
    const refusal = inTx((tx) => moveAssets(tx, actor, [item.id], to, { why: 'Test move' }));
    await expect(refusal).rejects.toMatchObject({
      status: 422,
      code: 'asset_move_refused',
      message: expect.stringMatching(new RegExp(`^${item.assetTag} is .+ and cannot be .+\\.$`)),
    });
    await expect(refusal).rejects.toMatchObject({ details: { refused: [{ assetId: item.id, from, to }] } });
    expect(await statusOf(item.id)).toBe(from);
    expect(await custodyOf(item.id)).toEqual([]);
    expect(await auditOf(item.id)).toEqual([]);
  });

  it('refuses the whole set when one item may not move, and moves none of them', async () => {
    const fine = await itemIn('ready');
    const retired = await itemIn('retired');
    const refusal = inTx((tx) => moveAssets(tx, actor, [fine.id, retired.id], 'held'));
    await expect(refusal).rejects.toMatchObject({ status: 422, message: `${retired.assetTag} is retired and cannot be put on hold.` });
    expect(await statusOf(fine.id)).toBe('ready');
    expect(await custodyOf(fine.id)).toEqual([]);
  });

  it("writes in the caller's transaction: when the caller's work fails afterwards, the move is undone too", async () => {
    const item = await itemIn('ready');
    const failing = inTx(async (tx) => {
      await moveAssets(tx, actor, [item.id], 'out', { bookingId: null });
      throw new Error('the rest of the checkout failed');
    });
    await expect(failing).rejects.toThrow('the rest of the checkout failed');
    expect(await statusOf(item.id)).toBe('ready');
    expect(await custodyOf(item.id)).toEqual([]);
    expect(await auditOf(item.id)).toEqual([]);
  });

  it('records an item that comes back while on hold without moving it, but will not let a note stand in for a move', async () => {
    const held = await itemIn('held');
    await inTx((tx) => noteCustody(tx, actor, [held.id], 'returned', { why: 'Came back in its case' }));
    expect(await statusOf(held.id)).toBe('held');
    expect((await custodyOf(held.id)).map((c: { kind: string }) => c.kind)).toEqual(['returned']);
    const out = await itemIn('out');
    await expect(inTx((tx) => noteCustody(tx, actor, [out.id], 'returned'))).rejects.toMatchObject({ status: 422, code: 'custody_note_refused' });
    expect(await statusOf(out.id)).toBe('out');
    expect(await custodyOf(out.id)).toEqual([]);
  });
});

describe('moves as people see them', () => {
  const accessory = async (tag: string) =>
    (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({ type: 'accessory', assetTag: tag, serialNumber: `S-${tag}`, location: 'Shop, bay 2' })
    ).body as { id: string; assetTag: string };
  const historyOf = async (id: string) =>
    (await t.api.get(`/api/assets/${id}/history`).set(bearer(manager))).body.items as {
      source: string;
      action: string;
      summary: string;
      details: Record<string, unknown>;
    }[];
  const recordOf = async (id: string) => (await t.api.get(`/api/assets/${id}/record`).set(bearer(manager))).body.items as { clause: string; value: string }[];

  it('shows checkout and a damaged return in the item history, the equipment record and its PDF', async () => {
    const a = await accessory('ACC-CUS1');
    const booking = (
      await t.api
        .post('/api/bookings')
        .set(bearer(manager))
        .send({ assetIds: [a.id], startsOn: today, endsOn: addDays(today, 2) })
    ).body;
    const line = (condition: string) => [{ assetId: a.id, present: true, condition }];
    expect(
      (
        await t.api
          .post(`/api/bookings/${booking.id}/checkout`)
          .set(bearer(manager))
          .send({ checklist: line('good'), counterpart: 'Tamsin Quillfeather' })
      ).status,
    ).toBe(200);

    const out = await historyOf(a.id);
    expect(out.find((i) => i.source === 'custody' && i.action === 'checked_out')?.details).toMatchObject({
      holder: 'Tamsin Quillfeather',
      bookingId: booking.id,
      note: 'good',
    });
    // Each event once, in words: the custody event says it; the audit line of the same move is not listed again.
    expect(out.find((i) => i.action === 'checked_out')?.summary).toBe('Handed out to Tamsin Quillfeather: good');
    expect(out.filter((i) => i.action.startsWith('asset.'))).toEqual([]);
    expect((await recordOf(a.id)).find((i) => i.clause === '6.4.13 d)')?.value).toContain('status: out');
    expect((await t.api.post(`/api/assets/${a.id}/retire`).set(bearer(manager)).send({ reason: 'Worn out' })).body.error).toMatchObject({
      code: 'asset_move_refused',
      message: `${a.assetTag} is out and cannot be retired.`,
    });

    expect(
      (
        await t.api
          .post(`/api/bookings/${booking.id}/return`)
          .set(bearer(manager))
          .send({ checklist: line('damaged'), counterpart: 'Tamsin Quillfeather' })
      ).status,
    ).toBe(200);
    const back = await historyOf(a.id);
    expect(
      back
        .filter((i) => i.source === 'custody')
        .map((i) => i.action)
        .sort(),
    ).toEqual(['checked_out', 'held', 'registered', 'returned']);
    expect(back.find((i) => i.action === 'held')?.summary).toMatch(/^Put on hold: /);
    expect(back.map((i) => i.summary).join(' | ')).not.toMatch(/\bheld\b|checked out|_/);
    expect((await recordOf(a.id)).find((i) => i.clause === '6.4.13 d)')?.value).toContain('status: on hold');
    const pdf = await t.api.get(`/api/assets/${a.id}/record.pdf`).set(bearer(manager)).buffer(true).parse(binaryBody);
    expect(pdfText(pdf.body as Buffer)).toContain('status: on hold');
    // The chain of custody in the PDF names each event in words, as the screen does.
    for (const words of ['Handed out', 'Returned', 'Put on hold']) expect(pdfText(pdf.body as Buffer)).toContain(words);
    expect(pdfText(pdf.body as Buffer)).not.toMatch(/checked out|checked_out|\bheld\b/);
  });

  it('keeps an item held when it comes back from the lab without the evidence that ends its hold', async () => {
    const trk = (
      await t.api
        .post('/api/assets')
        .set(bearer(manager))
        .send({
          type: 'tracker',
          assetTag: 'TRK-CUS1',
          serialNumber: 'TC-CUS1',
          calibration: { required: true, intervalMonths: 12, lastCalibratedOn: addDays(today, -300) },
        })
    ).body;
    await t.api.post(`/api/assets/${trk.id}/hold`).set(bearer(manager)).send({ summary: 'Knocked off its stand' });
    const trip = (
      await t.api
        .post('/api/lab-trips')
        .set(bearer(manager))
        .send({ provider: 'Fenmoor Calibration Lab', assetIds: [trk.id], sentOn: today })
    ).body;
    expect((await t.api.post(`/api/lab-trips/${trip.id}/send`).set(bearer(manager))).status).toBe(200);
    expect((await t.api.get(`/api/assets/${trk.id}`).set(bearer(manager))).body.status).toBe('at_lab');

    const certificate = await renderPdf({ size: 'A4' }, (doc) => doc.text('Calibration certificate FCL-CUS-1 (test document)'));
    const fields = {
      performedOn: today,
      provider: 'Fenmoor Calibration Lab',
      certificateNumber: 'FCL-CUS-1',
      asFound: 'out_of_tolerance',
      asLeft: 'out_of_tolerance',
    };
    const req = t.api.post(`/api/assets/${trk.id}/calibrations`).set(bearer(manager));
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    expect((await req.attach('certificate', certificate, { filename: 'certificate.pdf', contentType: 'application/pdf' })).status).toBe(201);

    expect((await t.api.get(`/api/assets/${trk.id}`).set(bearer(manager))).body.status).toBe('held');
    const custody = (await historyOf(trk.id)).filter((i) => i.source === 'custody').map((i) => i.action);
    expect(custody.sort()).toEqual(['back_from_lab', 'held', 'held', 'registered', 'sent_to_lab']);
    const booked = await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [trk.id], startsOn: addDays(today, 30), endsOn: addDays(today, 31) });
    expect(booked.body.error.details.blocked[0].reason).toBe('held');
  });
});
