import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

const METRICS_TOKEN = 'metrics-token-of-this-test-0123456789';

/** Samples of one metric from Prometheus' text exposition format (prometheus.io "Exposition formats"). */
function samples(text: string, name: string): { labels: Record<string, string>; value: number }[] {
  const out: { labels: Record<string, string>; value: number }[] = [];
  for (const line of text.split('\n')) {
    const m = /^([a-z_:]+)(?:\{(.*)\})? (\S+)$/.exec(line);
    if (!m || m[1] !== name) continue;
    const labels = Object.fromEntries([...(m[2] ?? '').matchAll(/(\w+)="([^"]*)"/g)].map((l) => [l[1], l[2]]));
    out.push({ labels, value: Number(m[3]) });
  }
  return out;
}

describe('GET /metrics', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ METRICS_TOKEN });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('gives latency histograms and counts per route pattern (not per URL), error counts by code, and the operator gauges', async () => {
    const token = await t.tokenFor('manager@demo.test');
    const ids: string[] = (await t.api.get('/api/assets?limit=3').set(bearer(token))).body.items.map((a: { id: string }) => a.id);
    for (const id of ids) expect((await t.api.get(`/api/assets/${id}`).set(bearer(token))).status).toBe(200);
    expect((await t.api.get('/api/assets/00000000-0000-4000-8000-000000000000').set(bearer(token))).status).toBe(404);

    const res = await t.api.get('/metrics');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/plain; version=0\.0\.4/);
    const text = res.text;
    expect(text).toContain('# TYPE nestkeeper_http_request_duration_seconds histogram');

    const route = '/api/assets/:id';
    const buckets = samples(text, 'nestkeeper_http_request_duration_seconds_bucket').filter((s) => s.labels.route === route);
    const count = samples(text, 'nestkeeper_http_request_duration_seconds_count').find((s) => s.labels.route === route);
    expect(count?.value).toBe(ids.length + 1);
    // Buckets are cumulative and end in +Inf, which holds every request.
    expect(buckets.at(-1)).toMatchObject({ labels: { le: '+Inf' }, value: ids.length + 1 });
    for (let i = 1; i < buckets.length; i += 1) expect(buckets[i].value).toBeGreaterThanOrEqual(buckets[i - 1].value);
    expect(text).not.toMatch(/route="\/api\/assets\/[0-9a-f]{8}-/);

    const answered = samples(text, 'nestkeeper_http_requests_total').filter((s) => s.labels.route === route);
    expect(answered.find((s) => s.labels.status === '200')?.value).toBe(ids.length);
    expect(answered.find((s) => s.labels.status === '404')?.value).toBe(1);
    expect(samples(text, 'nestkeeper_http_errors_total').find((s) => s.labels.route === route)).toMatchObject({ labels: { code: 'not_found' }, value: 1 });

    expect(samples(text, 'nestkeeper_database_up')).toEqual([{ labels: {}, value: 1 }]);
    expect(samples(text, 'nestkeeper_db_pool_connections').map((s) => s.labels.state)).toEqual(expect.arrayContaining(['open', 'idle', 'waiting', 'max']));
    expect(samples(text, 'nestkeeper_outbox_waiting_messages')).toHaveLength(1);
    expect(samples(text, 'nestkeeper_outbox_oldest_waiting_seconds')).toHaveLength(1);
    // The demo firm has a rental out whose deposit authorization lapses within two days (README).
    const lapsing = samples(text, 'nestkeeper_card_authorizations_lapsing');
    expect(lapsing.map((s) => s.labels.within_hours)).toEqual(['24', '72']);
    expect(lapsing.find((s) => s.labels.within_hours === '72')!.value).toBeGreaterThanOrEqual(1);
  });

  it('counts routine runs by outcome', async () => {
    const token = await t.tokenFor('owner@demo.test');
    expect((await t.api.post('/api/admin/routines/late-returns/run').set(bearer(token))).status).toBe(200);
    const text = (await t.api.get('/metrics')).text;
    expect(samples(text, 'nestkeeper_routine_runs_total')).toContainEqual({ labels: { routine: 'late-returns', outcome: 'succeeded' }, value: 1 });
  });

  it('answers a caller relayed by a proxy only with the metrics token', async () => {
    const relayed = () => t.api.get('/metrics').set('X-Forwarded-For', '203.0.113.9');
    expect((await relayed()).status).toBe(401);
    expect((await relayed().set(bearer('not-the-metrics-token-at-all-000000'))).status).toBe(403);
    const withToken = await relayed().set(bearer(METRICS_TOKEN));
    expect(withToken.status).toBe(200);
    expect(withToken.text).toContain('nestkeeper_http_requests_total');
  });
});
