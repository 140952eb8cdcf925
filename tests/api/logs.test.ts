import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/http/logging';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

/** A logger like the server's (its redaction included) whose JSON lines the test reads. */
function capturedLog() {
  const lines: string[] = [];
  const log = createLogger({ level: 'info', format: 'json' }, { write: (line: string) => void lines.push(line) });
  return { log, lines, parsed: () => lines.map((l) => JSON.parse(l) as Record<string, unknown>) };
}

describe('request ids on log lines and in error replies, secrets redacted', () => {
  let t: TestApp;
  const capture = capturedLog();
  beforeAll(async () => {
    t = await createTestApp({ LOG_LEVEL: 'info' }, { log: capture.log });
  });
  afterAll(async () => {
    await t?.close();
  });

  it("a refused sign-in's reply carries the ref that finds its log line; neither holds the password, token or cookie", async () => {
    const token = await t.tokenFor('manager@demo.test');
    const password = 'Wrong-Horse-Battery-Staple-7731';
    const res = await t.api.post('/api/auth/login').set(bearer(token)).set('Cookie', `nk_session=${token}`).send({ email: 'manager@demo.test', password });
    expect(res.status).toBe(401);
    const ref = res.body.error.ref as string;
    expect(ref).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.headers['x-request-id']).toBe(ref);

    const line = capture.parsed().find((l) => l.requestId === ref);
    expect(line, 'a log line with the reply’s ref').toBeDefined();
    expect(line).toMatchObject({ level: 40, res: { statusCode: 401, route: '/api/auth/login' }, req: { method: 'POST', path: '/api/auth/login' } });
    const everything = capture.lines.join('\n') + JSON.stringify(res.body);
    for (const secret of [password, token]) expect(everything).not.toContain(secret);
  });

  it('every request gets its own id; an id sent by a caller that is not a trusted proxy is not taken', async () => {
    const a = await t.api.get('/api/assets').set('X-Request-Id', 'chosen-by-the-caller-0001');
    const b = await t.api.get('/api/assets');
    expect(a.status).toBe(401);
    expect(a.body.error.ref).not.toBe('chosen-by-the-caller-0001');
    expect(a.body.error.ref).not.toBe(b.body.error.ref);
  });

  it('a calendar feed token in the query string is redacted from the line', async () => {
    const res = await t.api.get('/api/calendar.ics?token=feed-secret-that-must-not-show');
    const line = capture.parsed().find((l) => l.requestId === res.headers['x-request-id']);
    expect(line).toMatchObject({ req: { path: '/api/calendar.ics', query: { token: '[redacted]' } } });
    expect(capture.lines.join('\n')).not.toContain('feed-secret-that-must-not-show');
  });

  it('what a failed query carries (its parameters) and secrets in logged objects are redacted by key', () => {
    const own = capturedLog();
    const err = Object.assign(new Error('duplicate key'), { query: 'UPDATE users SET password_hash = $1', parameters: ['$2b$12$hashhashhash'] });
    own.log.error({ err, user: { email: 'a@demo.test', password: 'p4ss-in-an-object' }, headers: { authorization: 'Bearer abc.def.ghi' } }, 'boom');
    const [line] = own.parsed();
    expect(line).toMatchObject({ err: { parameters: '[redacted]', query: 'UPDATE users SET password_hash = $1' }, user: { password: '[redacted]' } });
    expect(own.lines[0]).not.toMatch(/hashhashhash|p4ss-in-an-object|abc\.def\.ghi/);
  });
});

describe('behind a trusted proxy', () => {
  let t: TestApp;
  const capture = capturedLog();
  beforeAll(async () => {
    t = await createTestApp({ LOG_LEVEL: 'info', TRUST_PROXY: 'loopback' }, { log: capture.log });
  });
  afterAll(async () => {
    await t?.close();
  });

  it("takes the proxy's X-Request-Id, so the proxy's access log and Nestkeeper's lines share it", async () => {
    const id = 'a3f0c2d4e5b6a7980112233445566778';
    const res = await t.api.get('/api/no-such-route').set('X-Request-Id', id);
    expect(res.status).toBe(404);
    expect(res.body.error.ref).toBe(id);
    expect(capture.parsed().some((l) => l.requestId === id)).toBe(true);
    // Not an id: taken as a header injection attempt and replaced.
    const odd = await t.api.get('/api/no-such-route').set('X-Request-Id', 'not an id; {"level":60}');
    expect(odd.body.error.ref).toMatch(/^[0-9a-f-]{36}$/);
  });
});
