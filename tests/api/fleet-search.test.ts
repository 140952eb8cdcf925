import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { searchKey } from '../../shared/assets/search-key';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/* Search that forgives what people type: separators, case, leading zeros, an RFID tag's tail; near misses offered. */

let t: TestApp;
let tech: string;
let tip: { id: string; assetTag: string; rfidTag: string };
beforeAll(async () => {
  t = await createTestApp();
  tech = await t.tokenFor('tech@demo.test');
  const found = (await t.api.get('/api/assets').query({ q: 'TIP-005' }).set(bearer(tech))).body.items;
  tip = found.find((a: { assetTag: string }) => a.assetTag === 'TIP-005');
  expect(tip?.rfidTag).toMatch(/^E2:80:11:/);
});
afterAll(() => t.close());

const tagsFor = async (q: string) =>
  ((await t.api.get('/api/assets').query({ q }).set(bearer(tech))).body.items as { assetTag: string }[]).map((a) => a.assetTag);
const lookup = (code: string) => t.api.get('/api/assets/lookup').query({ code }).set(bearer(tech));

describe('forgiving search', () => {
  it("the database's forgiving form agrees with the shared one (nk_search_key and searchKey)", async () => {
    const samples = ['TIP-005', 'tip 5', 'TIP5', 'tip-005', 'E2:80:11:45:104', 'e2801145104', 'NST-000', 'a00b007', 'SMR-010', ' 0 0 7 ', 'Ünïcode-09', 'x0'];
    const rows: { key: string }[] = await t.db.query(`SELECT nk_search_key(s) AS key FROM unnest($1::text[]) WITH ORDINALITY AS u(s, n) ORDER BY n`, [samples]);
    expect(rows.map((r) => r.key)).toEqual(samples.map(searchKey));
  });

  it('"tip 5", "TIP5" and "tip-005" find TIP-005 in the fleet list', async () => {
    for (const q of ['tip 5', 'TIP5', 'tip-005']) expect(await tagsFor(q), q).toContain('TIP-005');
    expect(await tagsFor('tip 5')).not.toContain('TIP-006');
  });

  it('an RFID tag matches without separators, in either case, and by its tail', async () => {
    const bare = tip.rfidTag.replace(/:/g, '');
    for (const q of [bare.toLowerCase(), bare.toUpperCase()]) expect(await tagsFor(q), q).toContain('TIP-005');
    expect((await lookup(bare.toLowerCase())).body.id).toBe(tip.id);
    expect((await lookup('tip 5')).body.id).toBe(tip.id);
    // The tail: the last two groups of the tag, without the colon, are this tip's alone in the demo fleet.
    const tail = tip.rfidTag.split(':').slice(-2).join('');
    expect((await lookup(tail)).body.id).toBe(tip.id);
  });

  it('offers near misses when nothing matches', async () => {
    const miss = await lookup('TIP-005X');
    expect(miss.status).toBe(404);
    expect(miss.body.error.details.suggestions.map((s: { assetTag: string }) => s.assetTag)).toContain('TIP-005');
    expect(miss.body.error.message).toMatch(/Did you mean .*TIP-005/);
    const near = await t.api.get('/api/assets/suggestions').query({ q: 'TIP-005-B' }).set(bearer(tech));
    expect(near.status).toBe(200);
    expect(near.body.items.map((s: { assetTag: string }) => s.assetTag)).toContain('TIP-005');
  });
});
