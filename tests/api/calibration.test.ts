import { DateTime } from 'luxon';
import nodemailer from 'nodemailer';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../../shared/calibration/due-date';
import { renderPdf } from '../../server/documents/pdf';
import { pgSinkStore, startSmtpSink } from '../../server/fakes/smtp-sink';
import { RoutinesService } from '../../server/routines/routines.service';
import { dueScanRoutine } from '../../server/calibration/due-scan.routine';
import { deliverOutbox } from '../../server/notifications/outbox-sender';
import { activeChanges, certificateWith } from '../support/pdf-fixtures';
import { bearer, createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let owner: string;
let manager: string;
let tech: string;
let otherOwner: string;
let certificate: Buffer;
const today = todayIn('Europe/Berlin');

beforeAll(async () => {
  t = await createTestApp();
  [owner, manager, tech, otherOwner] = await Promise.all(
    ['owner@demo.test', 'manager@demo.test', 'tech@demo.test', 'owner@other.test'].map((e) => t.tokenFor(e)),
  );
  certificate = await renderPdf({ size: 'A4' }, (doc) => doc.text('Calibration certificate FCL-2026-0415 (test document)'));
});
afterAll(() => t.close());

let serial = 0;
async function tracker(last: string, interval = 12) {
  serial += 1;
  return (
    await t.api
      .post('/api/assets')
      .set(bearer(manager))
      .send({
        type: 'tracker',
        assetTag: `TRK-C${serial}`,
        serialNumber: `TC${serial}`,
        calibration: { required: true, intervalMonths: interval, lastCalibratedOn: last },
      })
  ).body as { id: string; assetTag: string };
}
const record = (token: string, assetId: string, fields: Record<string, string>, file: Buffer = certificate, name = 'certificate.pdf') => {
  const req = t.api.post(`/api/assets/${assetId}/calibrations`).set(bearer(token));
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('certificate', file, { filename: name, contentType: 'application/pdf' });
};
const fields = (performedOn: string, asFound = 'in_tolerance', extra: Record<string, string> = {}) => ({
  performedOn,
  provider: 'Fenmoor Calibration Lab',
  certificateNumber: `FCL-${performedOn}`,
  asFound,
  asLeft: 'in_tolerance',
  ...extra,
});

describe('recording calibrations', () => {
  it.each([
    ['2026-01-31', 1, '2026-02-28'],
    ['2024-02-29', 12, '2025-02-28'],
    ['2025-08-31', 6, '2026-02-28'],
    ['2026-05-31', 3, '2026-08-31'],
  ])('an event performed %s with a %i-month interval moves the due date to %s (checked with Luxon)', async (performedOn, months, due) => {
    const a = await tracker('2023-01-01');
    const res = await record(manager, a.id, fields(performedOn, 'in_tolerance', { intervalMonths: String(months) }));
    expect(res.status).toBe(201);
    expect(res.body.dueOn).toBe(due);
    expect(DateTime.fromISO(performedOn).plus({ months }).toISODate()).toBe(due);
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).body.calibration).toMatchObject({
      lastCalibratedOn: performedOn,
      intervalMonths: months,
      dueOn: due,
    });
  });

  it('refuses a file that is not a PDF even when named .pdf (415), and a missing certificate (400)', async () => {
    const a = await tracker('2026-01-01');
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex');
    expect((await record(manager, a.id, fields('2026-11-01'), png, 'certificate.pdf')).status).toBe(415);
    const none = await t.api.post(`/api/assets/${a.id}/calibrations`).set(bearer(manager)).field('performedOn', '2026-11-01');
    expect(none.status).toBe(400);
    expect(Object.keys(none.body.error.details.fields).sort()).toEqual(['asFound', 'asLeft', 'certificateNumber', 'provider']);
    expect((await t.api.get(`/api/assets/${a.id}/calibrations`).set(bearer(manager))).body.items).toHaveLength(0);
  });

  it('refuses two certificates (413), one in another field (400) and an oversized form (413), keeping nothing', async () => {
    const a = await tracker('2026-01-01');
    const twice = record(manager, a.id, fields('2026-11-01')).attach('certificate', certificate, { filename: 'again.pdf', contentType: 'application/pdf' });
    expect((await twice).body.error).toMatchObject({ code: 'too_large', message: 'Attach at most 1 file, in the "certificate" field.' });
    const elsewhere = t.api
      .post(`/api/assets/${a.id}/calibrations`)
      .set(bearer(manager))
      .attach('file', certificate, { filename: 'certificate.pdf', contentType: 'application/pdf' });
    expect((await elsewhere).status).toBe(400);
    const crowded = t.api.post(`/api/assets/${a.id}/calibrations`).set(bearer(manager));
    for (let i = 0; i < 21; i += 1) crowded.field(`note${i}`, 'x');
    expect((await crowded).body.error).toMatchObject({ code: 'too_large', message: expect.stringMatching(/^The form is larger than Nestkeeper accepts/) });
    expect((await t.api.get(`/api/assets/${a.id}/calibrations`).set(bearer(manager))).body.items).toHaveLength(0);
  });

  it('refuses a PDF header followed by HTML as not a PDF (415), keeping nothing', async () => {
    const a = await tracker('2026-01-01');
    const res = await record(
      manager,
      a.id,
      fields('2026-11-01'),
      Buffer.from('%PDF-1.7\n<html><body><script>alert(1)</script></body></html>'),
      'certificate.pdf',
    );
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_type', message: expect.stringMatching(/^"certificate\.pdf" is not a PDF: /) });
    expect((await t.api.get(`/api/assets/${a.id}/calibrations`).set(bearer(manager))).body.items).toHaveLength(0);
  });

  // ISO 32000-1 names: a JavaScript /OpenAction, the /Names /JavaScript tree, /EmbeddedFiles, a /Launch link, a page's /AA, /XFA.
  it.each([
    ['openActionJavaScript', ['/JavaScript', '/OpenAction'], /JavaScript and an action run when the document opens/],
    ['namesJavaScript', ['/JavaScript'], /contains JavaScript\./],
    ['embeddedFile', ['/EmbeddedFiles'], /embedded files/],
    ['launchLink', ['/Launch'], /an action that starts a program/],
    ['pageOpenJavaScript', ['/JavaScript', '/AA'], /actions run on page or field events/],
    ['xfaForm', ['/XFA'], /an XFA form/],
  ])('refuses a certificate with active content (%s) with 422 naming what was found, keeping nothing', async (fixture, found, words) => {
    const a = await tracker('2026-01-01');
    const res = await record(manager, a.id, fields('2026-11-01'), await certificateWith(activeChanges[fixture]), 'OCL-7781.pdf');
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'certificate_active_content', details: { found } });
    expect(res.body.error.message).toMatch(words);
    expect(res.body.error.message).toMatch(/^"OCL-7781\.pdf" contains /);
    expect((await t.api.get(`/api/assets/${a.id}/calibrations`).set(bearer(manager))).body.items).toHaveLength(0);
  });

  it('refuses an encrypted certificate it cannot check (422)', async () => {
    const a = await tracker('2026-01-01');
    const locked = await renderPdf({ size: 'A4', ownerPassword: 'lab-owner-secret' }, (doc) => doc.text('Certificate OCL-7790'));
    const res = await record(manager, a.id, fields('2026-11-01'), locked);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('certificate_encrypted');
  });

  it('opens a clean certificate in the browser, but sends one stored before the check as a download', async () => {
    const a = await tracker('2026-01-01');
    const event = (await record(manager, a.id, fields('2026-11-04'))).body;
    const clean = await t.api.get(event.certificateUrl).set(bearer(tech)).buffer(true);
    expect(clean.headers['content-disposition']).toMatch(/^inline; /);
    // An older upload with a script, written straight to the table as if it predated the check.
    const scripted = await certificateWith(activeChanges.openActionJavaScript);
    await t.db.query(`UPDATE certificate_files SET data = $1 WHERE id = (SELECT certificate_file_id FROM calibration_events WHERE id = $2)`, [
      scripted,
      event.id,
    ]);
    const old = await t.api.get(event.certificateUrl).set(bearer(tech)).buffer(true);
    expect(old.status).toBe(200);
    expect(old.headers['content-type']).toBe('application/pdf');
    expect(old.headers['content-disposition']).toMatch(/^attachment; /);
  });

  it('serves the certificate to the firm only, and only lets the right roles record', async () => {
    const a = await tracker('2026-01-01');
    const event = (await record(manager, a.id, fields('2026-11-02'))).body;
    const pdf = await t.api.get(event.certificateUrl).set(bearer(tech)).buffer(true);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await t.api.get(event.certificateUrl).set(bearer(otherOwner))).status).toBe(404);
    expect((await record(tech, a.id, fields('2026-11-03'))).status).toBe(403);
    expect((await record(otherOwner, a.id, fields('2026-11-03'))).status).toBe(404);
  });

  it('suggests a longer interval after two in-tolerance results and applies it only when the owner accepts', async () => {
    const a = await tracker('2024-06-01');
    await record(manager, a.id, fields('2025-06-01'));
    const second = (await record(manager, a.id, fields('2026-06-01'))).body;
    expect(second).toMatchObject({ intervalMonths: 12, suggestedIntervalMonths: 15, intervalDecision: null });
    expect((await t.api.post(`/api/calibrations/${second.id}/interval`).set(bearer(manager)).send({ decision: 'accept' })).status).toBe(403);
    const accepted = await t.api.post(`/api/calibrations/${second.id}/interval`).set(bearer(owner)).send({ decision: 'accept' });
    expect(accepted.body.intervalDecision).toBe('accepted');
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).body.calibration).toMatchObject({ intervalMonths: 15, dueOn: '2027-09-01' });
    const history = (await t.api.get(`/api/assets/${a.id}/history`).set(bearer(owner))).body.items.map((i: { action: string }) => i.action);
    expect(history).toContain('calibration.interval_accepted');
  });
});

describe("a hold began on the firm's calendar day, not UTC's", () => {
  it('in Pacific/Auckland, a certificate dated the day before the drop does not release the hold; one dated the drop day does', async () => {
    expect((await t.api.patch('/api/settings').set(bearer(otherOwner)).send({ timeZone: 'Pacific/Auckland' })).status).toBe(200);
    const asset = (await t.api.post('/api/assets').set(bearer(otherOwner)).send({ type: 'tracker', assetTag: 'TRK-NZ1', serialNumber: 'S-NZ1' })).body as {
      id: string;
    };
    expect((await t.api.post(`/api/assets/${asset.id}/hold`).set(bearer(otherOwner)).send({ summary: 'Knocked off its stand' })).status).toBe(201);
    // Dropped at 00:30 Auckland time ten days ago: still the previous day in UTC (NZ is UTC+12/+13; tz database via Luxon).
    const dropDay = addDays(todayIn('Pacific/Auckland'), -10);
    const drop = DateTime.fromISO(`${dropDay}T00:30`, { zone: 'Pacific/Auckland' });
    expect(drop.toUTC().toISODate()).toBe(addDays(dropDay, -1));
    await t.db.query(`UPDATE holds SET started_at = $1 WHERE asset_id = $2`, [drop.toJSDate(), asset.id]);
    const status = async () => (await t.api.get(`/api/assets/${asset.id}`).set(bearer(otherOwner))).body.status;

    expect((await record(otherOwner, asset.id, fields(addDays(dropDay, -1)))).status).toBe(201);
    expect(await status()).toBe('held');
    const refused = await t.api.post(`/api/assets/${asset.id}/release`).set(bearer(otherOwner)).send({});
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('release_needs_evidence');

    expect((await record(otherOwner, asset.id, fields(dropDay))).status).toBe(201);
    expect(await status()).toBe('ready');
  });
});

describe('interval suggestions never move against the evidence (OIML D 10 method 1)', () => {
  it('reports a 2-month interval found out of tolerance as outside the policy (3–36 months), not "lengthen to 3 months"', async () => {
    const a = await tracker('2026-01-01', 2);
    const event = (await record(manager, a.id, fields('2026-03-01', 'out_of_tolerance'))).body;
    expect(event).toMatchObject({ intervalMonths: 2, suggestedIntervalMonths: 2, suggestedChange: 'outside_policy', intervalDecision: null });
    expect(event.suggestionReason).toMatch(/below the policy's range of 3–36 months/);
    const decided = await t.api.post(`/api/calibrations/${event.id}/interval`).set(bearer(owner)).send({ decision: 'accept' });
    expect(decided.status).toBe(422);
    expect(decided.body.error.code).toBe('interval_outside_policy');
  });

  it('reports a 48-month interval after in-tolerance results as outside the policy, not "keep" while cutting it to 36', async () => {
    const a = await tracker('2022-01-01', 48);
    await record(manager, a.id, fields('2023-01-01', 'in_tolerance', { intervalMonths: '48' }));
    const event = (await record(manager, a.id, fields('2026-01-01', 'in_tolerance', { intervalMonths: '48' }))).body;
    expect(event).toMatchObject({ intervalMonths: 48, suggestedIntervalMonths: 48, suggestedChange: 'outside_policy' });
    expect(event.suggestionReason).toMatch(/above the policy's range/);
  });

  it('names the way a suggestion moves', async () => {
    const a = await tracker('2025-01-01');
    const event = (await record(manager, a.id, fields('2026-01-01', 'out_of_tolerance'))).body;
    expect(event).toMatchObject({ intervalMonths: 12, suggestedIntervalMonths: 6, suggestedChange: 'shorten' });
  });
});

describe('out-of-tolerance impact review', () => {
  it('lists exactly the bookings between the last passing evidence and the finding, edge days included', async () => {
    const a = await tracker('2026-01-10');
    await record(manager, a.id, fields('2026-02-01')); // last passing evidence
    const job = (
      await t.api.post('/api/jobs').set(bearer(manager)).send({
        reference: 'J-IMP-1',
        customerName: 'Larkspur Aero Structures',
        contactEmail: 'quality@larkspur.test',
        startsOn: '2026-01-20',
        endsOn: '2026-10-01',
      })
    ).body;
    const insert = async (startsOn: string, endsOn: string) => {
      const [{ id, organization_id }] = await t.db.query(
        `INSERT INTO bookings (organization_id, starts_on, ends_on, state, purpose, job_id, created_by)
         SELECT organization_id, $1, $2, 'returned', 'job', $3, id FROM users WHERE email = 'manager@demo.test' RETURNING id, organization_id`,
        [startsOn, endsOn, job.id],
      );
      await t.db.query(`INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active) VALUES ($1, $2, $3, $4, $5, false)`, [
        organization_id,
        id,
        a.id,
        startsOn,
        endsOn,
      ]);
      return id as string;
    };
    const before = await insert('2026-01-25', '2026-01-31'); // ends the day before the good calibration
    const onEdge = await insert('2026-01-28', '2026-02-01'); // ends on the day of the last good calibration
    const inside = await insert('2026-04-01', '2026-04-10');
    const endEdge = await insert('2026-06-15', '2026-06-20'); // starts on the day of the finding
    const after = await insert('2026-06-21', '2026-06-25');
    const found = await record(manager, a.id, fields('2026-06-15', 'out_of_tolerance'));
    expect(found.status).toBe(201);
    const impact = (await t.api.get(`/api/assets/${a.id}/impact`).set(bearer(owner))).body;
    expect(impact).toMatchObject({ since: '2026-02-01', foundOn: '2026-06-15', state: 'open' });
    expect(impact.bookings.map((b: { bookingId: string }) => b.bookingId).sort()).toEqual([onEdge, inside, endEdge].sort());
    expect(impact.bookings.map((b: { bookingId: string }) => b.bookingId)).not.toContain(before);
    expect(impact.bookings.map((b: { bookingId: string }) => b.bookingId)).not.toContain(after);
    expect(impact.bookings[0]).toMatchObject({ jobId: job.id, jobReference: 'J-IMP-1', customerName: 'Larkspur Aero Structures' });

    const early = await t.api.post(`/api/impact-reviews/${impact.id}/close`).set(bearer(owner));
    expect(early.body.error.code).toBe('review_incomplete');
    const drafts = (await t.api.post(`/api/impact-reviews/${impact.id}/notices`).set(bearer(owner)).send({})).body;
    expect(drafts.drafts).toEqual([expect.objectContaining({ to: 'quality@larkspur.test', customerName: 'Larkspur Aero Structures' })]);
    expect(drafts.drafts[0].text).toMatch(/out of tolerance/);
    for (const b of impact.bookings) {
      await t.api.put(`/api/impact-reviews/${impact.id}/bookings/${b.bookingId}`).set(bearer(owner)).send({ assessment: 'customer_notified' });
    }
    expect((await t.api.post(`/api/impact-reviews/${impact.id}/close`).set(bearer(owner))).body.state).toBe('closed');
    expect((await t.api.get(`/api/assets/${a.id}/impact`).set(bearer(otherOwner))).status).toBe(404);
  });
});

describe('lab trips and the window finder', () => {
  it('finds gaps long enough for the turnaround, plans a trip on the board, sends it, and takes it back with the certificate', async () => {
    const a = await tracker(addDays(today, -350));
    const soon = addDays(today, 3);
    await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [a.id], startsOn: soon, endsOn: addDays(soon, 2) });
    const windows = (await t.api.get(`/api/assets/${a.id}/lab-windows`).set(bearer(owner))).body;
    expect(windows.turnaroundDays).toBe(14);
    expect(windows.threatenedIfSentNow).toHaveLength(1);
    expect(windows.gaps[0].startsOn).toBe(addDays(soon, 3));
    const trip = await t.api
      .post('/api/lab-trips')
      .set(bearer(manager))
      .send({ provider: 'Fenmoor Calibration Lab', assetIds: [a.id], sentOn: windows.gaps[0].startsOn });
    expect(trip.status).toBe(201);
    expect(trip.body).toMatchObject({ state: 'planned', expectedBackOn: addDays(windows.gaps[0].startsOn, 13) });
    const clash = await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [a.id], startsOn: addDays(soon, 5), endsOn: addDays(soon, 6) });
    expect(clash.status).toBe(409);
    // Send it now (the earlier booking is still reserved but does not stop a send).
    await t.db.query(`UPDATE booking_items SET active = false WHERE asset_id = $1 AND booking_id <> $2`, [a.id, trip.body.bookingId]);
    expect((await t.api.post(`/api/lab-trips/${trip.body.id}/send`).set(bearer(manager))).body.state).toBe('at_lab');
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).body.status).toBe('at_lab');
    const blocked = await t.api
      .post('/api/bookings')
      .set(bearer(manager))
      .send({ assetIds: [a.id], startsOn: addDays(today, 60), endsOn: addDays(today, 61) });
    expect(blocked.body.error.details.blocked[0].reason).toBe('at_lab');
    const review = (await t.api.get('/api/calibration/review').set(bearer(owner))).body;
    expect(review.atLab.map((x: { assetId: string }) => x.assetId)).toContain(a.id);
    await record(manager, a.id, fields(today));
    expect((await t.api.get(`/api/assets/${a.id}`).set(bearer(manager))).body.status).toBe('ready');
    expect((await t.api.get(`/api/lab-trips?state=back`).set(bearer(manager))).body.items.map((x: { id: string }) => x.id)).toContain(trip.body.id);
    const custody = (await t.api.get(`/api/assets/${a.id}/history`).set(bearer(manager))).body.items
      .filter((i: { source: string }) => i.source === 'custody')
      .map((i: { action: string }) => i.action);
    expect(custody.slice(0, 2)).toEqual(['back_from_lab', 'sent_to_lab']);
  });
});

describe("the owner's review and the daily scan", () => {
  it('lists overdue and due-soon items with the bookings they threaten, a 52-week timeline, CSV and PDF', async () => {
    const r = (await t.api.get('/api/calibration/review').set(bearer(owner))).body;
    expect(r.overdue.length).toBeGreaterThan(0);
    expect(r.timeline).toHaveLength(52);
    const threatened = r.dueSoon.concat(r.overdue).find((i: { assetTag: string }) => i.assetTag === 'TRK-004');
    expect(threatened.threatened.map((b: { jobReference: string }) => b.jobReference)).toContain('J-2630');
    expect((await t.api.get('/api/calibration/review').set(bearer(tech))).status).toBe(403);
    const csv = await t.api.get('/api/calibration/review.csv').set(bearer(owner));
    expect(csv.text.split('\r\n')[0]).toBe('assetTag,type,state,dueOn,provider,kit,status,threatenedBookings');
    const pdf = await t.api.get('/api/calibration/review.pdf').set(bearer(owner)).buffer(true);
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('sends one digest per recipient however many instances run it, and loses none while SMTP is down', async () => {
    const pool = new pg.Pool({ connectionString: t.config.DATABASE_URL, max: 2 });
    const sink = await startSmtpSink({ port: 0, store: pgSinkStore(pool) });
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: sink.port, secure: false, ignoreTLS: true });
    const digests = () => t.db.query(`SELECT recipients FROM outbox_messages WHERE subject LIKE 'Calibration:%'`);
    const a = new RoutinesService(t.db, [dueScanRoutine()]);
    const b = new RoutinesService(t.db, [dueScanRoutine()]);
    const runs = await Promise.all([a.run('due-scan', 'manual'), b.run('due-scan', 'manual')]);
    expect(runs.map((r) => r.status)).toEqual(['succeeded', 'succeeded']);
    // Each firm with changes gets one digest to its owners and managers, not one per item or per run.
    const demo = (await digests()).filter((d: { recipients: string[] }) => d.recipients.includes('owner@demo.test'));
    expect(demo).toHaveLength(1);
    expect(demo[0].recipients.sort()).toEqual(['manager@demo.test', 'owner@demo.test']);
    expect((await a.run('due-scan', 'manual')).summary).toMatchObject({ itemsChanged: 0, digests: 0 });

    sink.setAccepting(false);
    await deliverOutbox(t.db, transport, 'Nestkeeper <no-reply@nestkeeper.test>');
    sink.setAccepting(true);
    await t.db.query(`UPDATE outbox_messages SET next_attempt_at = now() WHERE status = 'pending'`);
    await deliverOutbox(t.db, transport, 'Nestkeeper <no-reply@nestkeeper.test>');
    await deliverOutbox(t.db, transport, 'Nestkeeper <no-reply@nestkeeper.test>');
    const received = await t.db.query(`SELECT count(*)::int AS n FROM mail_sink_messages WHERE subject LIKE 'Calibration:%'`);
    expect(received[0].n).toBe((await digests()).length);
    await sink.close();
    await pool.end();
  });
});

describe('due scan timing and settings', () => {
  it('scans a firm on schedule only in the hour its own clock reads six, and every firm on a manual run', async () => {
    const scan = dueScanRoutine();
    await t.db.query(`UPDATE assets SET notified_calibration_state = NULL`);
    // 03:10 UTC is 04:10 in Wrenhallow (Europe/Berlin): not the demo firm's hour, nothing is scanned.
    expect(await scan.run({ db: t.db, now: new Date('2026-12-01T03:10:00Z'), trigger: 'schedule', organizationId: null })).toMatchObject({
      itemsChanged: 0,
      digests: 0,
    });
    // 05:10 UTC is 06:10 there (and 05:10 in the London firm, which waits for its own six o'clock).
    const atSix = await scan.run({ db: t.db, now: new Date('2026-12-01T05:10:00Z'), trigger: 'schedule', organizationId: null });
    expect(atSix.itemsChanged).toBeGreaterThan(0);
    expect(atSix.digests).toBe(1);
    await t.db.query(`UPDATE assets SET notified_calibration_state = NULL`);
    expect((await scan.run({ db: t.db, now: new Date('2026-12-01T03:10:00Z'), trigger: 'manual', organizationId: null })).itemsChanged).toBeGreaterThan(0);
  });

  it('lets the owner set providers with turnarounds and the interval policy', async () => {
    const res = await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({
        providers: [{ name: 'Fenmoor Calibration Lab', turnaroundDays: 21 }],
        intervalPolicy: { lengthenAfter: 3, lengthenFactor: 1.5, shortenFactor: 0.5, minMonths: 3, maxMonths: 24 },
      });
    expect(res.status).toBe(200);
    expect(res.body.providers).toEqual([{ name: 'Fenmoor Calibration Lab', turnaroundDays: 21 }]);
    const bad = await t.api
      .patch('/api/settings')
      .set(bearer(owner))
      .send({ intervalPolicy: { lengthenAfter: 2, lengthenFactor: 0.5, shortenFactor: 2, minMonths: 12, maxMonths: 6 } });
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual([
      'intervalPolicy.lengthenFactor',
      'intervalPolicy.maxMonths',
      'intervalPolicy.shortenFactor',
    ]);
    const a = await tracker(addDays(today, -300));
    await t.api
      .patch(`/api/assets/${a.id}`)
      .set(bearer(manager))
      .send({ calibration: { required: true, intervalMonths: 12, provider: 'Fenmoor Calibration Lab' } });
    expect((await t.api.get(`/api/assets/${a.id}/lab-windows`).set(bearer(owner))).body.turnaroundDays).toBe(21);
  });
});
