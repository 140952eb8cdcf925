import nodemailer from 'nodemailer';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Scoped } from '../../server/db/scoped';
import { pgSinkStore, startSmtpSink, type SmtpSink } from '../../server/fakes/smtp-sink';
import { backoffSeconds, deliverOutbox } from '../../server/notifications/outbox-sender';
import { letterTemplate } from '../../server/notifications/mail-template';
import { enqueueMail } from '../../server/notifications/outbox';
import { Organization } from '../../server/organizations/organization.entity';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let pool: pg.Pool;
let sink: SmtpSink;
let transport: ReturnType<typeof nodemailer.createTransport>;
const FROM = 'Nestkeeper <no-reply@nestkeeper.test>';

beforeAll(async () => {
  t = await createTestApp();
  pool = new pg.Pool({ connectionString: t.config.DATABASE_URL, max: 2 });
  sink = await startSmtpSink({ port: 0, store: pgSinkStore(pool) });
  transport = nodemailer.createTransport({ host: '127.0.0.1', port: sink.port, secure: false, ignoreTLS: true });
});
afterAll(async () => {
  await sink.close();
  await pool.end();
  await t.close();
});

async function queueOne(subject: string) {
  const org = await t.db.getRepository(Organization).findOneByOrFail({ name: 'Brackenmoor Dimensional Works' });
  return t.db.transaction((m) => enqueueMail(new Scoped(m, org.id), ['manager@demo.test'], letterTemplate, { subject, text: 'A check of the outbox.' }));
}

const sinkCount = async (messageId: string) =>
  Number((await t.db.query(`SELECT count(*) AS n FROM mail_sink_messages WHERE message_id = $1`, [messageId]))[0].n);

describe('e-mail outbox', () => {
  it('keeps a message while the SMTP server is down and delivers it exactly once after it returns', async () => {
    await deliverOutbox(t.db, transport, FROM); // clear the seed's welcome mails
    const queued = await queueOne('Outage test');

    sink.setAccepting(false);
    const during = await deliverOutbox(t.db, transport, FROM);
    expect(during).toMatchObject({ sent: 0, deferred: 1, pending: 1 });
    const [row] = await t.db.query(`SELECT attempts, last_error, next_attempt_at > now() AS later FROM outbox_messages WHERE id = $1`, [queued.id]);
    expect(row).toMatchObject({ attempts: 1, later: true });
    expect(row.last_error).toMatch(/421/);
    expect(await sinkCount(queued.messageId)).toBe(0);

    // Not due yet: a second pass during the pause leaves it alone.
    sink.setAccepting(true);
    expect(await deliverOutbox(t.db, transport, FROM)).toMatchObject({ sent: 0, pending: 1 });

    await t.db.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE id = $1`, [queued.id]);
    expect(await deliverOutbox(t.db, transport, FROM)).toMatchObject({ sent: 1, deferred: 0, pending: 0 });
    expect(await deliverOutbox(t.db, transport, FROM)).toMatchObject({ sent: 0, pending: 0 });
    expect(await sinkCount(queued.messageId)).toBe(1);
  });

  it('survives the SMTP port being closed altogether', async () => {
    const queued = await queueOne('Closed port test');
    const port = sink.port;
    await sink.close();
    expect(await deliverOutbox(t.db, transport, FROM)).toMatchObject({ sent: 0, deferred: 1 });
    sink = await startSmtpSink({ port, store: pgSinkStore(pool) });
    await t.db.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE id = $1`, [queued.id]);
    expect(await deliverOutbox(t.db, transport, FROM)).toMatchObject({ sent: 1 });
    expect(await sinkCount(queued.messageId)).toBe(1);
  });

  it('two senders at once deliver each message once', async () => {
    const queued = await Promise.all([1, 2, 3, 4, 5].map((i) => queueOne(`Race ${i}`)));
    const [a, b] = await Promise.all([deliverOutbox(t.db, transport, FROM), deliverOutbox(t.db, transport, FROM)]);
    expect(a.sent + b.sent).toBe(5);
    for (const q of queued) expect(await sinkCount(q.messageId)).toBe(1);
  });

  it('backs off 30 s, 1 min, 2 min … and never more than an hour', () => {
    expect([1, 2, 3, 4].map(backoffSeconds)).toEqual([30, 60, 120, 240]);
    expect(backoffSeconds(30)).toBe(3600);
  });

  it("shows the owner only their own firm's mail in the mailbox, with text and HTML bodies", async () => {
    const owner = await t.tokenFor('owner@demo.test');
    const mine = await t.api.get('/api/mailbox').set(bearer(owner));
    expect(mine.status).toBe(200);
    const subjects = mine.body.items.map((m: { subject: string }) => m.subject);
    expect(subjects).toContain('Outage test');
    expect(subjects).toContain('Welcome to Nestkeeper, Brackenmoor Dimensional Works');
    expect(subjects).not.toContain('Welcome to Nestkeeper, Pellbrook Gauge & Survey');
    const welcome = mine.body.items.find((m: { subject: string }) => m.subject.startsWith('Welcome'));
    expect(welcome.text).toMatch(/Nestkeeper is ready/);
    expect(welcome.html).toMatch(/<h1/);

    const other = await t.api.get('/api/mailbox').set(bearer(await t.tokenFor('owner@other.test')));
    expect(other.body.items.map((m: { subject: string }) => m.subject)).toEqual(['Welcome to Nestkeeper, Pellbrook Gauge & Survey']);
    expect((await t.api.get('/api/mailbox').set(bearer(await t.tokenFor('manager@demo.test')))).status).toBe(403);
  });
});
