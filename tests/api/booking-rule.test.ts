import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { blockReason, rangesOverlap, type BlockReason, type BookableAsset } from '../../shared/bookings/rules';
import { addDays } from '../../shared/calibration/due-date';
import type { AssetStatus, AssetType } from '../../shared/schemas/assets';
import { availableAssets } from '../../server/bookings/booking-queries';
import { refusals } from '../../server/bookings/booking-rule';
import { book } from '../../server/bookings/lifecycle';
import { Scoped } from '../../server/db/scoped';
import { AppError } from '../../server/http/errors';
import { createTestDatabase } from '../support/test-db';

/*
 * One booking rule, several encodings: `blockReason` (shared, what the client
 * previews with and the server decides with, over facts loaded in one query)
 * and the availability SQL (a fast filter that can stop at its limit). This
 * file generates fleets at random and proves they agree, item by item and
 * window by window. Replay a failure with BOOKING_RULE_SEED=<seed named in it>.
 */
const SEED = Number(process.env.BOOKING_RULE_SEED ?? 20260517);
const ASSETS = 300;
const WINDOWS = 80;
const BASE = '2027-03-01';

/** Mulberry32, a small seeded generator (Tommy Ettinger's public-domain constants, written from memory). */
function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Check = { kind: 'tip_validation' | 'two_face'; position: string | null; decision: 'pass' | 'fail'; performedAt: string; createdAt: string };
type Held = { startsOn: string; endsOn: string; active: boolean };
type Generated = {
  id: string;
  assetTag: string;
  type: AssetType;
  status: AssetStatus;
  calibrationRequired: boolean;
  dueOn: string | null;
  positions: string[] | undefined;
  checks: Check[];
  bookings: Held[];
};

/** A fleet with every fact the rule reads drawn at random, and the bookings that hold its days. */
function generateFleet(random: () => number) {
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)];
  const at = (day: string, minute: number) => new Date(Date.parse(`${day}T08:00:00Z`) + minute * 60_000).toISOString();
  const fleet: Generated[] = [];
  for (let i = 0; i < ASSETS; i++) {
    const type = pick(['tip', 'tip', 'tip', 'tracker', 'smr', 'battery', 'nest'] as const);
    const positions =
      type === 'tip' || random() < 0.1
        ? pick([undefined, [], ['vertical'], ['horizontal'], ['vertical', 'horizontal'], ['vertical', 'horizontal']])
        : undefined;
    const checks: Check[] = [];
    // Validations per position, some sharing a time (the later record wins), some for a position the tip does not use, and other kinds of check.
    for (const position of [...(positions ?? []), ...(random() < 0.2 ? ['angled'] : [])]) {
      let minute = int(0, 200) * 1440;
      for (let k = int(0, 3); k > 0; k--) {
        const tie = checks.length > 0 && random() < 0.15;
        if (!tie) minute += int(1, 60 * 1440);
        checks.push({
          kind: 'tip_validation',
          position,
          decision: random() < 0.65 ? 'pass' : 'fail',
          performedAt: at(addDays(BASE, -400), minute),
          createdAt: at(addDays(BASE, -400), minute + checks.length),
        });
      }
      if (random() < 0.2) checks.push({ kind: 'two_face', position, decision: 'fail', performedAt: at(BASE, 0), createdAt: at(BASE, 1) });
    }
    const bookings: Held[] = [];
    let cursor = addDays(BASE, int(-40, 0));
    for (let k = int(0, 4); k > 0; k--) {
      const startsOn = addDays(cursor, int(0, 25));
      const endsOn = addDays(startsOn, int(0, 15));
      bookings.push({ startsOn, endsOn, active: random() < 0.7 });
      cursor = addDays(endsOn, 1); // active rows never overlap: the database refuses that
    }
    fleet.push({
      id: randomUUID(),
      assetTag: `GEN-${String(i).padStart(4, '0')}`,
      type,
      status: pick(['ready', 'ready', 'ready', 'ready', 'out', 'held', 'at_lab', 'retired'] as const),
      calibrationRequired: random() < 0.6,
      dueOn: random() < 0.12 ? null : addDays(BASE, int(-40, 170)),
      positions,
      checks,
      bookings,
    });
  }
  // Windows at random, and some ending on a due date or starting on a booking's last day, where the edges are.
  const windows: { startsOn: string; endsOn: string }[] = [];
  for (let w = 0; w < WINDOWS; w++) {
    const length = int(0, 30);
    const asset = pick(fleet);
    const edge = random();
    if (edge < 0.25 && asset.dueOn) windows.push({ startsOn: addDays(asset.dueOn, -length), endsOn: asset.dueOn });
    else if (edge < 0.4 && asset.bookings.length) {
      const b = pick(asset.bookings);
      windows.push({ startsOn: b.endsOn, endsOn: addDays(b.endsOn, length) });
    } else {
      const startsOn = addDays(BASE, int(-30, 160));
      windows.push({ startsOn, endsOn: addDays(startsOn, length) });
    }
  }
  return { fleet, windows };
}

/** Every mounting position's latest validation passed: worked out here from the generated history, not read back from SQL. */
function tipValidated(a: Generated) {
  return (a.positions ?? []).every((position) => {
    const latest = a.checks
      .filter((c) => c.kind === 'tip_validation' && c.position === position)
      .sort((x, y) => y.performedAt.localeCompare(x.performedAt) || y.createdAt.localeCompare(x.createdAt))[0];
    return latest?.decision === 'pass';
  });
}

const bookable = (a: Generated): BookableAsset => ({
  type: a.type,
  status: a.status,
  calibration: { required: a.calibrationRequired, dueOn: a.dueOn },
  tipValidated: tipValidated(a),
});
const free = (a: Generated, w: { startsOn: string; endsOn: string }) => !a.bookings.some((b) => b.active && rangesOverlap(b, w));

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let tx: Scoped;
let actor: { userId: string; organizationId: string; role: 'manager' };
const { fleet, windows } = generateFleet(mulberry32(SEED));
const types = [...new Set(fleet.map((a) => a.type))];

beforeAll(async () => {
  database = await createTestDatabase();
  const db = database.db;
  const [{ id: org }] = await db.query(`INSERT INTO organizations (name, settings) VALUES ('Generated fleet test firm', '{}') RETURNING id`);
  const [{ id: userId }] = await db.query(
    `INSERT INTO users (organization_id, email, name, role, password_hash) VALUES ($1, 'gen@fleet.test', 'Generated Manager', 'manager', 'x') RETURNING id`,
    [org],
  );
  actor = { userId, organizationId: org, role: 'manager' };
  tx = new Scoped(db.manager, org);
  const rows = (xs: unknown[]) => JSON.stringify(xs);
  await db.query(
    `INSERT INTO assets (id, organization_id, type, asset_tag, serial_number, status, specs, calibration_required, due_on)
     SELECT r.id, $1, r.type, r.tag, r.tag, r.status, r.specs, r.req, r.due FROM jsonb_to_recordset($2::jsonb) AS r(id uuid, type text, tag text, status text, specs jsonb, req boolean, due date)`,
    [
      org,
      rows(
        fleet.map((a) => ({
          id: a.id,
          type: a.type,
          tag: a.assetTag,
          status: a.status,
          specs: a.positions ? { lengthMm: 100, positions: a.positions } : {},
          req: a.calibrationRequired,
          due: a.dueOn,
        })),
      ),
    ],
  );
  await db.query(
    `INSERT INTO field_checks (organization_id, asset_id, kind, position, inputs, result, tolerance_um, expanded_uncertainty_um, guard_band_um, decision_rule, decision, performed_at, performed_by, created_at)
     SELECT $1, r.asset, r.kind, r.position, '{}', '{}', 60, 0, 0, 'simple', r.decision, r.performed, $2, r.created
       FROM jsonb_to_recordset($3::jsonb) AS r(asset uuid, kind text, position text, decision text, performed timestamptz, created timestamptz)`,
    [
      org,
      userId,
      rows(
        fleet.flatMap((a) =>
          a.checks.map((c) => ({ asset: a.id, kind: c.kind, position: c.position, decision: c.decision, performed: c.performedAt, created: c.createdAt })),
        ),
      ),
    ],
  );
  const held = fleet.flatMap((a) => a.bookings.map((b) => ({ id: randomUUID(), asset: a.id, starts: b.startsOn, ends: b.endsOn, active: b.active })));
  await db.query(
    `INSERT INTO bookings (id, organization_id, starts_on, ends_on, state, purpose, created_by)
     SELECT r.id, $1, r.starts, r.ends, CASE WHEN r.active THEN 'reserved' ELSE 'returned' END, 'internal', $2 FROM jsonb_to_recordset($3::jsonb) AS r(id uuid, starts date, ends date, active boolean)`,
    [org, userId, rows(held)],
  );
  await db.query(
    `INSERT INTO booking_items (organization_id, booking_id, asset_id, starts_on, ends_on, active)
     SELECT $1, r.id, r.asset, r.starts, r.ends, r.active FROM jsonb_to_recordset($2::jsonb) AS r(id uuid, asset uuid, starts date, ends date, active boolean)`,
    [org, rows(held)],
  );
});
afterAll(() => database.drop());

describe(`the booking rule over ${ASSETS} generated assets and ${WINDOWS} windows (${ASSETS * WINDOWS} cases, seed ${SEED})`, () => {
  it('the generator reaches every reason and both answers on the edges', () => {
    const reasons = new Set(windows.flatMap((w) => fleet.map((a) => blockReason(bookable(a), w.endsOn))));
    expect([...reasons].sort()).toEqual([null, 'at_lab', 'calibration_expires', 'held', 'retired', 'tip_not_validated'].sort());
    expect(windows.some((w) => fleet.some((a) => a.dueOn === w.endsOn && blockReason(bookable(a), w.endsOn) === null))).toBe(true);
    expect(windows.some((w) => fleet.some((a) => a.bookings.some((b) => b.active && b.endsOn === w.startsOn)))).toBe(true);
    expect(fleet.some((a) => a.type === 'tip' && a.checks.length && tipValidated(a))).toBe(true);
  });

  it('loads each item’s facts and refuses exactly what blockReason refuses, for a job and for a lab trip', async () => {
    for (const [i, w] of windows.entries()) {
      for (const purpose of ['job', 'lab'] as const) {
        const refused = new Map(
          (
            await refusals(
              tx,
              fleet.map((a) => a.id),
              w.endsOn,
              purpose,
            )
          ).map((r) => [r.assetId, r.reason]),
        );
        const expected = new Map(
          fleet.flatMap((a): [string, BlockReason][] => {
            const reason = blockReason(bookable(a), w.endsOn, purpose);
            return reason ? [[a.id, reason]] : [];
          }),
        );
        expect(refused, `seed ${SEED}, window ${i} (${w.startsOn} to ${w.endsOn}), ${purpose}`).toEqual(expected);
      }
    }
  });

  it('lists as available exactly the items blockReason lets go and no active booking holds, by type and with exclusions', async () => {
    const random = mulberry32(SEED + 1);
    for (const [i, w] of windows.entries()) {
      const exclude = fleet.filter(() => random() < 0.05).map((a) => a.id);
      for (const type of [undefined, ...types]) {
        const listed = (await availableAssets(tx, { type, startsOn: w.startsOn, endsOn: w.endsOn, exclude, limit: ASSETS })).map((a) => a.assetTag);
        const expected = fleet
          .filter((a) => (!type || a.type === type) && !exclude.includes(a.id) && blockReason(bookable(a), w.endsOn) === null && free(a, w))
          .map((a) => a.assetTag);
        expect(listed, `seed ${SEED}, window ${i} (${w.startsOn} to ${w.endsOn}), type ${type ?? 'any'}`).toEqual(expected);
      }
    }
  });

  it('answers a booking request with 422 naming each refused item, else 409 naming each clash, else books', async () => {
    const random = mulberry32(SEED + 2);
    const outcomes = new Set<number>();
    for (const [i, w] of windows.entries()) {
      const items = [...new Set([0, 1, 2].map(() => fleet[Math.floor(random() * fleet.length)]))].sort((a, b) => a.assetTag.localeCompare(b.assetTag));
      const refused = items.flatMap((a) => {
        const reason = blockReason(bookable(a), w.endsOn);
        return reason ? [{ assetId: a.id, assetTag: a.assetTag, reason }] : [];
      });
      const clashes = items.flatMap((a) =>
        a.bookings.filter((b) => b.active && rangesOverlap(b, w)).map((b) => ({ assetId: a.id, startsOn: b.startsOn, endsOn: b.endsOn })),
      );
      const status = await database.db
        .transaction(async (m) => {
          const attempt = await book(new Scoped(m, actor.organizationId), actor, {
            assetIds: items.map((a) => a.id),
            startsOn: w.startsOn,
            endsOn: w.endsOn,
          }).then(
            () => 201,
            (err: AppError) => err,
          );
          throw attempt; // nothing stays: the next window sees the generated board unchanged
        })
        .catch((answer: AppError | number) => answer);
      const where = `seed ${SEED}, window ${i} (${w.startsOn} to ${w.endsOn}), items ${items.map((a) => a.assetTag).join(' ')}`;
      if (refused.length) {
        expect(status, where).toBeInstanceOf(AppError);
        expect((status as AppError).status, where).toBe(422);
        expect((status as AppError).details!.blocked, where).toEqual(refused);
      } else if (clashes.length) {
        expect((status as AppError).status, where).toBe(409);
        expect(
          ((status as AppError).details!.conflicts as typeof clashes).map(({ assetId, startsOn, endsOn }) => ({ assetId, startsOn, endsOn })),
          where,
        ).toEqual(clashes);
      } else {
        expect(status, where).toBe(201);
      }
      outcomes.add(typeof status === 'number' ? status : status.status);
    }
    expect([...outcomes].sort()).toEqual([201, 409, 422]);
  });
});
