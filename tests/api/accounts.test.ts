import { createHash } from 'node:crypto';
import { Secret, TOTP } from 'otpauth';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { waitUntil } from '../support/eventually';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: string;
beforeAll(async () => {
  t = await createTestApp({ LOGIN_ATTEMPTS_PER_10_MIN: '5', RESET_REQUESTS_PER_HOUR_PER_EMAIL: '3', RESET_REQUESTS_PER_HOUR_PER_ADDRESS: '40' });
  owner = await t.tokenFor('owner@demo.test');
});
afterAll(() => t.close());

/** The newest queued mail to this address whose body holds a Nestkeeper link, and the link's secret (after `#`). */
async function mailedLink(to: string, path: 'join' | 'reset-password') {
  const mail = await waitUntil(`a mail with a ${path} link to ${to}`, async () => {
    const [row] = await t.db.query(
      `SELECT subject, text_body FROM outbox_messages WHERE $1 = ANY(recipients) AND text_body LIKE $2 ORDER BY created_at DESC LIMIT 1`,
      [to, `%/${path}#%`],
    );
    return row as { subject: string; text_body: string } | undefined;
  });
  const token = new RegExp(`/${path}#([A-Za-z0-9_-]+)`).exec(mail.text_body)![1];
  return { ...mail, token };
}

const mailsTo = async (to: string) => Number((await t.db.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE $1 = ANY(recipients)`, [to]))[0].n);

const codeFor = (secret: string, at = Date.now()) =>
  new TOTP({ secret: Secret.fromBase32(secret), algorithm: 'SHA1', digits: 6, period: 30 }).generate({ timestamp: at });

describe('invitations', () => {
  it('mails a single-use link in the firm’s name; accepting it makes the person and signs them in; the link then says it was used', async () => {
    const invited = await t.api.post('/api/invitations').set(bearer(owner)).send({ email: 'Ilse.Farrow@demo.test', role: 'technician' });
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email: 'ilse.farrow@demo.test', role: 'technician', state: 'pending' });
    const hours = (Date.parse(invited.body.expiresAt) - Date.parse(invited.body.sentAt)) / 3_600_000;
    expect(hours).toBeCloseTo(72, 3);
    expect((await t.api.get('/api/invitations').set(bearer(owner))).body.items.map((i: { email: string }) => i.email)).toContain('ilse.farrow@demo.test');

    const mail = await mailedLink('ilse.farrow@demo.test', 'join');
    expect(mail.subject).toMatch(/Brackenmoor Dimensional Works/);
    expect(mail.text_body).toMatch(/Sent with Nestkeeper for Brackenmoor Dimensional Works/);
    expect(mail.text_body).toMatch(/Did not expect this\? Ignore this mail/);
    // Only the SHA-256 of the secret is stored.
    const [stored] = await t.db.query(`SELECT token_hash FROM account_links WHERE email = 'ilse.farrow@demo.test'`);
    expect(stored.token_hash).toBe(createHash('sha256').update(mail.token).digest('hex'));
    expect((await t.db.query(`SELECT count(*)::int AS n FROM account_links WHERE token_hash = $1`, [mail.token]))[0].n).toBe(0);

    const opened = await t.api.post('/api/invitations/lookup').send({ token: mail.token });
    expect(opened.body).toMatchObject({ email: 'ilse.farrow@demo.test', role: 'technician', firmName: 'Brackenmoor Dimensional Works' });
    const weak = await t.api.post('/api/invitations/accept').send({ token: mail.token, name: 'Ilse Farrow', password: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.details.fields.password).toMatch(/too easy to guess/);

    const accepted = await t.api.post('/api/invitations/accept').send({ token: mail.token, name: 'Ilse Farrow', password: 'gannet-quarry-lantern-81' });
    expect(accepted.status).toBe(201);
    expect(([] as string[]).concat(accepted.headers['set-cookie']).some((c) => c.startsWith('nk_session='))).toBe(true);
    const me = await t.api.get('/api/auth/me').set(bearer(accepted.body.token));
    expect(me.body.user).toMatchObject({ email: 'ilse.farrow@demo.test', name: 'Ilse Farrow', role: 'technician' });
    expect(await t.tokenFor('ilse.farrow@demo.test', 'gannet-quarry-lantern-81')).toBeTruthy();

    const again = await t.api.post('/api/invitations/accept').send({ token: mail.token, name: 'Someone Else', password: 'gannet-quarry-lantern-82' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('link_used');
    expect((await t.api.post('/api/invitations/lookup').send({ token: mail.token })).body.error.code).toBe('link_used');
    expect((await t.api.get('/api/invitations').set(bearer(owner))).body.items.map((i: { email: string }) => i.email)).not.toContain('ilse.farrow@demo.test');
  });

  it('says plainly when a link has expired (72 h) or was withdrawn, and a resend replaces the old link', async () => {
    await t.api.post('/api/invitations').set(bearer(owner)).send({ email: 'late.reader@demo.test', role: 'manager' });
    const late = await mailedLink('late.reader@demo.test', 'join');
    await t.db.query(`UPDATE account_links SET expires_at = now() - interval '1 second' WHERE email = 'late.reader@demo.test'`);
    const expired = await t.api.post('/api/invitations/accept').send({ token: late.token, name: 'Late Reader', password: 'moorland-cobalt-ferry-27' });
    expect(expired.status).toBe(410);
    expect(expired.body.error).toMatchObject({ code: 'link_expired', message: expect.stringMatching(/expired/) });
    const listed = (await t.api.get('/api/invitations').set(bearer(owner))).body.items.find((i: { email: string }) => i.email === 'late.reader@demo.test');
    expect(listed.state).toBe('expired');

    const resent = await t.api.post(`/api/invitations/${listed.id}/resend`).set(bearer(owner));
    expect(resent.body.state).toBe('pending');
    const fresh = await waitUntil('a second invitation mail', async () => {
      const link = await mailedLink('late.reader@demo.test', 'join');
      return link.token !== late.token && link;
    });
    expect((await t.api.post('/api/invitations/lookup').send({ token: late.token })).body.error.code).toBe('link_unknown');
    expect((await t.api.post('/api/invitations/lookup').send({ token: fresh.token })).status).toBe(200);

    expect((await t.api.post(`/api/invitations/${listed.id}/withdraw`).set(bearer(owner))).status).toBe(204);
    const withdrawn = await t.api.post('/api/invitations/accept').send({ token: fresh.token, name: 'Late Reader', password: 'moorland-cobalt-ferry-27' });
    expect(withdrawn.status).toBe(410);
    expect(withdrawn.body.error.code).toBe('link_withdrawn');
  });

  it('refuses an address already in use or invited, and anyone but the owner', async () => {
    expect((await t.api.post('/api/invitations').set(bearer(owner)).send({ email: 'tech@demo.test', role: 'technician' })).status).toBe(409);
    await t.api.post('/api/invitations').set(bearer(owner)).send({ email: 'twice@demo.test', role: 'technician' });
    expect((await t.api.post('/api/invitations').set(bearer(owner)).send({ email: 'twice@demo.test', role: 'billing' })).status).toBe(409);
    const manager = await t.tokenFor('manager@demo.test');
    expect((await t.api.post('/api/invitations').set(bearer(manager)).send({ email: 'x@demo.test', role: 'owner' })).status).toBe(403);
    expect((await t.api.post('/api/invitations/lookup').send({ token: 'short' })).status).toBe(400);
  });
});

describe('forgot password', () => {
  it('answers a known and an unknown address alike, and mails only the known one', async () => {
    const known = await t.api.post('/api/auth/password-reset').send({ email: 'manager@demo.test' });
    const unknown = await t.api.post('/api/auth/password-reset').send({ email: 'nobody-here@demo.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(Object.keys(known.headers).sort()).toEqual(Object.keys(unknown.headers).sort());
    const mail = await mailedLink('manager@demo.test', 'reset-password');
    expect(mail.text_body).toMatch(/Did not ask for this\? Ignore this mail: your password stays as it is/);
    expect(mail.text_body).toMatch(/Brackenmoor Dimensional Works/);
    expect(await mailsTo('nobody-here@demo.test')).toBe(0);
  });

  it('answers before it looks the address up, so the timing cannot tell (the lookup is held back by a lock here)', async () => {
    // Structural rather than timed: with the users table locked, no lookup can run, yet the answer comes.
    const blocker = t.db.createQueryRunner();
    await blocker.connect();
    await blocker.startTransaction();
    await blocker.query(`LOCK TABLE users IN ACCESS EXCLUSIVE MODE`);
    try {
      const answer = await t.api.post('/api/auth/password-reset').send({ email: 'billing@demo.test' });
      expect(answer.status).toBe(202);
      expect(await mailsTo('billing@demo.test')).toBe(0);
    } finally {
      await blocker.commitTransaction();
      await blocker.release();
    }
    await mailedLink('billing@demo.test', 'reset-password');
  });

  it('sets a new password from the link once; every earlier session and token of the person stops working', async () => {
    const oldSession = await t.tokenFor('tech@demo.test');
    const otherDevice = await t.tokenFor('tech@demo.test');
    await t.api.post('/api/auth/password-reset').send({ email: 'tech@demo.test' });
    const { token } = await mailedLink('tech@demo.test', 'reset-password');
    const [row] = await t.db.query(`SELECT expires_at - created_at AS life FROM account_links WHERE token_hash = $1`, [
      createHash('sha256').update(token).digest('hex'),
    ]);
    expect(row.life).toMatchObject({ hours: 1 });
    expect((await t.api.post('/api/auth/password-reset/lookup').send({ token })).body.email).toBe('tech@demo.test');

    const done = await t.api.post('/api/auth/password-reset/complete').send({ token, password: 'thistle-basalt-orbit-64' });
    expect(done.status).toBe(204);
    expect((await t.api.get('/api/auth/me').set(bearer(oldSession))).status).toBe(401);
    expect((await t.api.get('/api/auth/me').set(bearer(otherDevice))).status).toBe(401);
    expect((await t.api.post('/api/auth/login').send({ email: 'tech@demo.test', password: 'nestkeeper-demo' })).status).toBe(401);
    expect(await t.tokenFor('tech@demo.test', 'thistle-basalt-orbit-64')).toBeTruthy();

    const reuse = await t.api.post('/api/auth/password-reset/complete').send({ token, password: 'thistle-basalt-orbit-65' });
    expect(reuse.status).toBe(410);
    expect(reuse.body.error.code).toBe('link_used');
    await waitUntil(
      'the password-changed notice',
      async () => (await t.db.query(`SELECT 1 FROM outbox_messages WHERE subject LIKE '%password was changed'`)).length,
    );
  });

  it('refuses an expired reset link (1 h) and a link replaced by a newer one', async () => {
    await t.api.post('/api/auth/password-reset').send({ email: 'owner@other.test' });
    const first = await mailedLink('owner@other.test', 'reset-password');
    await t.api.post('/api/auth/password-reset').send({ email: 'owner@other.test' });
    const second = await waitUntil('a newer reset link', async () => {
      const link = await mailedLink('owner@other.test', 'reset-password');
      return link.token !== first.token && link;
    });
    expect((await t.api.post('/api/auth/password-reset/lookup').send({ token: first.token })).body.error.code).toBe('link_withdrawn');
    await t.db.query(`UPDATE account_links SET expires_at = now() - interval '1 second' WHERE token_hash = $1`, [
      createHash('sha256').update(second.token).digest('hex'),
    ]);
    const expired = await t.api.post('/api/auth/password-reset/complete').send({ token: second.token, password: 'thistle-basalt-orbit-66' });
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('link_expired');
  });

  it('limits requests per e-mail (known or not, alike) and per address, counted in PostgreSQL', async () => {
    await t.db.query(`DELETE FROM login_attempts WHERE key LIKE 'reset-%'`);
    const ask = (email: string) => t.api.post('/api/auth/password-reset').send({ email });
    for (const email of ['owner@demo.test', 'no-account@demo.test']) {
      const statuses = [];
      for (let i = 0; i < 4; i += 1) statuses.push((await ask(i % 2 ? email.toUpperCase() : email)).status);
      expect(statuses).toEqual([202, 202, 202, 429]);
    }
    const [{ n }] = await t.db.query(`SELECT count(*)::int AS n FROM login_attempts WHERE key LIKE 'reset-email:%'`);
    expect(n).toBe(2);
    // Per address: 40 an hour here; 8 asked above, so 32 more different addresses pass and the next is refused.
    const statuses = [];
    for (let i = 0; i < 33; i += 1) statuses.push((await ask(`sweep${i}@demo.test`)).status);
    expect(statuses.slice(0, 32).every((s) => s === 202)).toBe(true);
    expect(statuses[32]).toBe(429);
  });
});

describe('two-step sign-in', () => {
  it('turns on with a confirmed code, stores the secret sealed, then asks for a code at sign-in; codes and recovery codes work once', async () => {
    const manager = await t.tokenFor('manager@demo.test');
    const started = await t.api.post('/api/account/second-step/start').set(bearer(manager));
    expect(started.status).toBe(200);
    expect(started.body.uri).toMatch(/^otpauth:\/\/totp\/.*secret=/);
    expect(started.body.qrDataUrl).toMatch(/^data:image\/png;base64,/);
    const { secret } = started.body as { secret: string };
    const [stored] = await t.db.query(`SELECT totp_secret FROM users WHERE email = 'manager@demo.test'`);
    expect(stored.totp_secret).not.toContain(secret);

    const wrong = await t.api
      .post('/api/account/second-step/confirm')
      .set(bearer(manager))
      .send({ code: codeFor(secret, Date.now() - 5 * 60_000) });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.code).toBe('wrong_code');
    const confirmedAt = Date.now();
    const confirmed = await t.api
      .post('/api/account/second-step/confirm')
      .set(bearer(manager))
      .send({ code: codeFor(secret, confirmedAt) });
    expect(confirmed.status).toBe(200);
    const codes: string[] = confirmed.body.recoveryCodes;
    expect(codes).toHaveLength(10);
    const [hashes] = await t.db.query(`SELECT recovery_code_hashes FROM users WHERE email = 'manager@demo.test'`);
    expect(hashes.recovery_code_hashes).toHaveLength(10);
    expect(JSON.stringify(hashes.recovery_code_hashes)).not.toContain(codes[0].replace('-', ''));

    const password = await t.api.post('/api/auth/login').send({ email: 'manager@demo.test', password: 'nestkeeper-demo' });
    expect(password.status).toBe(200);
    expect(password.body.token).toBeUndefined();
    expect(password.headers['set-cookie']).toBeUndefined();
    const { ticket } = password.body.secondStep;
    expect((await t.api.get('/api/auth/me').set(bearer(ticket))).status).toBe(401);

    // The code used to confirm is spent; the next time step's code (accepted one step early) works once.
    expect((await t.api.post('/api/auth/login/code').send({ ticket, code: codeFor(secret, confirmedAt) })).status).toBe(401);
    const next = codeFor(secret, confirmedAt + 30_000);
    const signedIn = await t.api.post('/api/auth/login/code').send({ ticket, code: next });
    expect(signedIn.status).toBe(200);
    expect((await t.api.get('/api/auth/me').set(bearer(signedIn.body.token))).body.secondStep).toMatchObject({ on: true, recoveryCodesLeft: 10 });
    expect((await t.api.post('/api/auth/login/code').send({ ticket, code: next })).status).toBe(401);

    const byRecovery = await t.api.post('/api/auth/login/code').send({ ticket, code: codes[3].toLowerCase() });
    expect(byRecovery.status).toBe(200);
    expect((await t.api.post('/api/auth/login/code').send({ ticket, code: codes[3] })).status).toBe(401);
    expect((await t.api.get('/api/auth/me').set(bearer(byRecovery.body.token))).body.secondStep.recoveryCodesLeft).toBe(9);
  });

  it('counts wrong codes against the sign-in limit', async () => {
    await t.db.query(`DELETE FROM login_attempts`);
    const { ticket } = (await t.api.post('/api/auth/login').send({ email: 'manager@demo.test', password: 'nestkeeper-demo' })).body.secondStep;
    const statuses = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await t.api.post('/api/auth/login/code').send({ ticket, code: '12345' + (i % 10) })).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it('lets the owner clear a colleague’s second step, with an audit line; the colleague then signs in with the password alone', async () => {
    const manager = (await t.api.get('/api/users?limit=500').set(bearer(owner))).body.items.find((u: { email: string }) => u.email === 'manager@demo.test');
    expect(manager.secondStepOn).toBe(true);
    const billing = await t.tokenFor('billing@demo.test');
    expect((await t.api.delete(`/api/users/${manager.id}/second-step`).set(bearer(billing))).status).toBe(403);
    const cleared = await t.api.delete(`/api/users/${manager.id}/second-step`).set(bearer(owner));
    expect(cleared.status).toBe(200);
    expect(cleared.body.secondStepOn).toBe(false);
    const [audit] = await t.db.query(`SELECT actor_user_id FROM audit_events WHERE action = 'user.second_step_cleared' AND subject_id = $1`, [manager.id]);
    expect(audit).toBeTruthy();
    await t.db.query(`DELETE FROM login_attempts`);
    expect(await t.tokenFor('manager@demo.test')).toBeTruthy();
  });

  it('when the firm requires it, an owner or billing clerk without it may only set it up; the technician is not asked', async () => {
    expect((await t.api.patch('/api/settings').set(bearer(owner)).send({ secondStepRequired: true })).status).toBe(200);
    const clerk = await t.tokenFor('billing@demo.test');
    const refused = await t.api.get('/api/customers').set(bearer(clerk));
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('second_step_required');
    expect((await t.api.get('/api/auth/me').set(bearer(clerk))).body.secondStep).toMatchObject({ on: false, requiredForRole: true, owed: true });
    const { secret } = (await t.api.post('/api/account/second-step/start').set(bearer(clerk))).body;
    expect(
      (
        await t.api
          .post('/api/account/second-step/confirm')
          .set(bearer(clerk))
          .send({ code: codeFor(secret) })
      ).status,
    ).toBe(200);
    expect((await t.api.get('/api/customers').set(bearer(clerk))).status).toBe(200);
    expect((await t.api.post('/api/account/second-step/off').set(bearer(clerk)).send({ password: 'nestkeeper-demo' })).body.error.code).toBe(
      'second_step_required',
    );
    const ilse = await t.tokenFor('ilse.farrow@demo.test', 'gannet-quarry-lantern-81');
    expect((await t.api.get('/api/auth/me').set(bearer(ilse))).body.secondStep.owed).toBe(false);
    expect((await t.api.get('/api/bookings').set(bearer(ilse))).status).toBe(200);
    // Someone invited into such a role is signed in on accepting, and asked for the second step first too.
    await t.api
      .post('/api/invitations')
      .set(bearer(await t.tokenFor('owner@other.test')))
      .send({ email: 'new.clerk@other.test', role: 'billing' });
    await t.db.query(`UPDATE organizations SET settings = settings || '{"secondStepRequired": true}' WHERE name <> 'Brackenmoor Dimensional Works'`);
    const { token } = await mailedLink('new.clerk@other.test', 'join');
    const joined = await t.api.post('/api/invitations/accept').send({ token, name: 'Nell Clerkwood', password: 'copperplate-lagoon-vesper-35' });
    expect(joined.status).toBe(201);
    expect((await t.api.get('/api/customers').set(bearer(joined.body.token))).body.error.code).toBe('second_step_required');
    await t.db.query(`UPDATE organizations SET settings = settings - 'secondStepRequired'`);
    await t.api.patch('/api/settings').set(bearer(owner)).send({ secondStepRequired: false });
  });
});

describe('sessions', () => {
  it('lists where a person is signed in, ends one, and signs out everywhere', async () => {
    const login = (agent: string) => t.api.post('/api/auth/login').set('User-Agent', agent).send({ email: 'owner@other.test', password: 'nestkeeper-demo' });
    const laptop = (await login('Laptop browser')).body.token;
    const phone = (await login('Phone browser')).body.token;
    const third = (await login('Workshop tablet')).body.token;
    const listed = (await t.api.get('/api/account/sessions').set(bearer(laptop))).body.items;
    expect(listed.map((s: { device: string }) => s.device)).toEqual(expect.arrayContaining(['Laptop browser', 'Phone browser', 'Workshop tablet']));
    expect(listed.find((s: { current: boolean }) => s.current).device).toBe('Laptop browser');

    const phoneId = listed.find((s: { device: string }) => s.device === 'Phone browser').id;
    expect((await t.api.delete(`/api/account/sessions/${phoneId}`).set(bearer(laptop))).status).toBe(204);
    expect((await t.api.get('/api/auth/me').set(bearer(phone))).status).toBe(401);
    expect((await t.api.get('/api/auth/me').set(bearer(third))).status).toBe(200);

    // Signing out ends this session only; "everywhere" ends the rest.
    expect((await t.api.post('/api/auth/logout').set(bearer(third))).status).toBe(204);
    expect((await t.api.get('/api/auth/me').set(bearer(third))).status).toBe(401);
    expect((await t.api.get('/api/auth/me').set(bearer(laptop))).status).toBe(200);
    const fourth = (await login('Spare laptop')).body.token;
    expect((await t.api.post('/api/account/sign-out-everywhere').set(bearer(fourth))).status).toBe(204);
    for (const token of [laptop, fourth]) expect((await t.api.get('/api/auth/me').set(bearer(token))).status).toBe(401);
  });

  it('moves "last seen" at most once a minute', async () => {
    const token = (await t.api.post('/api/auth/login').send({ email: 'owner@other.test', password: 'nestkeeper-demo' })).body.token;
    const { jti } = JSON.parse(Buffer.from(token.split('.')[1], 'base64url').toString());
    await t.db.query(`UPDATE user_sessions SET last_seen_at = now() - interval '30 seconds' WHERE id = $1`, [jti]);
    await t.api.get('/api/auth/me').set(bearer(token));
    const [recent] = await t.db.query(`SELECT now() - last_seen_at >= interval '30 seconds' AS kept FROM user_sessions WHERE id = $1`, [jti]);
    expect(recent.kept).toBe(true);
    await t.db.query(`UPDATE user_sessions SET last_seen_at = now() - interval '5 minutes' WHERE id = $1`, [jti]);
    await t.api.get('/api/auth/me').set(bearer(token));
    const [moved] = await t.db.query(`SELECT now() - last_seen_at < interval '1 minute' AS moved FROM user_sessions WHERE id = $1`, [jti]);
    expect(moved.moved).toBe(true);
  });
});
