import Papa from 'papaparse';
import { z } from 'zod';
import type { AssetView, ImportProblem } from '../../shared/assets/views';
import { restoreNeutralisedCell } from '../../shared/csv/formula-guard';
import { assetTypes, createAssetPayload, kitPayload, specsByType, type CreateAssetPayload } from '../../shared/schemas/assets';
import { toCsv } from '../documents/csv';

/**
 * The fleet's CSV file (RFC 4180, parsed and written by papaparse): one row
 * per asset, type-specific facts as `spec.<name>` columns. The export adds
 * read-only columns the import ignores. Export and import share these column
 * keys, so each key carries its unit (`lengthMm`, `replacementValueMinor`) and
 * cells stay as programs read them: ISO dates, plain numbers, codes.
 */
type SpecKind = 'number' | 'list' | 'boolean' | 'text';
export const specColumns: Record<string, SpecKind> = {
  lengthMm: 'number',
  positions: 'list',
  nominalVoltageV: 'number',
  ratedCapacityAh: 'number',
  chargeCycles: 'number',
  damaged: 'boolean',
  diameterMm: 'number',
  certifiedLengthMm: 'number',
  expansionPpmPerK: 'number',
  laserClass: 'text',
  maxRangeM: 'number',
  sizeMm: 'number',
  massKg: 'number',
};

export const importColumns = [
  'type',
  'assetTag',
  'serialNumber',
  'manufacturer',
  'model',
  'firmwareVersion',
  'rfidTag',
  'location',
  'replacementValueMinor',
  'notes',
  'calibrationRequired',
  'calibrationIntervalMonths',
  'calibrationProvider',
  'lastCalibratedOn',
  'kit',
  ...Object.keys(specColumns).map((k) => `spec.${k}`),
] as const;
const exportOnlyColumns = ['status', 'dueOn', 'calibrationState'] as const;
const requiredColumns = ['type', 'assetTag', 'serialNumber'];

export type ImportRow = { row: number; kit: string | null; payload: CreateAssetPayload };

export function assetsToCsv(assets: AssetView[]): string {
  const rows = assets.map((a) => {
    const specs = a.specs as Record<string, unknown>;
    const cells: Record<string, unknown> = {
      type: a.type,
      assetTag: a.assetTag,
      serialNumber: a.serialNumber,
      manufacturer: a.manufacturer,
      model: a.model,
      firmwareVersion: a.firmwareVersion,
      rfidTag: a.rfidTag,
      location: a.location,
      replacementValueMinor: a.replacementValueMinor,
      notes: a.notes,
      calibrationRequired: a.calibration.required ? 'yes' : 'no',
      calibrationIntervalMonths: a.calibration.intervalMonths,
      calibrationProvider: a.calibration.provider,
      lastCalibratedOn: a.calibration.lastCalibratedOn,
      kit: a.kit?.name ?? null,
      status: a.status,
      dueOn: a.calibration.dueOn,
      calibrationState: a.calibration.state,
    };
    for (const [key, kind] of Object.entries(specColumns)) {
      const v = specs[key];
      cells[`spec.${key}`] = v === undefined ? null : kind === 'list' ? (v as string[]).join(';') : kind === 'boolean' ? (v ? 'yes' : 'no') : v;
    }
    return [...importColumns, ...exportOnlyColumns].map((c) => cells[c] ?? '');
  });
  return toCsv([...importColumns, ...exportOnlyColumns], rows);
}

export const importTemplateCsv = () =>
  toCsv(importColumns, [
    [
      'tip',
      'TIP-101',
      'PT-55012',
      'Example Maker',
      'Tip 6 mm',
      '',
      'E2:00:01:5A',
      'Shelf B2',
      '18000',
      '',
      'yes',
      '12',
      'Example Lab',
      '2026-06-01',
      'Kit A',
      '120',
      'vertical;horizontal',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
    ],
    [
      'battery',
      'BAT-101',
      'BP-9921',
      'Example Maker',
      'Pack 14.4',
      '',
      '',
      'Shelf C1',
      '90000',
      '',
      'no',
      '',
      '',
      '',
      '',
      '',
      '',
      '14.4',
      '6.8',
      '120',
      'no',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
    ],
  ]);

const yes = new Set(['yes', 'true', '1', 'y']);
const no = new Set(['no', 'false', '0', 'n']);

/** Parse and check every row; nothing here touches the database. */
export function parseAssetCsv(text: string): { rows: ImportRow[]; errors: ImportProblem[]; rowCount: number } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy' });
  // A row that stops early just leaves its last cells empty; anything else is a broken file.
  const errors: ImportProblem[] = parsed.errors
    .filter((e) => e.code !== 'TooFewFields')
    .map((e) => ({ row: (e.row ?? -1) + 1, column: '', message: `The file is not valid CSV here: ${e.message}` }));
  const header = parsed.meta.fields ?? [];
  const known = new Set<string>([...importColumns, ...exportOnlyColumns]);
  for (const c of requiredColumns) if (!header.includes(c)) errors.push({ row: 0, column: c, message: 'This column is missing from the header row.' });
  for (const c of header) if (!known.has(c)) errors.push({ row: 0, column: c, message: 'Nestkeeper does not know this column; see the template.' });
  if (errors.some((e) => e.row === 0)) return { rows: [], errors, rowCount: parsed.data.length };

  const rows: ImportRow[] = [];
  parsed.data.forEach((raw, index) => {
    const row = index + 1;
    const cell = (c: string) => {
      const v = restoreNeutralisedCell((raw[c] ?? '').trim());
      return v === '' ? undefined : v;
    };
    const rowErrors: ImportProblem[] = [];
    const number = (c: string) => {
      const v = cell(c);
      if (v === undefined) return undefined;
      const n = Number(v.replace(',', '.'));
      if (Number.isNaN(n)) rowErrors.push({ row, column: c, message: `"${v}" is not a number` });
      return n;
    };
    const bool = (c: string) => {
      const v = cell(c)?.toLowerCase();
      if (v === undefined) return undefined;
      if (yes.has(v)) return true;
      if (no.has(v)) return false;
      rowErrors.push({ row, column: c, message: `"${v}" should be yes or no` });
      return undefined;
    };
    const specs: Record<string, unknown> = {};
    for (const [key, kind] of Object.entries(specColumns)) {
      const column = `spec.${key}`;
      if (cell(column) === undefined) continue;
      specs[key] =
        kind === 'number'
          ? number(column)
          : kind === 'boolean'
            ? bool(column)
            : kind === 'list'
              ? cell(column)!
                  .split(';')
                  .map((s) => s.trim())
                  .filter(Boolean)
              : cell(column);
    }
    const required = bool('calibrationRequired') ?? false;
    const candidate = {
      type: cell('type'),
      assetTag: cell('assetTag'),
      serialNumber: cell('serialNumber'),
      manufacturer: cell('manufacturer') ?? null,
      model: cell('model') ?? null,
      firmwareVersion: cell('firmwareVersion') ?? null,
      rfidTag: cell('rfidTag') ?? null,
      location: cell('location') ?? null,
      replacementValueMinor: number('replacementValueMinor') ?? null,
      notes: cell('notes') ?? null,
      calibration: {
        required,
        intervalMonths: number('calibrationIntervalMonths') ?? null,
        provider: cell('calibrationProvider') ?? null,
        lastCalibratedOn: cell('lastCalibratedOn') ?? null,
      },
      specs,
    };
    const result = createAssetPayload.safeParse(candidate);
    if (!result.success) for (const issue of result.error.issues) rowErrors.push({ row, column: columnFor(issue.path), message: issue.message });
    // The kit is made by name on import: the same rules as a kit made by hand.
    const kit = kitPayload.shape.name.optional().safeParse(cell('kit'));
    if (!kit.success) rowErrors.push({ row, column: 'kit', message: kit.error.issues[0].message });
    if (rowErrors.length) errors.push(...rowErrors);
    else rows.push({ row, kit: kit.data ?? null, payload: result.data! });
  });
  if (parsed.data.length === 0) errors.push({ row: 0, column: '', message: 'The file has a header row but no assets.' });
  return { rows, errors, rowCount: parsed.data.length };
}

function columnFor(path: PropertyKey[]): string {
  const [head, ...rest] = path.map(String);
  if (head === 'specs') return `spec.${rest[0] ?? ''}`;
  if (head === 'calibration')
    return (
      { required: 'calibrationRequired', intervalMonths: 'calibrationIntervalMonths', provider: 'calibrationProvider', lastCalibratedOn: 'lastCalibratedOn' }[
        rest[0]
      ] ?? 'calibrationRequired'
    );
  return head;
}

/** Every spec key the schemas know has a column (checked by a test). */
export const specKeysInSchemas = () => [...new Set(assetTypes.flatMap((t) => Object.keys((specsByType[t] as z.ZodObject).shape)))];
