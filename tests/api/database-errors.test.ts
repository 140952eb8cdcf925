import type { QueryRunner } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fromDatabaseError } from '../../server/http/database-errors';
import { pgRunCoordinator } from '../../server/routines/pg-run-coordinator';
import { waitUntil } from '../support/eventually';
import { startTcpProxy } from '../support/tcp-proxy';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/** Real refusals from PostgreSQL (through TypeORM, as services meet them), mapped by SQLSTATE class. */
describe('what PostgreSQL refuses becomes the caller’s 4xx, not a 500', () => {
  let t: TestApp;
  let runner: QueryRunner;
  beforeAll(async () => {
    t = await createTestApp();
    runner = t.db.createQueryRunner();
    await runner.connect();
    await runner.query(`CREATE TEMP TABLE probe (id int PRIMARY KEY, parent int REFERENCES probe (id), qty int CHECK (qty >= 0), code varchar(4), label text)`);
    await runner.query(`CREATE INDEX ON probe (label)`);
    await runner.query(`INSERT INTO probe (id) VALUES (1)`);
  });
  afterAll(async () => {
    await runner?.release();
    await t?.close();
  });

  const refusal = (sql: string, params?: unknown[]) =>
    runner.query(sql, params).then(
      () => {
        throw new Error(`PostgreSQL accepted: ${sql}`);
      },
      (err: unknown) => err,
    );

  it.each([
    ['22008 a date that does not exist', `SELECT '2026-02-30'::date`, [], 400, 'invalid_input'],
    ['22P02 text that is not a uuid', `SELECT 'nope'::uuid`, [], 400, 'invalid_input'],
    ['22003 a number beyond its type', `SELECT 2147483648::int4`, [], 400, 'invalid_input'],
    ['22021 a NUL in text', `SELECT $1::text`, ['a\u0000b'], 400, 'invalid_input'],
    ['22001 text longer than its column', `INSERT INTO probe (id, code) VALUES (2, 'too long')`, [], 400, 'invalid_input'],
    [
      '54000 a value too long for an index row',
      `INSERT INTO probe (id, label) SELECT 3, string_agg(md5(i::text), '') FROM generate_series(1, 400) i`,
      [],
      400,
      'invalid_input',
    ],
    ['23505 a duplicate key', `INSERT INTO probe (id) VALUES (1)`, [], 409, 'conflict'],
    ['23503 a reference to a missing record', `INSERT INTO probe (id, parent) VALUES (4, 999)`, [], 404, 'not_found'],
    ['23514 a check constraint', `INSERT INTO probe (id, qty) VALUES (6, -1)`, [], 422, 'constraint_failed'],
  ] as const)('%s', async (_name, sql, params, status, code) => {
    expect(fromDatabaseError(await refusal(sql, [...params]))).toMatchObject({ status, code });
  });

  it('23503 deleting a record others still refer to is a 409', async () => {
    await runner.query(`INSERT INTO probe (id, parent) VALUES (5, 1)`);
    expect(fromDatabaseError(await refusal(`DELETE FROM probe WHERE id = 1`))).toMatchObject({ status: 409, code: 'conflict' });
  });

  it('answers 503 when the server ends the session (57P01 admin shutdown)', async () => {
    const doomed = t.db.createQueryRunner();
    await doomed.connect();
    const err = await doomed.query('SELECT pg_terminate_backend(pg_backend_pid())').catch((e: unknown) => e);
    await doomed.release().catch(() => undefined);
    expect(fromDatabaseError(err)).toMatchObject({ status: 503, code: 'unavailable' });
  });

  it('leaves our own SQL mistakes (42601 syntax error) to the 500 handler', async () => {
    expect(fromDatabaseError(await refusal('SELEC 1'))).toBeNull();
  });
});

describe('while the database is unreachable', () => {
  let t: TestApp;
  let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
  beforeAll(async () => {
    const server = new URL(process.env.TEST_PG_URL!);
    proxy = await startTcpProxy({ host: server.hostname, port: Number(server.port) });
    t = await createTestApp({}, { reachDatabaseVia: (url) => Object.assign(new URL(url), { host: `127.0.0.1:${proxy.port}` }).toString() });
  });
  afterAll(async () => {
    await proxy?.restore().catch(() => undefined);
    await t?.close();
    await proxy?.close();
  });

  it('answers every API route 503 unavailable with Retry-After, signed in or not, and recovers when it is back', async () => {
    const token = await t.tokenFor('manager@demo.test');
    expect((await t.api.get('/api/assets').set(bearer(token))).status).toBe(200);

    await proxy.cut(); // open connections dropped, new ones refused
    const answers = {
      'GET /api/assets': await t.api.get('/api/assets').set(bearer(token)),
      'POST /api/kits': await t.api.post('/api/kits').set(bearer(token)).send({ name: 'Kit while down' }),
      'POST /api/auth/login': await t.api.post('/api/auth/login').send({ email: 'owner@demo.test', password: 'whatever-it-is' }),
      'GET /api/ready': await t.api.get('/api/ready'),
      // Once the watch knows, requests are answered from its one probe, not a pool connection each.
      'GET /api/assets again': await t.api.get('/api/assets').set(bearer(token)),
    };
    for (const [route, res] of Object.entries(answers)) {
      expect(res.status, route).toBe(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(res.body.error.code).toBe('unavailable');
      expect(res.body.error.ref, route).toEqual(res.headers['x-request-id']);
    }
    expect(t.watch.reachable).toBe(false);
    // Liveness is the process: restarting it would not bring the database back.
    expect((await t.api.get('/api/health')).body).toEqual({ status: 'ok' });

    await proxy.restore();
    expect((await t.api.get('/api/assets').set(bearer(token))).status).toBe(200);
    expect((await t.api.get('/api/ready')).body).toEqual({ status: 'ready', database: 'reachable', migrations: 'current' });
    expect(t.watch.reachable).toBe(true);
  });

  it('routines pause while the database is away (no claim is even tried) and resume by themselves', async () => {
    const coordinator = pgRunCoordinator(t.db, 'outage-test', t.watch);
    await proxy.cut();
    expect((await t.api.get('/api/ready')).status).toBe(503);
    expect(await coordinator.shouldRun('deliver-outbox:during-outage', 60_000)).toBe(false);
    const claimed: unknown[] = await t.db.query(`SELECT 1 FROM job_leases WHERE key = 'deliver-outbox:during-outage'`);
    expect(claimed).toHaveLength(0);

    await proxy.restore();
    // Nobody asks the API meanwhile: the watch looks again on its own.
    await waitUntil('the watch to find the database again', () => t.watch.reachable);
    expect(await coordinator.shouldRun('deliver-outbox:after-outage', 60_000)).toBe(true);
  });
});
