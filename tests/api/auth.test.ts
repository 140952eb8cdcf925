import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import request from 'supertest';
import jwt from 'jsonwebtoken';
import { buildApp } from '../../server/app';
import { signSessionToken, signingKey } from '../../server/auth/tokens';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ LOGIN_ATTEMPTS_PER_10_MIN: '5' });
});
afterAll(() => t.close());

describe('sign-in', () => {
  it.each([
    ['owner@demo.test', 'owner'],
    ['manager@demo.test', 'manager'],
    ['tech@demo.test', 'technician'],
    ['billing@demo.test', 'billing'],
  ])('%s signs in as %s and gets a token plus an httpOnly SameSite=Lax session cookie', async (email, role) => {
    const res = await t.api.post('/api/auth/login').send({ email, password: 'nestkeeper-demo' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email, role });
    expect(Object.keys(res.body.user)).toEqual(expect.arrayContaining(['id', 'email', 'name', 'role', 'organizationId']));
    expect(res.body.token).toMatch(/^[\w-]+\.[\w-]+\.[\w-]+$/);
    const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
    const session = cookies.find((c) => c.startsWith('nk_session='))!;
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(session).toMatch(/Max-Age=43200/); // 12 h
  });

  it('answers a wrong password and an unknown e-mail with the same 401', async () => {
    const wrong = await t.api.post('/api/auth/login').send({ email: 'owner@demo.test', password: 'not-the-password' });
    const unknown = await t.api.post('/api/auth/login').send({ email: 'nobody@demo.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    // The same words; only the error ref (each request's own id) differs.
    expect({ ...wrong.body.error, ref: undefined }).toEqual({ ...unknown.body.error, ref: undefined });
    expect(wrong.body.error.code).toBe('unauthenticated');
  });

  it('rate-limits repeated failed sign-ins for one address with 429', async () => {
    const attempt = () => t.api.post('/api/auth/login').send({ email: 'billing@demo.test', password: 'guessing-again' });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await attempt()).status);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
    expect((await attempt()).body.error.code).toBe('rate_limited');
  });

  it('counts a padded or re-cased e-mail and a forged X-Forwarded-For against the same limit', async () => {
    // Sign-in reads " Visitor2@Demo.TEST " as visitor2@demo.test, so the limiter does too; no proxy is trusted by default.
    const spellings = [
      'visitor2@demo.test',
      ' Visitor2@demo.test',
      'VISITOR2@DEMO.TEST ',
      '\tvisitor2@Demo.Test',
      'visitor2@demo.test  ',
      'Visitor2@Demo.test',
    ];
    const statuses: number[] = [];
    for (const [i, email] of spellings.entries()) {
      statuses.push(
        (
          await t.api
            .post('/api/auth/login')
            .set('X-Forwarded-For', `203.0.113.${i + 1}`)
            .send({ email, password: 'guessing-padded' })
        ).status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it('counts failed sign-ins across app instances: a second instance on the same database shares the limit', async () => {
    const second = request(buildApp({ config: t.config, db: t.db, mail: nodemailer.createTransport({ jsonTransport: true }) }).app);
    const attempt = (api: typeof t.api) => api.post('/api/auth/login').send({ email: 'visitor@demo.test', password: 'guessing-across' });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await attempt(i % 2 ? second : t.api)).status);
    // Five allowed in all, not five per instance.
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    // The right password still works for someone else from the same address.
    expect((await second.post('/api/auth/login').send({ email: 'manager@demo.test', password: 'nestkeeper-demo' })).status).toBe(200);
  });

  it('refuses anonymous callers on a protected route with 401', async () => {
    const res = await t.api.get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('accepts the Bearer token and the cookie alike', async () => {
    const token = await t.tokenFor('tech@demo.test');
    expect((await t.api.get('/api/auth/me').set(bearer(token))).body.user.email).toBe('tech@demo.test');
    const agent = (await import('supertest')).default.agent(t.app);
    await agent.post('/api/auth/login').send({ email: 'tech@demo.test', password: 'nestkeeper-demo' });
    expect((await agent.get('/api/auth/me')).body.organization.name).toBe('Brackenmoor Dimensional Works');
  });

  it('refuses a cookie-borne change without the CSRF header, allows it with the header', async () => {
    const agent = (await import('supertest')).default.agent(t.app);
    const login = await agent.post('/api/auth/login').send({ email: 'owner@demo.test', password: 'nestkeeper-demo' });
    const csrf = ([] as string[])
      .concat(login.headers['set-cookie'])
      .find((c) => c.startsWith('nk_csrf='))!
      .split(';')[0]
      .split('=')[1];
    const body = { email: 'csrf.check@demo.test', name: 'Csrf Check', role: 'technician', password: 'lichen-parcel-76-wren' };
    const refused = await agent.post('/api/users').send(body);
    expect(refused.status).toBe(403);
    const allowed = await agent.post('/api/users').set('X-CSRF-Token', csrf).send(body);
    expect(allowed.status).toBe(201);
  });

  it('refuses a token without an expiry, even one signed with the installation key', async () => {
    const signedIn = await t.tokenFor('tech@demo.test');
    const me = (await t.api.get('/api/auth/me').set(bearer(signedIn))).body.user;
    const [{ token_version }] = await t.db.query(`SELECT token_version FROM users WHERE id = $1`, [me.id]);
    // The claims of a real sign-in, its session id (`jti`) included.
    const claims = { sub: me.id, org: me.organizationId, ver: token_version, jti: (jwt.decode(signedIn) as { jti: string }).jti };
    const key = signingKey(t.config.JWT_SECRET);
    const forever = jwt.sign(claims, key, { algorithm: 'HS256' });
    expect((await t.api.get('/api/auth/me').set(bearer(forever))).status).toBe(401);
    // A far expiry on an old token does not help either: a session lasts 12 hours from its issue.
    const old = jwt.sign({ ...claims, iat: Math.floor(Date.now() / 1000) - 13 * 3600 }, key, { algorithm: 'HS256', expiresIn: '30d' });
    expect((await t.api.get('/api/auth/me').set(bearer(old))).status).toBe(401);
    // The same claims with the usual expiry are accepted (the check above is not refusing everything).
    expect((await t.api.get('/api/auth/me').set(bearer(signSessionToken(key, claims)))).status).toBe(200);
  });

  it('rejects a tampered token', async () => {
    const token = await t.tokenFor('owner@demo.test');
    const [h, p] = token.split('.');
    const res = await t.api.get('/api/auth/me').set(bearer(`${h}.${p}.forged-signature`));
    expect(res.status).toBe(401);
  });
});

describe('the session probe', () => {
  it('answers 200 with no session to a caller signed out, tampered or ended, and the session to one signed in', async () => {
    const anonymous = await t.api.get('/api/auth/session');
    expect(anonymous.status).toBe(200);
    expect(anonymous.body).toEqual({ session: null });
    const token = await t.tokenFor('tech@demo.test');
    const [h, p] = token.split('.');
    expect((await t.api.get('/api/auth/session').set(bearer(`${h}.${p}.forged-signature`))).body).toEqual({ session: null });
    const signedIn = await t.api.get('/api/auth/session').set(bearer(token));
    // The same answer as /api/auth/me, wrapped.
    expect(signedIn.body.session).toEqual((await t.api.get('/api/auth/me').set(bearer(token))).body);
    expect(signedIn.body.session.user).toMatchObject({ email: 'tech@demo.test', role: 'technician' });
    await t.api.post('/api/auth/logout').set(bearer(token));
    const ended = await t.api.get('/api/auth/session').set(bearer(token));
    expect([ended.status, ended.body]).toEqual([200, { session: null }]);
    // /api/auth/me keeps its contract for other callers.
    expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(401);
  });
});

describe('sign-out', () => {
  it('ends the bearer token as well as the cookie', async () => {
    const token = await t.tokenFor('owner@demo.test');
    expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(200);
    const out = await t.api.post('/api/auth/logout').set(bearer(token));
    expect(out.status).toBe(204);
    expect(([] as string[]).concat(out.headers['set-cookie'] ?? []).some((c) => /^nk_session=;/.test(c))).toBe(true);
    expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(401);
    // Signing in again gives a working token.
    expect((await t.api.get('/api/auth/me').set(bearer(await t.tokenFor('owner@demo.test')))).status).toBe(200);
  });

  it('ends a cookie session (with the CSRF header) and answers 204 to a caller without one', async () => {
    const agent = (await import('supertest')).default.agent(t.app);
    const login = await agent.post('/api/auth/login').send({ email: 'tech@demo.test', password: 'nestkeeper-demo' });
    const csrf = ([] as string[])
      .concat(login.headers['set-cookie'])
      .find((c) => c.startsWith('nk_csrf='))!
      .split(';')[0]
      .split('=')[1];
    expect((await agent.post('/api/auth/logout').set('X-CSRF-Token', csrf)).status).toBe(204);
    expect((await t.api.get('/api/auth/me').set(bearer(login.body.token))).status).toBe(401);
    expect((await t.api.post('/api/auth/logout')).status).toBe(204);
    expect((await t.api.post('/api/auth/logout').set(bearer('not.a.token'))).status).toBe(204);
  });
});

describe('own password', () => {
  it('changes the password; the old token and old password stop working', async () => {
    const token = await t.tokenFor('manager@demo.test');
    const wrong = await t.api.post('/api/auth/password').set(bearer(token)).send({ currentPassword: 'nope-nope-nope', newPassword: 'amber-tundra-sleet-38' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.code).toBe('wrong_password');
    const short = await t.api.post('/api/auth/password').set(bearer(token)).send({ currentPassword: 'nestkeeper-demo', newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details.fields.newPassword).toMatch(/at least 10/);
    const guessable = await t.api.post('/api/auth/password').set(bearer(token)).send({ currentPassword: 'nestkeeper-demo', newPassword: 'nestkeeper2025' });
    expect(guessable.status).toBe(400);
    expect(guessable.body.error.details.fields.newPassword).toMatch(/^is too easy to guess\./);
    const ok = await t.api.post('/api/auth/password').set(bearer(token)).send({ currentPassword: 'nestkeeper-demo', newPassword: 'amber-tundra-sleet-38' });
    expect(ok.status).toBe(204);
    expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(401);
    expect((await t.api.post('/api/auth/login').send({ email: 'manager@demo.test', password: 'nestkeeper-demo' })).status).toBe(401);
    expect(await t.tokenFor('manager@demo.test', 'amber-tundra-sleet-38')).toBeTruthy();
  });
});
