import nodemailer from 'nodemailer';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { pgSinkStore, startSmtpSink, type SinkMessage, type SmtpSink } from '../../server/fakes/smtp-sink';
import { fakesLog } from '../../server/fakes/log';

const transportTo = (port: number) => nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });

describe('SMTP sink', () => {
  const received: SinkMessage[] = [];
  let sink: SmtpSink;

  beforeAll(async () => {
    sink = await startSmtpSink({ port: 0, store: async (m) => void received.push(m) });
  });
  afterAll(async () => {
    await sink.close();
  });

  it('receives real SMTP from nodemailer and parses envelope, text, html and headers', async () => {
    const info = await transportTo(sink.port).sendMail({
      from: 'Nestkeeper <no-reply@nestkeeper.test>',
      to: 'Ines Marlow <ines@fernbrook-metrology.test>',
      bcc: 'records@fernbrook-metrology.test',
      subject: 'Tracker LT-07 is due for calibration — 14 days',
      text: 'LT-07 calibration is due on 2031-05-02.',
      html: '<p>LT-07 calibration is due on <b>2031-05-02</b>.</p>',
      headers: { 'X-Nestkeeper-Kind': 'due-soon' },
    });
    expect(info.accepted).toHaveLength(2);

    expect(received).toHaveLength(1);
    const m = received[0]!;
    expect(m.messageId).toBe(info.messageId);
    expect(m.from).toBe('no-reply@nestkeeper.test');
    expect(m.to).toEqual(['ines@fernbrook-metrology.test', 'records@fernbrook-metrology.test']);
    expect(m.subject).toBe('Tracker LT-07 is due for calibration — 14 days');
    expect(m.text.trim()).toBe('LT-07 calibration is due on 2031-05-02.');
    expect(m.html).toBe('<p>LT-07 calibration is due on <b>2031-05-02</b>.</p>');
    expect(m.headers['x-nestkeeper-kind']).toBe('due-soon');
    expect(m.headers.from).toMatch(/Nestkeeper.* <no-reply@nestkeeper\.test>/);
    expect(m.headers.subject).toBe(m.subject);
    expect(m.headers).not.toHaveProperty('bcc');
    expect(m.receivedAt).toBeInstanceOf(Date);
  });

  it('keeps html null for a text-only message', async () => {
    await transportTo(sink.port).sendMail({
      from: 'no-reply@nestkeeper.test',
      to: 'desk@fernbrook-metrology.test',
      subject: 'Plain',
      text: 'Only text.',
    });
    expect(received.at(-1)).toMatchObject({ subject: 'Plain', html: null });
  });

  it('refuses mail with a 4xx while not accepting, and takes it again afterwards', async () => {
    const before = received.length;
    sink.setAccepting(false);
    const error = await transportTo(sink.port)
      .sendMail({ from: 'no-reply@nestkeeper.test', to: 'a@fernbrook-metrology.test', subject: 'outage', text: 'x' })
      .catch((e: unknown) => e as { responseCode?: number });
    expect(error).toBeInstanceOf(Error);
    expect(error.responseCode).toBeGreaterThanOrEqual(400);
    expect(error.responseCode).toBeLessThan(500);
    expect(received.length).toBe(before);

    sink.setAccepting(true);
    await transportTo(sink.port).sendMail({
      from: 'no-reply@nestkeeper.test',
      to: 'a@fernbrook-metrology.test',
      subject: 'after outage',
      text: 'x',
    });
    expect(received.at(-1)?.subject).toBe('after outage');
  });

  it('refuses on a connection that was already open when it stopped accepting', async () => {
    const pooled = nodemailer.createTransport({
      host: '127.0.0.1',
      port: sink.port,
      secure: false,
      ignoreTLS: true,
      pool: true,
      maxConnections: 1,
    });
    const mail = { from: 'no-reply@nestkeeper.test', to: 'b@fernbrook-metrology.test', text: 'x' };
    await pooled.sendMail({ ...mail, subject: 'pooled 1' });
    sink.setAccepting(false);
    const error = await pooled.sendMail({ ...mail, subject: 'pooled 2' }).catch((e: unknown) => e as { responseCode?: number });
    sink.setAccepting(true);
    pooled.close();
    expect(error.responseCode).toBe(421);
  });

  it('answers 451 and keeps nothing when the store fails, so the sender retries', async () => {
    const quiet = vi.spyOn(fakesLog, 'error').mockImplementation(() => undefined);
    const failing = await startSmtpSink({ port: 0, store: async () => Promise.reject(new Error('database down')) });
    const error = await transportTo(failing.port)
      .sendMail({ from: 'no-reply@nestkeeper.test', to: 'c@fernbrook-metrology.test', subject: 's', text: 'x' })
      .catch((e: unknown) => e as { responseCode?: number });
    await failing.close();
    expect(error.responseCode).toBe(451);
    expect(quiet).toHaveBeenCalled();
    quiet.mockRestore();
  });
});

describe('SMTP sink lifecycle', () => {
  it('can be closed and started again on the same port', async () => {
    const got: string[] = [];
    const store = async (m: SinkMessage) => void got.push(m.subject);
    const first = await startSmtpSink({ port: 0, store });
    const port = first.port;
    await transportTo(port).sendMail({ from: 'a@nestkeeper.test', to: 'b@nestkeeper.test', subject: 'one', text: '1' });
    await first.close();

    await expect(transportTo(port).sendMail({ from: 'a@nestkeeper.test', to: 'b@nestkeeper.test', subject: 'lost', text: '2' })).rejects.toMatchObject({
      code: 'ESOCKET',
    });

    const second = await startSmtpSink({ port, store });
    expect(second.port).toBe(port);
    await transportTo(port).sendMail({ from: 'a@nestkeeper.test', to: 'b@nestkeeper.test', subject: 'two', text: '3' });
    await second.close();
    expect(got).toEqual(['one', 'two']);
  });
});

// Against the real migrated schema, in a throwaway database (`npm test` sets TEST_PG_URL).
describe.skipIf(!process.env.TEST_PG_URL)('pgSinkStore', () => {
  let database: Awaited<ReturnType<typeof import('../support/test-db').createTestDatabase>>;
  let pool: pg.Pool;

  beforeAll(async () => {
    const { createTestDatabase } = await import('../support/test-db');
    database = await createTestDatabase();
    pool = new pg.Pool({ connectionString: database.url, max: 2 });
  });
  afterAll(async () => {
    await pool?.end();
    await database?.drop();
  });

  it('stores each message once, even when the same Message-ID is delivered twice', async () => {
    const sink = await startSmtpSink({ port: 0, store: pgSinkStore(pool) });
    const mail = {
      from: 'no-reply@nestkeeper.test',
      to: ['owner@fernbrook-metrology.test', 'desk@fernbrook-metrology.test'],
      subject: 'Deposit hold renewed for rental R-1031',
      text: 'Renewed.',
      html: '<p>Renewed.</p>',
      messageId: '<r1031-renewal@nestkeeper.test>',
    };
    await transportTo(sink.port).sendMail(mail);
    await transportTo(sink.port).sendMail(mail);
    await transportTo(sink.port).sendMail({ ...mail, messageId: undefined, subject: 'No explicit id' });
    await sink.close();

    const { rows } = await pool.query(
      'SELECT message_id, envelope_from, recipients, subject, text_body, html_body, headers FROM mail_sink_messages ORDER BY received_at',
    );
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({
      message_id: '<r1031-renewal@nestkeeper.test>',
      envelope_from: 'no-reply@nestkeeper.test',
      recipients: ['owner@fernbrook-metrology.test', 'desk@fernbrook-metrology.test'],
      subject: 'Deposit hold renewed for rental R-1031',
      html_body: '<p>Renewed.</p>',
    });
    expect(rows[0].text_body.trim()).toBe('Renewed.');
    expect(rows[0].headers['message-id']).toBe('<r1031-renewal@nestkeeper.test>');
  });
});
