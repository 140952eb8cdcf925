import { In } from 'typeorm';
import type { AssetStatus } from '../../shared/schemas/assets';
import { assetStatusWords } from '../../shared/assets/record-words';
import { recordAudits } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import type { Actor } from '../db/transaction';
import { notFound, ruleBroken } from '../http/errors';
import { Asset } from './asset.entity';
import { CustodyEvent, type CustodyKind } from './custody-event.entity';

/**
 * The one written table of an asset's status (DESIGN.md §3 "Asset"): from each
 * status, the statuses it may move to and what the chain of custody calls the move.
 * - ready → out (checkout), held (hold, incident, failed check), at_lab (lab trip sent), retired
 * - out → ready (returned fine), held (incident or failed check in the field, missing or damaged at return)
 * - held → ready (released on evidence or by a calibration), at_lab (sent for calibration while held), retired
 * - at_lab → ready (certificate recorded), held (incident or failed check at the lab), retired (condemned by the lab)
 * - retired → nothing: its record is closed
 */
export const assetMoves = {
  ready: { out: 'checked_out', held: 'held', at_lab: 'sent_to_lab', retired: 'retired' },
  out: { ready: 'returned', held: 'held' },
  held: { ready: 'released', at_lab: 'sent_to_lab', retired: 'retired' },
  at_lab: { ready: 'back_from_lab', held: 'held', retired: 'retired' },
  retired: {},
} as const satisfies Record<AssetStatus, Partial<Record<AssetStatus, CustodyKind>>>;

/** Records that leave the status as it is: taken into the fleet, moved on the shelf, calibrated
 * in place, brought back while on hold, a hold ended while the item is elsewhere. */
export type CustodyNote = 'registered' | 'moved' | 'calibrated' | 'returned' | 'released';

const movesFrom = (from: AssetStatus): Partial<Record<AssetStatus, CustodyKind>> => assetMoves[from];
export const moveKind = (from: AssetStatus, to: AssetStatus): CustodyKind | undefined => movesFrom(from)[to];

const statusWords = assetStatusWords;
const moveWords: Record<AssetStatus, string> = { ready: 'made ready', out: 'handed out', at_lab: 'sent to the lab', held: 'put on hold', retired: 'retired' };

/** How a move reads in the chain of custody: why, on which booking, where the item is and who has it after it.
 * `where` defaults to the item's recorded location; `why` may differ per item. */
export type CustodyDetails = {
  why?: string | null | ((assetId: string) => string | null);
  bookingId?: string | null;
  where?: string | null;
  counterpart?: string | null;
};

type Locked = Pick<Asset, 'id' | 'assetTag' | 'status' | 'location'>;

/** The rows, locked until the caller's transaction ends (in id order, so two movers never deadlock). */
async function lockRows(tx: Scoped, assetIds: string[]): Promise<Locked[]> {
  const ids = [...new Set(assetIds)];
  if (!ids.length) return [];
  const rows = await tx.find(Asset, {
    select: { id: true, assetTag: true, status: true, location: true },
    where: { id: In(ids) },
    order: { id: 'ASC' },
    lock: { mode: 'pessimistic_write' },
  });
  if (rows.length !== ids.length) throw notFound('That asset');
  return rows;
}

function custodyRows(rows: Locked[], kindOf: (row: Locked) => CustodyKind, actor: Pick<Actor, 'userId'> | null, d: CustodyDetails) {
  return rows.map((r) => ({
    assetId: r.id,
    kind: kindOf(r),
    actorUserId: actor?.userId ?? null,
    holder: d.counterpart ?? null,
    location: d.where === undefined ? r.location : d.where,
    bookingId: d.bookingId ?? null,
    note: (typeof d.why === 'function' ? d.why(r.id) : d.why) ?? null,
  }));
}

/**
 * The only way an asset's status changes. Inside the caller's transaction: locks
 * the rows, refuses the whole set (422 `asset_move_refused`) if any move is not in
 * the table, then sets the status and writes one custody event and one audit
 * entry (`asset.<kind>`, with `details`) per item.
 */
export async function moveAssets(
  tx: Scoped,
  actor: Pick<Actor, 'userId'> | null,
  assetIds: string[],
  to: AssetStatus,
  d: CustodyDetails & { details?: Record<string, unknown> } = {},
) {
  const rows = await lockRows(tx, assetIds);
  const refused = rows.filter((r) => !moveKind(r.status, to));
  if (refused.length) {
    throw ruleBroken('asset_move_refused', `${refused.map((r) => `${r.assetTag} is ${statusWords[r.status]} and cannot be ${moveWords[to]}`).join('; ')}.`, {
      refused: refused.map((r) => ({ assetId: r.id, assetTag: r.assetTag, from: r.status, to, allowed: Object.keys(movesFrom(r.status)) })),
    });
  }
  if (!rows.length) return [];
  await tx.updateWhere(Asset, { id: In(rows.map((r) => r.id)) }, { status: to });
  const events = custodyRows(rows, (r) => moveKind(r.status, to)!, actor, d);
  await tx.insertMany(CustodyEvent, events);
  await recordAudits(
    tx,
    actor,
    rows.map((r, i) => ({
      action: `asset.${events[i].kind}`,
      subject: { type: 'asset', id: r.id },
      details: { from: r.status, to, ...(events[i].note ? { note: events[i].note } : {}), ...(d.bookingId ? { bookingId: d.bookingId } : {}), ...d.details },
    })),
  );
  return rows.map((r, i) => ({ assetId: r.id, assetTag: r.assetTag, from: r.status, to, kind: events[i].kind }));
}

/**
 * A custody record that moves nothing, inside the caller's transaction (the caller
 * audits the act itself: asset.created, calibration.recorded, booking.returned…).
 * Refused when the table has a move of that kind from the item's status: then the
 * item must move (an item that is out comes back through moveAssets).
 */
export async function noteCustody(tx: Scoped, actor: Pick<Actor, 'userId'> | null, assetIds: string[], kind: CustodyNote, d: CustodyDetails = {}) {
  const rows = await lockRows(tx, assetIds);
  const shouldMove = rows.filter((r) => Object.values(movesFrom(r.status)).includes(kind));
  if (shouldMove.length) {
    throw ruleBroken(
      'custody_note_refused',
      `${shouldMove.map((r) => `${r.assetTag} is ${statusWords[r.status]}: "${kind.replace(/_/g, ' ')}" changes its status`).join('; ')}.`,
      {
        refused: shouldMove.map((r) => ({ assetId: r.id, assetTag: r.assetTag, status: r.status, kind })),
      },
    );
  }
  if (rows.length)
    await tx.insertMany(
      CustodyEvent,
      custodyRows(rows, () => kind, actor, d),
    );
}

/** Demo seeds only: events from before the items' present state (past bookings), written as history. */
export async function recordPastCustody(
  tx: Scoped,
  events: {
    assetId: string;
    kind: CustodyKind;
    actorUserId: string | null;
    holder: string | null;
    location: string | null;
    bookingId: string | null;
    note: string | null;
  }[],
) {
  if (events.length) await tx.insertMany(CustodyEvent, events);
}
