import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Routine } from '../../server/routines';
import { pgRunCoordinator } from '../../server/routines/pg-run-coordinator';
import { RoutinesService } from '../../server/routines/routines.service';
import { waitUntil } from '../support/eventually';
import { createTestDatabase } from '../support/test-db';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: Awaited<ReturnType<typeof createTestDatabase>>;
beforeAll(async () => {
  t = await createTestDatabase();
});
afterAll(() => t.drop());

describe('routines (scheduled work)', () => {
  it('runs each fire on exactly one of two instances sharing the database', async () => {
    const fired: string[] = [];
    const tick = (instance: string): Routine => ({
      name: 'tick',
      description: 'test routine',
      schedule: '* * * * * *',
      run: async () => {
        fired.push(instance);
        return { instance };
      },
    });
    const a = new RoutinesService(t.db, [tick('a')]);
    const b = new RoutinesService(t.db, [tick('b')]);
    a.start();
    b.start();
    // Two fires, however late a busy machine lets them come.
    await waitUntil('two fires of the every-second routine', () => fired.length >= 2);
    await a.stop();
    await b.stop();
    // Stopping does not wait for a fire already claimed: let every claimed slot finish its run before counting.
    const settled = async () => {
      const [{ claimed, finished }] = await t.db.query(
        `SELECT (SELECT count(*)::int FROM job_leases WHERE key LIKE 'tick:%') AS claimed,
                (SELECT count(*)::int FROM job_runs WHERE job_name = 'tick' AND finished_at IS NOT NULL) AS finished`,
      );
      return claimed === finished;
    };
    await waitUntil('the claimed fires to finish', settled);

    const rows: { scheduled_for: Date; n: number }[] = await t.db.query(
      `SELECT scheduled_for, count(*)::int AS n FROM job_runs WHERE job_name = 'tick' GROUP BY scheduled_for ORDER BY 1`,
    );
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows.every((r) => r.n === 1)).toBe(true);
    expect(fired.length).toBe(rows.length);
  });

  it('elects one winner when many instances race for the same slot', async () => {
    const answers = await Promise.all(
      Array.from({ length: 8 }, (_, i) => pgRunCoordinator(t.db, `instance-${i}`).shouldRun('race:2026-12-01T06:00:00.000Z', 60_000)),
    );
    expect(answers.filter(Boolean)).toHaveLength(1);
  });
});

describe('routines admin API', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await createTestApp();
  });
  afterAll(() => app.close());

  it('lets the owner run a routine now, logs the run, and refuses other roles', async () => {
    const owner = await app.tokenFor('owner@demo.test');
    const [{ queued }] = await app.db.query(
      `SELECT count(*)::int AS queued FROM outbox_messages m JOIN users u ON u.organization_id = m.organization_id AND u.email = 'owner@demo.test' WHERE m.status = 'pending'`,
    );
    expect(queued).toBeGreaterThan(0);
    const run = await app.api.post('/api/admin/routines/deliver-outbox/run').set(bearer(owner));
    expect(run.status).toBe(200);
    // SMTP is not listening in this app: the run succeeds and the mail waits. "Run now" covers the owner's own firm only.
    expect(run.body.run).toMatchObject({ status: 'succeeded', trigger: 'manual', scope: 'your firm', summary: { sent: 0, deferred: queued, pending: queued } });
    const list = await app.api.get('/api/admin/routines').set(bearer(owner));
    expect(list.body.items).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ name: 'deliver-outbox', lastRun: expect.objectContaining({ id: run.body.run.id }) }),
        expect.objectContaining({ name: 'late-returns', lastRun: null }),
      ]),
    );
    expect((await app.api.post('/api/admin/routines/no-such-routine/run').set(bearer(owner))).status).toBe(404);
    const manager = await app.tokenFor('manager@demo.test');
    expect((await app.api.get('/api/admin/routines').set(bearer(manager))).status).toBe(403);
  });

  it("keeps one firm's run now to that firm, and out of the other firm's view", async () => {
    const other = await app.tokenFor('owner@other.test');
    const demo = await app.tokenFor('owner@demo.test');
    // The demo firm has a late return (seeded); the other firm has none, and its run must not touch the demo firm's.
    const run = await app.api.post('/api/admin/routines/late-returns/run').set(bearer(other));
    expect(run.body.run).toMatchObject({ status: 'succeeded', scope: 'your firm', summary: { firms: 0, lateBookings: 0 } });
    const demoView = (await app.api.get('/api/admin/routines').set(bearer(demo))).body.items.find((j: { name: string }) => j.name === 'late-returns');
    expect(demoView.lastRun).toBeNull();
    const own = await app.api.post('/api/admin/routines/late-returns/run').set(bearer(demo));
    expect(own.body.run.summary).toMatchObject({ firms: 1 });
    expect(own.body.run.summary.lateBookings).toBeGreaterThan(0);
  });

  it('still answers at /api/admin/jobs, the paths API.md first published', async () => {
    const owner = await app.tokenFor('owner@demo.test');
    const run = await app.api.post('/api/admin/jobs/late-returns/run').set(bearer(owner));
    expect(run.status).toBe(200);
    expect(run.body.run).toMatchObject({ status: 'succeeded', scope: 'your firm' });
    const oldList = await app.api.get('/api/admin/jobs').set(bearer(owner));
    const newList = await app.api.get('/api/admin/routines').set(bearer(owner));
    expect(oldList.status).toBe(200);
    expect(oldList.body).toEqual(newList.body);
    expect(oldList.body.items.find((r: { name: string }) => r.name === 'late-returns').lastRun.id).toBe(run.body.run.id);
    expect((await app.api.get('/api/admin/jobs').set(bearer(await app.tokenFor('manager@demo.test')))).status).toBe(403);
  });
});
