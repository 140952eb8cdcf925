import { writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { capabilitiesByRole, roles, type Capability, type Role } from '../../shared/auth/roles';
import {
  breakages,
  concrete,
  fresh,
  isOptional,
  jsonWithRaw,
  leafPaths,
  queryBreakages,
  sample,
  withAt,
  without,
  type Breakage,
  type IdPool,
  type JsonSchema,
} from '../support/fuzz-values';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Bad input gets a clear 4xx, never a 500 (API.md "Conventions"). Every
 * operation the OpenAPI document lists is sent malformed JSON, wrong types,
 * impossible dates, NUL and lone-surrogate text, oversize values, huge
 * arrays, unknown and other-firm ids — as the owner and as another role that
 * may use it — and every refusal must be the API's JSON error shape.
 */
type Operation = { method: string; path: string; access: string; body?: JsonSchema; bodyType?: string; query: { name: string; schema: JsonSchema }[] };
type Sent = { method: string; url: string; token?: string; body?: BodyInit; contentType?: string };
type Finding = { what: string; status: number; snippet: string };

const people: Record<Role, string> = { owner: 'owner@demo.test', manager: 'manager@demo.test', technician: 'tech@demo.test', billing: 'billing@demo.test' };
/** Which list a path segment or id field draws its records from. */
const listOfField: Record<string, string> = {
  assetId: 'assets',
  memberId: 'assets',
  probeId: 'assets',
  scaleBarId: 'assets',
  kitId: 'kits',
  jobId: 'jobs',
  rentalId: 'rentals',
  bookingId: 'bookings',
  customerId: 'customers',
  leadTechnicianId: 'users',
  incidentId: 'incidents',
  photoId: 'photos',
};
const lists = ['assets', 'kits', 'incidents', 'bookings', 'jobs', 'customers', 'rate-cards', 'rentals', 'invoices', 'lab-trips', 'impact-reviews', 'checks'];
const UNKNOWN_ID = '5f0c6a8e-2b7d-4c1e-9a3f-8d2e6b1c0a94';
// Routes that retire, hold (an incident holds its item), hand over or close the records the others need.
const ENDS_A_RECORD = /\/(retire|hold|release|cancel|close|send|return|checkout|invoice|credit-note|capture|notices|incidents)$/;

let t: TestApp;
let server: Server;
let base: string;
const tokens = {} as Record<Role | 'otherOwner', string>;
const own = new Map<string, string>();
const foreign = new Map<string, string>();
let operations: Operation[] = [];
let requests = 0;
const findings: Finding[] = [];
const answered: [string, number, string][] = [];

const idPool: IdPool = {
  own: (field) => own.get(listOfField[field] ?? field),
  otherFirm: (field) => foreign.get(listOfField[field] ?? field),
  unknown: UNKNOWN_ID,
};

async function send(s: Sent): Promise<{ status: number; type: string; text: string }> {
  requests++;
  const headers: Record<string, string> = {};
  if (s.token) headers.authorization = `Bearer ${s.token}`;
  if (s.contentType) headers['content-type'] = s.contentType;
  const res = await fetch(base + s.url, { method: s.method.toUpperCase(), headers, body: s.body });
  return { status: res.status, type: res.headers.get('content-type') ?? '', text: await res.text() };
}

/** Record a 5xx, HTML, a 4xx that is not `{error: {code, message}}`, or anything but 404 where `missing` says a record is not the caller's. */
async function probe(what: string, s: Sent, missing = false) {
  const res = await send(s);
  const snippet = res.text.slice(0, 200);
  if (process.env.FUZZ_REPORT) answered.push([what, res.status, snippet.slice(0, 120)]);
  // 502 is the payment provider not answering (no fake runs here): an outage, not bad input.
  if (res.status >= 500 && res.status !== 502) findings.push({ what, status: res.status, snippet });
  else if (res.type.includes('text/html')) findings.push({ what: `${what} (HTML)`, status: res.status, snippet });
  else if (res.status >= 400) {
    let shaped = false;
    try {
      const e = JSON.parse(res.text).error;
      shaped = typeof e?.code === 'string' && typeof e?.message === 'string';
    } catch {
      shaped = false;
    }
    if (!shaped || !res.type.includes('application/json')) findings.push({ what: `${what} (not the error shape)`, status: res.status, snippet });
  }
  if (missing && res.status !== 404) findings.push({ what: `${what} (should be 404: not the caller's record)`, status: res.status, snippet });
  return res;
}

function rolesFor(access: string): { role: Role | 'anonymous'; full: boolean }[] {
  if (access === 'public')
    return [
      { role: 'owner', full: true },
      { role: 'anonymous', full: false },
    ];
  if (access === 'signed-in')
    return [
      { role: 'owner', full: true },
      { role: 'technician', full: false },
    ];
  const other = roles.find((r) => r !== 'owner' && capabilitiesByRole[r].includes(access as Capability));
  return other
    ? [
        { role: 'owner', full: true },
        { role: other, full: false },
      ]
    : [{ role: 'owner', full: true }];
}

/** Path with its `{params}` filled: each param from its list, or the replacement for `which`. */
function fillPath(path: string, ids: Map<string, string>, replace?: { which: string; value: string }) {
  return path.replace(/\{(\w+)\}/g, (_m, name: string, offset: number) => {
    if (replace && (replace.which === name || replace.which === '*')) return replace.value;
    if (name === 'name') return 'deliver-outbox';
    const list = name === 'id' ? path.slice(0, offset).split('/').filter(Boolean).at(-1)! : listOfField[name];
    return ids.get(list) ?? UNKNOWN_ID;
  });
}

const isFile = (p: JsonSchema) => concrete(p).format === 'binary' || (!!p.items && concrete(p.items).format === 'binary');

function formOf(body: Record<string, unknown>, schema: JsonSchema, file: Blob | null): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(body)) {
    if (isFile(schema.properties?.[k] ?? {}) || v === undefined) continue;
    form.append(k, typeof v === 'string' ? v : JSON.stringify(v));
  }
  const fileField = Object.entries(schema.properties ?? {}).find(([, p]) => isFile(p));
  if (fileField && file) form.append(fileField[0], file, file.type === 'image/png' ? 'photo.png' : 'upload.pdf');
  return form;
}

const BODY_LEVEL: { label: string; raw: string; type?: string }[] = [
  { label: 'malformed JSON', raw: '{"a": ' },
  { label: 'array body', raw: '[]' },
  { label: 'string body', raw: '"text"' },
  { label: 'null body', raw: 'null' },
  { label: 'empty body', raw: '' },
  { label: 'deep nesting', raw: '['.repeat(5000) + ']'.repeat(5000) },
  { label: 'prototype keys', raw: '{"__proto__": {"admin": true}, "constructor": {"prototype": 1}}' },
  { label: 'JSON as text/plain', raw: '{}', type: 'text/plain' },
  { label: 'UTF-16 charset', raw: '{"a":1}', type: 'application/json; charset=utf-16le' },
  { label: 'unknown charset', raw: '{}', type: 'application/json; charset=klingon' },
  { label: 'body over 1 MB', raw: JSON.stringify({ x: 'y'.repeat(1_200_000) }) },
];

const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');
let PDF: Uint8Array<ArrayBuffer>;
const json = (value: unknown): Pick<Sent, 'body' | 'contentType'> => ({ body: JSON.stringify(value), contentType: 'application/json' });
const fieldsIn = (text: string): string[] => {
  try {
    return Object.keys(JSON.parse(text).error?.details?.fields ?? {});
  } catch {
    return [];
  }
};

/**
 * A body the route accepts, found by asking it: start from the schema's
 * sample, leave out optional fields the answer names (or, after a rule's
 * refusal, optional single ids), at most four tries. `passed` says whether
 * one was found; only then can a changed id be expected to give 404.
 */
async function acceptedBody(op: Operation, schema: JsonSchema, send1: (body: unknown, label: string) => Promise<{ status: number; text: string }>) {
  let body = sample(schema, '', idPool);
  for (let attempt = 1; attempt <= 4; attempt++) {
    const res = await send1(body, attempt === 1 ? 'valid body' : `valid body (try ${attempt})`);
    if (res.status < 300) return { body: fresh(body), passed: true };
    let drop = fieldsIn(res.text)
      .map((f) => f.split('.'))
      .filter((p) => isOptional(schema, p));
    if (!drop.length && res.status === 422)
      drop = Object.entries(concrete(schema).properties ?? {})
        .filter(([k, v]) => concrete(v).format === 'uuid' && isOptional(schema, [k]))
        .map(([k]) => [k]);
    const next = drop.reduce((b, p) => without(b, p), body);
    if (JSON.stringify(next) === JSON.stringify(body)) return { body: fresh(body), passed: false };
    body = fresh(next);
  }
  return { body: fresh(body), passed: false };
}

type Accepted = { passed: boolean; again: () => Pick<Sent, 'body' | 'contentType'> };

/** A changed id must be a 404 only where the route accepted the same request naming its own record there. */
const expects404 = (accepted: { passed: boolean; body: unknown }, path: string[], b: Breakage) =>
  accepted.passed && !!b.names && path.reduce<unknown>((at, key) => (at as Record<string, unknown> | undefined)?.[key], accepted.body) !== undefined;

async function fuzzWrite(op: Operation, token: string | undefined, full: boolean, who: string): Promise<Accepted> {
  const url = fillPath(op.path, own);
  const tag = (s: string) => `${op.method.toUpperCase()} ${op.path} as ${who}: ${s}`;
  const schema = op.body ?? { type: 'object', properties: {} };

  if (op.bodyType === 'multipart/form-data') {
    let file = new Blob([PDF], { type: 'application/pdf' });
    const form = (body: unknown, f: Blob | null = file) => formOf(body as Record<string, unknown>, schema, f);
    let accepted = await acceptedBody(op, schema, (body, label) => probe(tag(`${label}, PDF`), { method: op.method, url, token, body: form(body) }));
    if (!accepted.passed) {
      file = new Blob([PNG], { type: 'image/png' });
      accepted = await acceptedBody(op, schema, (body, label) => probe(tag(`${label}, PNG`), { method: op.method, url, token, body: form(body) }));
    }
    const junk = new Blob([Buffer.from([0, 0xff, 0xd8, 0x00, 0x01])], { type: 'application/pdf' });
    await probe(tag('junk file'), { method: op.method, url, token, body: form(fresh(accepted.body), junk) });
    await probe(tag('no file'), { method: op.method, url, token, body: form(fresh(accepted.body), null) });
    await probe(tag('truncated multipart'), {
      method: op.method,
      url,
      token,
      body: '--x\r\nContent-Disposition: form-data; name="a"\r\n\r\nb',
      contentType: 'multipart/form-data; boundary=x',
    });
    await probe(tag('multipart without boundary'), { method: op.method, url, token, body: 'abc', contentType: 'multipart/form-data' });
    for (const { path, schema: leaf } of leafPaths(schema, 1).filter((l) => !isFile(l.schema))) {
      for (const b of breakages(leaf, path.at(-1)!, idPool).slice(0, full ? undefined : 3)) {
        if ('raw' in b) continue;
        if (typeof b.value === 'string' && b.value.length > 100_000) continue; // the form's field size limit answers these
        await probe(
          tag(`${path.join('.')} = ${b.label}`),
          { method: op.method, url, token, body: form(withAt(fresh(accepted.body), path, b.value)) },
          expects404(accepted, path, b),
        );
      }
    }
    return { passed: accepted.passed, again: () => ({ body: form(fresh(accepted.body)) }) };
  }
  if (op.bodyType === 'text/csv') {
    const csv = (rows: string[]) => ['type,assetTag,serialNumber,notes,kit,lastCalibratedOn', ...rows].join('\r\n');
    const cases: [string, BodyInit, string][] = [
      ['valid CSV', csv([fresh('accessory,FZ-CSVz0z,S1,fine,,')]), 'text/csv'],
      ['NUL in a cell', csv(['accessory,FZ-CSV-2,S2,bad\u0000cell,,']), 'text/csv'],
      ['NUL in the kit cell', csv(['accessory,FZ-CSV-3,S3,,kit\u0000name,']), 'text/csv'],
      ['impossible date', csv(['accessory,FZ-CSV-4,S4,,,2026-02-30']), 'text/csv'],
      ['long kit name', csv([`accessory,FZ-CSV-5,S5,,${'k'.repeat(5000)},`]), 'text/csv'],
      ['lone surrogate (UTF-16)', Buffer.from(csv(['accessory,FZ-CSV-6,S6,bad\ud800,,']), 'utf16le'), 'text/csv; charset=utf-16le'],
      ['broken quotes', 'type,assetTag\r\n"tip,"x', 'text/csv'],
      ['empty', '', 'text/csv'],
      ['JSON instead', '{}', 'application/json'],
    ];
    for (const [label, body, type] of cases) {
      for (const mode of full ? ['preview', 'commit'] : ['preview'])
        await probe(tag(`${label} (${mode})`), { method: op.method, url: `${url}?mode=${mode}`, token, body, contentType: type });
    }
    return { passed: false, again: () => ({}) };
  }

  const accepted = await acceptedBody(op, schema, (body, label) => probe(tag(label), { method: op.method, url, token, ...(op.body ? json(body) : {}) }));
  for (const b of full ? BODY_LEVEL : BODY_LEVEL.slice(0, 3))
    await probe(tag(b.label), { method: op.method, url, token, body: b.raw, contentType: b.type ?? 'application/json' });
  const again = () => (op.body ? json(fresh(accepted.body)) : {});
  if (!op.body) return { passed: accepted.passed, again };
  for (const { path, schema: leaf } of leafPaths(schema)) {
    const all = breakages(leaf, path.at(-1)!, idPool);
    const picked: Breakage[] = full ? all : all.filter((_, i) => i % 4 === 1);
    for (const b of picked) {
      const valid = fresh(accepted.body);
      const body = 'raw' in b ? { body: jsonWithRaw(valid, path, b.raw), contentType: 'application/json' } : json(withAt(valid, path, b.value));
      await probe(tag(`${path.join('.')} = ${b.label}`), { method: op.method, url, token, ...body }, expects404(accepted, path, b));
    }
  }
  await probe(tag('unknown key with NUL'), { method: op.method, url, token, ...json({ ...(accepted.body as object), 'x\u0000': '\u0000' }) });
  return { passed: accepted.passed, again };
}

/** Path ids that name nothing of the caller's: 404 once the route accepted the same request with its own ids. */
async function fuzzPathIds(op: Operation, token: string | undefined, who: string, accepted: Accepted) {
  if (!op.path.includes('{')) return;
  const tag = (s: string) => `${op.method.toUpperCase()} ${op.path} as ${who}: ${s}`;
  for (const [label, value] of [
    ['unknown id', UNKNOWN_ID],
    ['not a uuid', 'abc'],
    ['NUL', 'a%00b'],
    ['invalid UTF-8', '%FF'],
    ['long', 'x'.repeat(3000)],
  ] as const) {
    await probe(
      tag(`every path id = ${label}`),
      { method: op.method, url: fillPath(op.path, own, { which: '*', value }), token, ...accepted.again() },
      accepted.passed && label !== 'invalid UTF-8',
    );
  }
  for (const name of [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).filter((n) => n === 'id' || n.endsWith('Id'))) {
    await probe(
      tag(`{${name}} of another firm`),
      { method: op.method, url: fillPath(op.path, own, { which: name, value: foreignFor(op.path, name) }), token, ...accepted.again() },
      accepted.passed,
    );
  }
}

function foreignFor(path: string, name: string) {
  const list =
    name === 'id'
      ? path
          .slice(0, path.indexOf(`{${name}}`))
          .split('/')
          .filter(Boolean)
          .at(-1)!
      : listOfField[name];
  return foreign.get(list) ?? UNKNOWN_ID;
}

async function fuzzRead(op: Operation, token: string | undefined, full: boolean, who: string) {
  const url = fillPath(op.path, own);
  const tag = (s: string) => `GET ${op.path} as ${who}: ${s}`;
  const validQuery = op.query.map((q) => `${q.name}=${encodeURIComponent(String(sample(q.schema, q.name, idPool)))}`);
  await probe(tag('valid query'), { method: 'GET', url: `${url}?${validQuery.join('&')}`, token });
  if (!full) return;
  for (const [i, q] of op.query.entries()) {
    const others = validQuery.filter((_, j) => j !== i);
    for (const b of queryBreakages(q.schema, idPool, q.name)) {
      await probe(tag(`${q.name} = ${b.label}`), { method: 'GET', url: `${url}?${[...others, `${q.name}=${b.encoded}`].join('&')}`, token });
    }
    await probe(tag(`${q.name} repeated`), { method: 'GET', url: `${url}?${[...others, `${q.name}=a`, `${q.name}=b`].join('&')}`, token });
  }
  // Another firm's record, or nobody's, is simply not found (DEVELOPERS.md "Organization scoping").
  for (const name of [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1])) {
    await probe(
      tag(`{${name}} of another firm`),
      { method: 'GET', url: fillPath(op.path, own, { which: name, value: foreignFor(op.path, name) }), token },
      true,
    );
  }
  if (op.path.includes('{')) await probe(tag('unknown ids'), { method: 'GET', url: fillPath(op.path, own, { which: '*', value: UNKNOWN_ID }), token }, true);
}

function operationsOf(doc: { paths: Record<string, Record<string, Record<string, unknown>>> }): Operation[] {
  const out: Operation[] = [];
  for (const [path, methods] of Object.entries(doc.paths)) {
    for (const [method, op] of Object.entries(methods)) {
      const content = (op.requestBody as { content?: Record<string, { schema: JsonSchema }> } | undefined)?.content ?? {};
      const [bodyType, media] = Object.entries(content)[0] ?? [];
      const query = ((op.parameters as { name: string; in: string; schema: JsonSchema }[] | undefined) ?? [])
        .filter((p) => p.in === 'query')
        .map((p) => ({ name: p.name, schema: p.schema }));
      out.push({
        method,
        path,
        access: String(op['x-nestkeeper-access']),
        body: media?.schema,
        bodyType: bodyType ?? (['post', 'put', 'patch', 'delete'].includes(method) ? 'application/json' : undefined),
        query,
      });
    }
  }
  return out;
}

async function collectIds(token: string, into: Map<string, string>) {
  for (const list of lists) {
    const res = await send({ method: 'GET', url: `/api/${list}`, token });
    const parsed = res.status === 200 ? JSON.parse(res.text) : null;
    const items = (Array.isArray(parsed) ? parsed : (parsed?.items ?? [])) as { id: string }[];
    if (items[0]?.id) into.set(list, items[0].id);
  }
}

beforeAll(async () => {
  t = await createTestApp();
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  for (const role of roles) tokens[role] = await t.tokenFor(people[role]);
  tokens.otherOwner = await t.tokenFor('owner@other.test');

  // Records in the other firm, so its ids can be tried against this one.
  const asOther = (url: string, body: unknown) =>
    send({ method: 'POST', url, token: tokens.otherOwner, body: JSON.stringify(body), contentType: 'application/json' });
  const otherAsset = JSON.parse((await asOther('/api/assets', { type: 'accessory', assetTag: 'OTHER-1', serialNumber: 'O-1' })).text);
  await asOther('/api/kits', { name: 'Other kit', memberIds: [otherAsset.id] });
  const otherCustomer = JSON.parse((await asOther('/api/customers', { company: 'Other Customer Ltd', billingEmail: 'ap@other-customer.test' })).text);
  await asOther('/api/jobs', { reference: 'OJ-1', customerName: 'Other Customer Ltd', startsOn: '2031-01-05', endsOn: '2031-01-06' });
  await asOther('/api/bookings', { assetIds: [otherAsset.id], startsOn: '2031-01-05', endsOn: '2031-01-06' });
  await asOther('/api/rentals', { customerId: otherCustomer.id, assetIds: [otherAsset.id], startsOn: '2031-02-05', endsOn: '2031-02-06' });
  await collectIds(tokens.otherOwner, foreign);
  foreign.set('users', JSON.parse((await send({ method: 'GET', url: '/api/auth/me', token: tokens.otherOwner })).text).user.id);

  await collectIds(tokens.owner, own);
  // An item free and calibrated for the coming months, so valid bookings, trips and rentals can pass.
  const reserved = JSON.parse((await send({ method: 'GET', url: '/api/bookings?state=reserved', token: tokens.owner })).text).items[0];
  if (reserved) own.set('bookings', reserved.id);
  const free = await send({
    method: 'GET',
    url: `/api/availability?startsOn=${new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10)}&endsOn=${new Date(Date.now() + 90 * 86_400_000).toISOString().slice(0, 10)}`,
    token: tokens.owner,
  });
  own.set('assets', JSON.parse(free.text).items[0].id);
  const doc = await PDFDocument.create();
  doc.addPage().drawText('Calibration certificate (fuzz)');
  PDF = new Uint8Array(await doc.save());
  // A user the fuzz may re-role or disable without locking itself out.
  const spare = await send({
    method: 'POST',
    url: '/api/users',
    token: tokens.owner,
    body: JSON.stringify({ email: 'spare@demo.test', name: 'Spare Person', role: 'technician', password: 'a-long-enough-passphrase-7' }),
    contentType: 'application/json',
  });
  own.set('users', JSON.parse(spare.text).id);
  const calibrations = await send({ method: 'GET', url: `/api/assets/${own.get('assets')}/calibrations`, token: tokens.owner });
  const firstCalibration = JSON.parse(calibrations.text) as { id: string }[] | { items: { id: string }[] };
  const calibrationId = (Array.isArray(firstCalibration) ? firstCalibration : firstCalibration.items)[0]?.id;
  if (calibrationId) own.set('calibrations', calibrationId);

  operations = operationsOf(JSON.parse((await send({ method: 'GET', url: '/api/openapi.json' })).text));
}, 120_000);

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await t?.close();
});

describe('fuzzing every operation in the OpenAPI document', () => {
  it('answers malformed, wrong-typed, impossible and foreign input with a JSON 4xx — never a 500 or HTML', async () => {
    const writes = operations.filter((o) => o.method !== 'get');
    const reads = operations.filter((o) => o.method === 'get');
    // Reads first, while the records are as the seed left them; then writes, those that end a record's
    // useful life (retire, hold, cancel, close…) after the others, and the sign-in routes last.
    const rank = (o: Operation) => (o.path.startsWith('/api/auth') ? 2 : ENDS_A_RECORD.test(o.path) ? 1 : 0);
    for (const op of reads) for (const { role, full } of rolesFor(op.access)) await fuzzRead(op, role === 'anonymous' ? undefined : tokens[role], full, role);
    for (const op of [...writes].sort((a, b) => rank(a) - rank(b))) {
      for (const { role, full } of rolesFor(op.access)) {
        const token = role === 'anonymous' ? undefined : tokens[role];
        const accepted = await fuzzWrite(op, token, full, role);
        if (full) await fuzzPathIds(op, token, role, accepted);
      }
    }
    const fiveHundreds = findings.filter((f) => f.status >= 500).length;
    console.log(`fuzz: ${requests} requests, ${operations.length} routes, ${fiveHundreds} × 500`);
    if (process.env.FUZZ_REPORT) writeFileSync(process.env.FUZZ_REPORT, JSON.stringify({ findings, answered }, null, 1));
    expect(findings).toEqual([]);
  }, 300_000);
});
