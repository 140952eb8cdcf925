import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSmtpSink, type SinkMessage, type SmtpSink } from '../../server/fakes/smtp-sink';
import { eventually } from '../support/eventually';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let sink: SmtpSink;
let owner: string;
let tech: string;
const received: SinkMessage[] = [];

beforeAll(async () => {
  sink = await startSmtpSink({ port: 0, store: async (m) => void received.push(m) });
  t = await createTestApp({ SMTP_PORT: String(sink.port) });
  [owner, tech] = await Promise.all(['owner@demo.test', 'tech@demo.test'].map((e) => t.tokenFor(e)));
  await t.routines.run('deliver-outbox', 'manual'); // the seed's welcome mails
});
afterAll(async () => {
  await t?.close();
  await sink?.close();
});

/** Send the outbox now and wait for the mail whose subject matches. */
async function delivered(subject: RegExp): Promise<SinkMessage> {
  await t.routines.run('deliver-outbox', 'manual');
  await eventually(() => received.some((m) => subject.test(m.subject))).toBe(true);
  return received.filter((m) => subject.test(m.subject)).at(-1)!;
}

const settings = (patch: object) => t.api.patch('/api/settings').set(bearer(owner)).send(patch);

/** A damage report on a ready demo item (trackers first) at a fixed moment, so its mail's date and time are known; its tag. */
async function reportDamage(): Promise<string> {
  const [asset] = await t.db.query(
    `SELECT id, asset_tag AS tag FROM assets WHERE status = 'ready' AND type <> 'battery' AND asset_tag <> 'TRK-001' ORDER BY type = 'tracker' DESC, asset_tag LIMIT 1`,
  );
  const res = await t.api
    .post('/api/incidents')
    .set(bearer(tech))
    .field('assetId', asset.id)
    .field('kind', 'dropped')
    .field('description', 'Slid off the tripod head onto the mat.')
    .field('occurredAt', '2026-12-01T15:30:00Z');
  expect(res.status).toBe(201);
  return asset.tag;
}

describe('mail in the firm’s name', () => {
  it('comes from the firm’s name at the sending address, with its Reply-To, signed with its name and address', async () => {
    expect((await settings({ mailReplyTo: 'office@brackenmoor.test' })).status).toBe(200);
    const tag2 = await reportDamage();
    const mail = await delivered(new RegExp(`^${tag2} reported dropped`));
    expect(mail.headers.from).toMatch(/^"?Brackenmoor Dimensional Works"? <no-reply@nestkeeper\.test>$/);
    expect(mail.from).toBe('no-reply@nestkeeper.test');
    expect(mail.headers['reply-to']).toMatch(/office@brackenmoor\.test/);
    // The signature: the firm's name, then its address from the invoice details (demo seed: "Forge Lane 12, 41877 Wrenhallow").
    expect(mail.text).toMatch(/\n--\n+Brackenmoor Dimensional Works\nForge Lane 12, 41877 Wrenhallow\n/);
    expect(mail.html).toContain('Forge Lane 12, 41877 Wrenhallow');
    expect(mail.text).not.toMatch(/Reply to your shop manager/);
    expect(mail.text.replace(/\s+/g, ' ')).toContain(`the laser tracker ${tag2}, serial `);
  });

  it('leaves Reply-To out when the firm has none', async () => {
    expect((await settings({ mailReplyTo: '' })).status).toBe(200);
    const tag3 = await reportDamage();
    const mail = await delivered(new RegExp(`^${tag3} reported dropped`));
    expect(mail.headers['reply-to']).toBeUndefined();
    expect(mail.text).toMatch(/This sending address\s+reads no replies/);
  });

  it('writes dates and times in the firm’s locale and zone: en-GB in Berlin, then en-US in Chicago', async () => {
    // 2026-12-01 15:30 UTC is 16:30 in Berlin (CET, UTC+1 in winter) and 9:30 in Chicago (CST, UTC−6 in winter): IANA tz
    // database offsets. Date order per CLDR: en-GB "1 Dec 2026", en-US "Dec 1, 2026" (both from memory).
    const tag4 = await reportDamage();
    const berlin = await delivered(new RegExp(`^${tag4} reported dropped`));
    expect(berlin.text).toMatch(/Reported for 1 Dec 2026, 16:30\sCET/);
    expect(berlin.text).not.toMatch(/2026-12-01/);

    expect((await settings({ locale: 'en-US', timeZone: 'America/Chicago' })).status).toBe(200);
    const tag5 = await reportDamage();
    const chicago = await delivered(new RegExp(`^${tag5} reported dropped`));
    expect(chicago.text).toMatch(/Reported for Dec 1, 2026, 9:30\sAM CST/);
    expect(chicago.text).not.toMatch(/1 Dec 2026|16:30|2026-12-01/);
    await settings({ locale: 'en-GB', timeZone: 'Europe/Berlin' });
  });
});

describe('customer notices of an impact review, edited before sending', () => {
  it('drafts a letter, refuses empty or stale edits, sends the edited words and says when each went', async () => {
    expect((await settings({ mailReplyTo: 'quality@brackenmoor.test' })).status).toBe(200);
    const [{ id: reviewId, asset_id: assetId }] = await t.db.query(
      `SELECT r.id, r.asset_id FROM impact_reviews r JOIN assets a ON a.id = r.asset_id WHERE a.asset_tag = 'TRK-001' AND r.state = 'open'`,
    );
    const url = `/api/impact-reviews/${reviewId}/notices`;
    const draft = (await t.api.post(url).set(bearer(owner)).send({})).body;
    expect(draft.sender).toEqual({ name: 'Brackenmoor Dimensional Works', replyTo: 'quality@brackenmoor.test', address: 'Forge Lane 12, 41877 Wrenhallow' });
    const [first] = draft.drafts;
    expect(first.text).toMatch(/^Dear /);
    expect(first.text.replace(/\s+/g, ' ')).toMatch(/the laser tracker TRK-001, serial \S+/);
    expect(first.text).not.toMatch(/job\(s\)|\d{4}-\d{2}-\d{2}/);
    expect(first.subject).toMatch(/TRK-001/);

    const empty = await t.api
      .post(url)
      .set(bearer(owner))
      .send({ send: true, notices: [{ to: first.to, group: first.group, subject: first.subject, text: '   ' }] });
    expect(empty.status).toBe(400);
    expect(empty.body.error).toMatchObject({ code: 'invalid_input', details: { fields: { 'notices.0.text': 'a notice needs its text' } } });
    const stale = await t.api
      .post(url)
      .set(bearer(owner))
      .send({ send: true, notices: [{ to: 'nobody@elsewhere.test', group: 'pending', subject: 'x', text: 'y' }] });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect((await t.db.query(`SELECT count(*)::int AS n FROM outbox_messages WHERE subject = $1`, [first.subject]))[0].n).toBe(0);

    const words = `${first.text}\n\nWe will ring you on Monday to agree a day for the re-measurement.`;
    const sent = await t.api
      .post(url)
      .set(bearer(owner))
      .send({ send: true, notices: [{ to: first.to, group: first.group, subject: 'Your measurements with TRK-001: a re-measurement offer', text: words }] });
    expect(sent.status).toBe(200);
    expect(sent.body.sent).toBe(true);

    const [audit] = await t.db.query(`SELECT details FROM audit_events WHERE action = 'impact_review.notices_sent' ORDER BY id DESC LIMIT 1`);
    expect(audit.details.notices).toContainEqual(
      expect.objectContaining({ to: first.to, edited: true, subject: 'Your measurements with TRK-001: a re-measurement offer', text: words }),
    );
    const waiting = (await t.api.get(`/api/assets/${assetId}/impact`).set(bearer(owner))).body;
    expect(waiting.bookings.find((b: { contactEmail: string }) => b.contactEmail === first.to)).toMatchObject({ noticeSentAt: null });

    const mail = await delivered(/^Your measurements with TRK-001: a re-measurement offer$/);
    expect(mail.to).toEqual([first.to]);
    expect(mail.text).toMatch(/We will ring you on Monday to agree a day for the\s+re-measurement\./);
    expect(mail.html).toContain('We will ring you on Monday to agree a day for the re-measurement.');
    expect(mail.headers['reply-to']).toMatch(/quality@brackenmoor\.test/);
    const after = (await t.api.get(`/api/assets/${assetId}/impact`).set(bearer(owner))).body;
    expect(after.bookings.find((b: { contactEmail: string }) => b.contactEmail === first.to).noticeSentAt).toEqual(expect.any(String));
    expect((await t.api.post(url).set(bearer(tech)).send({ send: true })).status).toBe(403);
  });
});
