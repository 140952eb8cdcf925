import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: string;
let otherOwner: string;
beforeAll(async () => {
  t = await createTestApp();
  owner = await t.tokenFor('owner@demo.test');
  otherOwner = await t.tokenFor('owner@other.test');
});
afterAll(() => t.close());

const newUser = (email: string) => ({ email, name: 'Wendel Ashgrove', role: 'technician', password: 'kestrel-umber-vault-29' });

describe('users admin', () => {
  it('lets the owner list, add, re-role and disable users', async () => {
    const list = await t.api.get('/api/users').set(bearer(owner));
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(4);
    expect(list.body.items.map((u: { email: string }) => u.email).sort()).toEqual([
      'billing@demo.test',
      'manager@demo.test',
      'owner@demo.test',
      'tech@demo.test',
    ]);
    expect(list.body.items[0]).not.toHaveProperty('passwordHash');

    const created = await t.api.post('/api/users').set(bearer(owner)).send(newUser('Wendel@Demo.test'));
    expect(created.status).toBe(201);
    expect(created.body.email).toBe('wendel@demo.test');
    const dup = await t.api.post('/api/users').set(bearer(owner)).send(newUser('wendel@demo.test'));
    expect(dup.status).toBe(409);

    const token = await t.tokenFor('wendel@demo.test', 'kestrel-umber-vault-29');
    const promoted = await t.api.patch(`/api/users/${created.body.id}`).set(bearer(owner)).send({ role: 'manager' });
    expect(promoted.body.role).toBe('manager');

    const disabled = await t.api.patch(`/api/users/${created.body.id}`).set(bearer(owner)).send({ disabled: true });
    expect(disabled.body.disabled).toBe(true);
    expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(401);
    expect((await t.api.post('/api/auth/login').send({ email: 'wendel@demo.test', password: 'kestrel-umber-vault-29' })).status).toBe(401);
  });

  it('lets the owner reset a password', async () => {
    const { body } = await t.api.post('/api/users').set(bearer(owner)).send(newUser('reset.me@demo.test'));
    expect((await t.api.post(`/api/users/${body.id}/password`).set(bearer(owner)).send({ password: 'moss-quill-harbor-61' })).status).toBe(204);
    expect(await t.tokenFor('reset.me@demo.test', 'moss-quill-harbor-61')).toBeTruthy();
  });

  it('keeps at least one active owner', async () => {
    const me = (await t.api.get('/api/auth/me').set(bearer(owner))).body.user;
    const res = await t.api.patch(`/api/users/${me.id}`).set(bearer(owner)).send({ role: 'manager' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('last_owner');
  });

  it('refuses a common or guessable password, or one longer than bcrypt reads, saying why on the field', async () => {
    const weak = async (res: { status: number; body: { error: { details: { fields: Record<string, string> } } } }, field = 'password') => {
      expect(res.status).toBe(400);
      return res.body.error.details.fields[field];
    };
    expect(
      await weak(
        await t.api
          .post('/api/users')
          .set(bearer(owner))
          .send({ ...newUser('weak.one@demo.test'), password: 'password1234' }),
      ),
    ).toMatch(/^is too easy to guess\. This is similar to a commonly used password/);
    // The person's own name and the firm's name are what a guesser tries first.
    expect(
      await weak(
        await t.api
          .post('/api/users')
          .set(bearer(owner))
          .send({ ...newUser('weak.two@demo.test'), password: 'Wendel Ashgrove1' }),
      ),
    ).toMatch(/name or address/);
    const tech = (await t.api.get('/api/users').set(bearer(owner))).body.items.find((u: { email: string }) => u.email === 'tech@demo.test');
    expect(await weak(await t.api.post(`/api/users/${tech.id}/password`).set(bearer(owner)).send({ password: 'Brackenmoor2027' }))).toMatch(/name or address/);
    // 25 characters, 75 bytes in UTF-8 (RFC 3629: € takes three).
    expect(
      await weak(
        await t.api
          .post(`/api/users/${tech.id}/password`)
          .set(bearer(owner))
          .send({ password: '€'.repeat(25) }),
      ),
    ).toMatch(/at most 72 bytes/);
    expect((await t.api.get('/api/users').set(bearer(owner))).body.items.map((u: { email: string }) => u.email)).not.toContain('weak.one@demo.test');
    expect(await t.tokenFor('tech@demo.test')).toBeTruthy();
  });

  it('answers 403 to a technician on users admin', async () => {
    const tech = await t.tokenFor('tech@demo.test');
    const res = await t.api.get('/api/users').set(bearer(tech));
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect((await t.api.post('/api/users').set(bearer(tech)).send(newUser('sneaky@demo.test'))).status).toBe(403);
  });

  it("keeps firms apart: org B's owner cannot read or change org A's users (404)", async () => {
    const aUsers = (await t.api.get('/api/users').set(bearer(owner))).body.items;
    const bList = await t.api.get('/api/users').set(bearer(otherOwner));
    expect(bList.body.items.map((u: { email: string }) => u.email)).toEqual(['owner@other.test']);
    const target = aUsers.find((u: { email: string }) => u.email === 'tech@demo.test');
    const patch = await t.api.patch(`/api/users/${target.id}`).set(bearer(otherOwner)).send({ disabled: true });
    expect(patch.status).toBe(404);
    const reset = await t.api.post(`/api/users/${target.id}/password`).set(bearer(otherOwner)).send({ password: 'gable-fennel-83-orbit' });
    expect(reset.status).toBe(404);
    expect(await t.tokenFor('tech@demo.test')).toBeTruthy();
  });
});

describe('bad input', () => {
  it('answers malformed JSON with 400 invalid_input, not a stack trace', async () => {
    const res = await t.api.post('/api/users').set(bearer(owner)).set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('names every missing and wrong-typed field', async () => {
    const res = await t.api.post('/api/users').set(bearer(owner)).send({ email: 'not-an-address', name: 42, role: 'wizard' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.fields).toEqual({
      email: expect.stringMatching(/e-mail/),
      name: expect.any(String),
      role: expect.stringMatching(/owner, manager, technician, billing/),
      password: expect.any(String),
    });
  });

  it('refuses unknown fields on a user change and a non-id path with 404', async () => {
    const res = await t.api.patch('/api/users/not-a-uuid').set(bearer(owner)).send({ name: 'x' });
    expect(res.status).toBe(404);
    const me = (await t.api.get('/api/auth/me').set(bearer(owner))).body.user;
    const extra = await t.api.patch(`/api/users/${me.id}`).set(bearer(owner)).send({ passwordHash: 'x' });
    expect(extra.status).toBe(400);
  });

  it('answers an unknown API path with a JSON 404', async () => {
    const res = await t.api.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('reports health without sign-in and serves the OpenAPI description', async () => {
    expect((await t.api.get('/api/health')).body).toEqual({ status: 'ok' });
    const doc = (await t.api.get('/api/openapi.json')).body;
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths)).toEqual(
      expect.arrayContaining(['/api/auth/login', '/api/users/{id}', '/api/mailbox', '/api/admin/routines/{name}/run', '/api/admin/jobs/{name}/run']),
    );
  });
});

describe('the last active owner', () => {
  it('stays when two owners demote or disable each other at the same moment (six trials)', async () => {
    const password = 'quartz-meadow-71-ferry';
    const second = await t.api
      .post('/api/users')
      .set(bearer(owner))
      .send({ email: 'second.owner@demo.test', name: 'Halden Rookwood', role: 'owner', password });
    expect(second.status).toBe(201);
    const first = (await t.api.get('/api/auth/me').set(bearer(owner))).body.user;
    const owners = [
      { id: first.id as string, email: 'owner@demo.test', password: 'nestkeeper-demo', token: owner },
      { id: second.body.id as string, email: 'second.owner@demo.test', password, token: await t.tokenFor('second.owner@demo.test', password) },
    ];
    const activeOwners = async () =>
      (await t.db.query(`SELECT count(*)::int AS n FROM users WHERE organization_id = $1 AND role = 'owner' AND NOT disabled`, [first.organizationId]))[0].n;
    for (let trial = 0; trial < 6; trial += 1) {
      const change = trial % 2 ? { disabled: true } : { role: 'manager' };
      const [a, b] = owners;
      // Both requests are in flight together; each one's guard and count run against the other's change.
      const answers = await Promise.all([
        t.api.patch(`/api/users/${b.id}`).set(bearer(a.token)).send(change),
        t.api.patch(`/api/users/${a.id}`).set(bearer(b.token)).send(change),
      ]);
      expect(
        answers.filter((r) => r.status === 200),
        `trial ${trial}: ${answers.map((r) => r.status)}`,
      ).toHaveLength(1);
      expect(await activeOwners()).toBe(1);
      const [survivor, lost] = answers[0].status === 200 ? [a, b] : [b, a];
      expect((await t.api.patch(`/api/users/${lost.id}`).set(bearer(survivor.token)).send({ role: 'owner', disabled: false })).status).toBe(200);
      expect(await activeOwners()).toBe(2);
      // Disabling ended the lost owner's tokens.
      if (change.disabled) lost.token = await t.tokenFor(lost.email, lost.password);
    }
    owner = owners[0].token;
  }, 120_000);
});
