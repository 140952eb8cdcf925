import { parse as parseCsv } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { importColumns, specColumns, specKeysInSchemas } from '../../server/fleet/asset-csv';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let manager: string;
let otherOwner: string;
beforeAll(async () => {
  t = await createTestApp();
  [manager, otherOwner] = await Promise.all(['manager@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)));
});
afterAll(() => t.close());

const importCsv = (token: string, csv: string, mode: 'preview' | 'commit') =>
  t.api.post(`/api/assets/import?mode=${mode}`).set(bearer(token)).set('Content-Type', 'text/csv').send(csv);

describe('CSV export and import (RFC 4180)', () => {
  it('has a column for every type-specific fact the schemas know', () => {
    expect(Object.keys(specColumns).sort()).toEqual(specKeysInSchemas().sort());
  });

  it('round-trips commas, double quotes and line breaks inside fields, read back by an independent parser', async () => {
    const notes = 'Seat "B" only, never the\r\nmagnetic nest; wipe with lint-free cloth';
    const created = await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({
        type: 'tip',
        assetTag: 'TIP-CSV1',
        serialNumber: 'SN,1"2',
        manufacturer: 'Thistlegate, "Works"',
        rfidTag: 'E2:C5:01',
        notes,
        location: '=SUM(A1)',
        calibration: { required: true, intervalMonths: 12, lastCalibratedOn: '2026-03-31' },
        specs: { lengthMm: 80.5, positions: ['vertical', 'horizontal'] },
      });
    expect(created.status).toBe(201);
    const res = await t.api.get('/api/assets/export.csv?q=TIP-CSV1').set(bearer(manager));
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    // RFC 4180 §2: fields with commas, quotes or line breaks are enclosed in double quotes; quotes doubled.
    expect(res.text).toContain('"Thistlegate, ""Works"""');
    expect(res.text).toContain('"SN,1""2"');
    const records = parseCsv(res.text, { columns: true }) as Record<string, string>[];
    expect(records).toHaveLength(1);
    expect(records[0]).toMatchObject({
      assetTag: 'TIP-CSV1',
      serialNumber: 'SN,1"2',
      manufacturer: 'Thistlegate, "Works"',
      notes,
      'spec.positions': 'vertical;horizontal',
      dueOn: '2027-03-31',
    });
    // A cell a spreadsheet would run as a formula is written as text.
    expect(records[0].location).toBe("'=SUM(A1)");

    // Import the export into another firm: every fact comes back the same.
    const imported = await importCsv(otherOwner, res.text, 'commit');
    expect(imported.status).toBe(200);
    expect(imported.body).toMatchObject({ valid: true, created: 1 });
    const copy = (await t.api.get('/api/assets?q=TIP-CSV1').set(bearer(otherOwner))).body.items[0];
    const original = created.body;
    for (const key of ['type', 'assetTag', 'serialNumber', 'manufacturer', 'rfidTag', 'notes', 'location', 'specs', 'calibration'])
      expect(copy[key], key).toEqual(original[key]);
  });

  it('previews a file without writing, then imports it in one go, creating kits by name', async () => {
    const csv = [
      importColumns.join(','),
      [
        'smr',
        'SMR-I01',
        'S-I01',
        'Carrow & Finch',
        'Retro 1.5',
        '',
        '',
        'Shelf A',
        '160000',
        '',
        'yes',
        '24',
        'Wrenhallow Gauge House',
        '2026-02-01',
        'Kit Import',
        '',
        '',
        '',
        '',
        '',
        '',
        '38.1',
      ].join(','),
      ['battery', 'BAT-I01', 'S-I02', '', '', '', '', '', '', '', 'no', '', '', '', 'Kit Import', '', '', '14.4', '6.8', '12', 'no'].join(','),
    ].join('\n');
    const before = (await t.api.get('/api/assets?limit=1').set(bearer(manager))).body.total;
    const preview = await importCsv(manager, csv, 'preview');
    expect(preview.body).toMatchObject({ mode: 'preview', rowCount: 2, valid: true, errors: [], created: 0 });
    expect(preview.body.preview.map((r: { assetTag: string }) => r.assetTag)).toEqual(['SMR-I01', 'BAT-I01']);
    expect((await t.api.get('/api/assets?limit=1').set(bearer(manager))).body.total).toBe(before);
    const commit = await importCsv(manager, csv, 'commit');
    expect(commit.body.created).toBe(2);
    const kit = (await t.api.get('/api/kits?limit=500').set(bearer(manager))).body.items.find((k: { name: string }) => k.name === 'Kit Import');
    expect(kit.memberCount).toBe(2);
    const smr = (await t.api.get('/api/assets/lookup?code=SMR-I01').set(bearer(manager))).body;
    expect(smr.calibration.dueOn).toBe('2028-02-01');
  });

  it('writes nothing when any row is wrong, and says which row and column', async () => {
    const csv = [
      'type,assetTag,serialNumber,spec.diameterMm,spec.lengthMm,spec.positions,calibrationRequired',
      'smr,SMR-B01,S1,38.1,,,no',
      'smr,SMR-B02,,thirty,,,no',
      'tip,TIP-B01,S3,,,sideways,maybe',
      'smr,SMR-B01,S4,38.1,,,no',
      'smr,TRK-001,S5,38.1,,,no',
    ].join('\r\n');
    const before = (await t.api.get('/api/assets?limit=1').set(bearer(manager))).body.total;
    const res = await importCsv(manager, csv, 'commit');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('import_invalid');
    const problems = res.body.error.details.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`);
    expect(problems).toEqual(
      expect.arrayContaining([
        '2:serialNumber',
        '2:spec.diameterMm',
        '3:calibrationRequired',
        '3:spec.lengthMm',
        '3:spec.positions',
        '4:assetTag',
        '5:assetTag',
      ]),
    );
    expect(problems).not.toContain('1:assetTag');
    expect((await t.api.get('/api/assets?limit=1').set(bearer(manager))).body.total).toBe(before);
  });

  it('refuses unknown columns, a missing header column, and a body that is not CSV', async () => {
    const res = await importCsv(manager, 'type,assetTag,colour\nsmr,SMR-Z,red', 'preview');
    expect(res.body.valid).toBe(false);
    expect(res.body.errors).toEqual(
      expect.arrayContaining([
        { row: 0, column: 'serialNumber', message: expect.stringMatching(/missing/) },
        { row: 0, column: 'colour', message: expect.stringMatching(/does not know/) },
      ]),
    );
    const json = await t.api.post('/api/assets/import').set(bearer(manager)).send({ rows: [] });
    expect(json.status).toBe(415);
    expect((await importCsv(await t.tokenFor('tech@demo.test'), 'type\n', 'preview')).status).toBe(403);
  });

  it('offers a template whose example rows import cleanly', async () => {
    const template = (await t.api.get('/api/assets/import/template.csv').set(bearer(manager))).text;
    const res = await importCsv(otherOwner, template, 'preview');
    expect(res.body).toMatchObject({ valid: true, rowCount: 2 });
  });
});
