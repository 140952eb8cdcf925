/**
 * Values for the API fuzz test, derived from the JSON Schemas that
 * `GET /api/openapi.json` publishes (zod → JSON Schema). `sample` builds a
 * plausible valid value; `breakages` lists the bad values to try at one spot.
 * Deterministic: the same document always gives the same requests.
 */
export type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  format?: string;
  pattern?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  default?: unknown;
  additionalProperties?: JsonSchema | boolean;
  contentMediaType?: string;
};

/** Ids a field may name: records of the signed-in firm, of another firm, and of nobody. */
export type IdPool = { own: (field: string) => string | undefined; otherFirm: (field: string) => string | undefined; unknown: string };

const DATE_SHAPE = '^\\d{4}-\\d{2}-\\d{2}$';
export const isDateSchema = (s: JsonSchema) => s.format === 'date' || s.pattern === DATE_SHAPE;
const isUuidSchema = (s: JsonSchema) => s.format === 'uuid';
const isMonthSchema = (s: JsonSchema) => s.format === 'month' || s.pattern === '^\\d{4}-\\d{2}$';

/** The schema's own alternatives collapsed to the first non-null one. */
export function concrete(s: JsonSchema): JsonSchema {
  const options = s.anyOf ?? s.oneOf;
  if (options) return concrete(options.find((o) => o.type !== 'null') ?? options[0]);
  if (s.allOf?.length) return concrete(Object.assign({}, ...s.allOf));
  return s;
}

const typeOf = (s: JsonSchema) => (Array.isArray(s.type) ? s.type.find((t) => t !== 'null') : s.type);

/** A plausible valid value for `s`; `field` names the property (ids are looked up by it). */
export function sample(s: JsonSchema, field: string, ids: IdPool): unknown {
  const c = concrete(s);
  if (c.const !== undefined) return c.const;
  if (c.enum) return c.enum[0];
  if (c.default !== undefined && typeOf(c) !== 'object') return c.default;
  switch (typeOf(c)) {
    case 'object': {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(c.properties ?? {})) out[k] = sample(v, k, ids);
      return out;
    }
    case 'array': {
      const n = Math.max(1, c.minItems ?? 0);
      return Array.from({ length: n }, () => sample(c.items ?? {}, singular(field), ids));
    }
    case 'integer':
    case 'number': {
      const lo = c.minimum ?? (c.exclusiveMinimum !== undefined ? c.exclusiveMinimum + 1 : 1);
      const hi = c.maximum ?? (c.exclusiveMaximum !== undefined ? c.exclusiveMaximum - 1 : lo + 100);
      return Math.max(lo, Math.min(hi, lo + Math.min(10, Math.ceil((hi - lo) / 10))));
    }
    case 'boolean':
      return false;
    case 'string':
      return sampleString(c, field, ids);
    default:
      return 'fuzz';
  }
}

const singular = (field: string) => field.replace(/Ids$/, 'Id').replace(/s$/, '');

// Days from today: dates of things done lie behind, bookings and trips ahead.
const PAST_FIELDS = /^(performedOn|performedAt|occurredAt|receivedOn|lastCalibratedOn)$/;
const dayFromToday = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** Each sampled text carries a serial `z<n>z` so records made from one sample do not clash with the next. */
let serial = 0;
const tagged = (base: string) => `${base}z${++serial}z`;
/** A copy of `value` whose serials are new: the same request again, without clashing on unique names. */
export const fresh = <T>(value: T): T => JSON.parse(JSON.stringify(value).replace(/z\d+z/g, () => `z${++serial}z`));

function sampleString(s: JsonSchema, field: string, ids: IdPool): string {
  if (isUuidSchema(s)) return ids.own(field) ?? ids.unknown;
  if (isDateSchema(s)) return dayFromToday(PAST_FIELDS.test(field) ? -20 : 60);
  if (s.format === 'date-time') return `${dayFromToday(PAST_FIELDS.test(field) ? -20 : 60)}T09:30:00Z`;
  if (s.format === 'email' || /email/i.test(field)) return `${tagged('fuzz.')}@example.test`;
  if (s.pattern === '^pm_[A-Za-z0-9_]+$') return 'pm_card_visa';
  if (isMonthSchema(s)) return dayFromToday(-40).slice(0, 7);
  if (field === 'password' || field === 'newPassword') return 'a-long-enough-passphrase-7';
  if (field === 'timeZone') return 'Europe/Berlin';
  const base = tagged(/assetTag|reference|rfidTag/.test(field) ? 'FZ-' : 'fuzz value ');
  const min = s.minLength ?? 0;
  const text = base.length >= min ? base : base.padEnd(min, 'x');
  return s.maxLength !== undefined ? text.slice(-s.maxLength) : text;
}

/** A bad value for one spot; `raw` is written into the JSON text as is. `names` marks an id of a record
 * that is not the caller's (unknown, or another firm's): once the valid request passes, this must be a 404. */
export type Breakage = ({ label: string; value: unknown } | { label: string; raw: string }) & { names?: 'missing record' };

const NUL_TEXT = 'bad\u0000text';
const LONE_HIGH = 'bad\ud800text';
const LONE_LOW = '\udfffbad';

/** Bad values to put where `s` sits. Kept short: a few per kind of field. */
export function breakages(s: JsonSchema, field: string, ids: IdPool): Breakage[] {
  const c = concrete(s);
  const t = typeOf(c);
  const out: Breakage[] = [{ label: 'null', value: null }];
  if (t === 'string') {
    out.push({ label: 'NUL', value: NUL_TEXT }, { label: 'lone high surrogate', value: LONE_HIGH }, { label: 'lone low surrogate', value: LONE_LOW });
    out.push({ label: 'oversize string', value: 'x'.repeat(300_000) }, { label: 'number for text', value: 12 }, { label: 'object for text', value: { a: 1 } });
    if (isDateSchema(c))
      for (const d of ['2026-02-30', '2026-13-01', '0000-01-01', '2026-02-29', '2026-00-10', '9999-12-31', '2026-2-3'])
        out.push({ label: `date ${d}`, value: d });
    if (c.format === 'date-time')
      out.push(
        { label: 'datetime Feb 30', value: '2026-02-30T10:00:00Z' },
        { label: 'datetime year 0', value: '0000-01-01T00:00:00Z' },
        { label: 'datetime far', value: '+275760-09-13T00:00:00Z' },
      );
    if (isUuidSchema(c)) {
      out.push(
        { label: 'unknown id', value: ids.unknown, names: 'missing record' },
        { label: 'not a uuid', value: 'not-a-uuid' },
        { label: 'nil uuid', value: '00000000-0000-0000-0000-000000000000', names: 'missing record' },
      );
      const foreign = ids.otherFirm(field);
      if (foreign) out.push({ label: "other firm's id", value: foreign, names: 'missing record' });
    }
    if (c.enum) out.push({ label: 'enum with NUL', value: `${String(c.enum[0])}\u0000` });
  } else if (t === 'number' || t === 'integer') {
    out.push(
      { label: 'huge number', value: 1e308 },
      { label: 'negative huge', value: -1e308 },
      { label: 'past 2^53', value: 2 ** 53 + 2 },
      { label: 'fraction', value: 0.5 },
      { label: 'negative', value: -1 },
    );
    out.push({ label: 'numeric string', value: '12' }, { label: 'overflowing literal', raw: '1e400' });
  } else if (t === 'boolean') {
    out.push({ label: 'string for boolean', value: 'true' }, { label: 'number for boolean', value: 1 });
  } else if (t === 'array') {
    const item = sample(c.items ?? {}, singular(field), ids);
    out.push({ label: 'huge array', value: Array.from({ length: 20_000 }, () => item) }, { label: 'array of nulls', value: [null, null] });
    out.push({ label: 'string for array', value: 'a,b' }, { label: 'nested arrays', value: [[[[item]]]] });
    if (isUuidSchema(concrete(c.items ?? {}))) {
      out.push({ label: 'unknown ids', value: [ids.unknown], names: 'missing record' });
      const foreign = ids.otherFirm(singular(field));
      if (foreign) out.push({ label: "other firm's ids", value: [foreign], names: 'missing record' });
    }
  } else if (t === 'object') {
    out.push(
      { label: 'array for object', value: [] },
      { label: 'NUL key', value: { 'bad\u0000key': 1 } },
      { label: 'surrogate key', value: { '\ud800': 'x' } },
      { label: 'string for object', value: 'x' },
    );
  } else {
    out.push({ label: 'NUL', value: NUL_TEXT }, { label: 'object', value: { '\u0000': [1e308] } });
  }
  return out;
}

/** Every property path of an object schema down to its leaves (at most `depth` deep). */
export function leafPaths(s: JsonSchema, depth = 3, prefix: string[] = []): { path: string[]; schema: JsonSchema }[] {
  const c = concrete(s);
  const out: { path: string[]; schema: JsonSchema }[] = [];
  if (typeOf(c) === 'object' && c.properties && depth > 0) {
    for (const [k, v] of Object.entries(c.properties)) {
      out.push({ path: [...prefix, k], schema: v });
      const inner = concrete(v);
      if (typeOf(inner) === 'object') out.push(...leafPaths(inner, depth - 1, [...prefix, k]));
      if (typeOf(inner) === 'array' && inner.items && typeOf(concrete(inner.items)) === 'object')
        out.push(...leafPaths(inner.items, depth - 1, [...prefix, k, '0']));
    }
  }
  return out;
}

/** Whether the property at `path` may be left out. */
export function isOptional(s: JsonSchema, path: string[]): boolean {
  let at = concrete(s);
  for (const [i, key] of path.entries()) {
    if (/^\d+$/.test(key)) {
      at = concrete(at.items ?? {});
      continue;
    }
    if (i === path.length - 1) return !(at.required ?? []).includes(key);
    at = concrete(at.properties?.[key] ?? {});
  }
  return false;
}

/** `value` without the spot at `path` (a copy). */
export function without(value: unknown, path: string[]): unknown {
  const [head, ...rest] = path;
  if (!value || typeof value !== 'object' || !(head in value)) return value;
  const copy = (Array.isArray(value) ? [...value] : { ...value }) as Record<string, unknown>;
  if (rest.length) copy[head] = without(copy[head], rest);
  else delete copy[head];
  return copy;
}

/** `value` with the spot at `path` replaced (a copy). */
export function withAt(value: unknown, path: string[], replacement: unknown): unknown {
  if (!path.length) return replacement;
  const [head, ...rest] = path;
  const base = (value && typeof value === 'object' ? value : {}) as Record<string, unknown>;
  const copy: Record<string, unknown> | unknown[] = Array.isArray(base) ? [...base] : { ...base };
  (copy as Record<string, unknown>)[head] = withAt(base[head], rest, replacement);
  return copy;
}

/** JSON text of `body` with the `raw` breakage written verbatim at `path`. */
export function jsonWithRaw(body: unknown, path: string[], raw: string): string {
  const marker = '__FUZZ_RAW__';
  return JSON.stringify(withAt(body, path, marker)).replace(`"${marker}"`, raw);
}

/** Query-string values (already percent-encoded) that a query parameter should refuse. */
export function queryBreakages(s: JsonSchema, ids: IdPool, field: string): { label: string; encoded: string }[] {
  const c = concrete(s);
  const out = [
    { label: 'NUL', encoded: 'a%00b' },
    { label: 'lone surrogate (WTF-8 bytes)', encoded: '%ED%A0%80' },
    { label: 'invalid UTF-8', encoded: '%FF%FE' },
    { label: 'broken percent', encoded: '%E0%A4%A' },
    { label: 'long', encoded: 'x'.repeat(4000) },
    { label: 'empty', encoded: '' },
    { label: 'huge number', encoded: '1e400' },
    { label: 'negative', encoded: '-99999999999999999999' },
  ];
  if (isDateSchema(c)) for (const d of ['2026-02-30', '2026-13-01', '0000-01-01', '2026-02-29']) out.push({ label: `date ${d}`, encoded: d });
  if (isMonthSchema(c)) for (const m of ['2026-13', '2026-00', '0000-01']) out.push({ label: `month ${m}`, encoded: m });
  if (isUuidSchema(c)) {
    out.push({ label: 'unknown id', encoded: ids.unknown });
    const foreign = ids.otherFirm(field);
    if (foreign) out.push({ label: "other firm's id", encoded: foreign });
  }
  return out;
}
