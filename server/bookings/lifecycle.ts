import type { BookingPayload, BookingPurpose, BookingState } from '../../shared/schemas/bookings';
import { addDays } from '../../shared/calibration/due-date';
import { recordAudit, recordAudits } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import type { Actor } from '../db/transaction';
import { getAssets, getKit, kitMembers } from '../fleet';
import { conflict, forbidden, ruleBroken } from '../http/errors';
import { formatOf, loadFirmFormat, loadOrgContext } from '../organizations';
import { availableAssets, conflictingItems, itemFacts } from './booking-queries';
import { blockedError, refusals, refusedItems } from './booking-rule';
import { bookingViews, type BookingView } from './booking-view';
import type { AlternativeItem, BookingRefusalDetails, ChecklistLine } from '../../shared/bookings/views';
import { Booking, BookingItem } from './booking.entity';
import { Job } from './job.entity';

/*
 * The only writer of `bookings` and `booking_items`. Every function runs in the
 * caller's transaction (`inOrganization`), so a lab trip or a rental and its
 * booking are made or refused together.
 */

/** A booking request: the API's payload; a lab trip says so, other purposes follow from the job or rental. */
export type BookingRequest = BookingPayload & { purpose?: 'lab' };

type Window = { startsOn: string; endsOn: string; purpose: BookingPurpose; exceptBookingId: string | null };

/** One booking as a plain view; 404 when it is not the firm's. */
export async function loadBooking(tx: Scoped, id: string): Promise<BookingView> {
  const booking = await tx.get(Booking, { id }, 'That booking', { relations: { job: true, kit: true } });
  return (await bookingViews(tx, [booking]))[0];
}

/** The booking, or 422 `booking_state`: `only` says which states a step needs ("Only a reserved booking can move"). */
export async function bookingIn(tx: Scoped, id: string, states: BookingState[], only: string): Promise<BookingView> {
  const booking = await loadBooking(tx, id);
  if (!states.includes(booking.state)) throw ruleBroken('booking_state', `${only}; this one is ${booking.state}.`);
  return booking;
}

/**
 * Book whole days, for any purpose: jobs, rentals, the firm's own use, lab trips.
 * Refuses (422) items that may not go for the window, then (409) items another
 * booking holds; a race between two requests, settled by the exclusion
 * constraint, gets the same 409. Both answers offer free, valid alternatives,
 * except to a lab trip (it sends these very items).
 */
export async function book(tx: Scoped, actor: Actor, request: BookingRequest): Promise<BookingView> {
  const assetIds = await resolveAssets(tx, request.assetIds ?? [], request.kitId);
  const purpose: BookingPurpose = request.purpose ?? (request.rentalId ? 'rental' : request.jobId ? 'job' : 'internal');
  const window: Window = { startsOn: request.startsOn, endsOn: request.endsOn, purpose, exceptBookingId: null };
  // Every id first: one that is not found is 404 before any booking rule answers.
  if (request.jobId) await tx.get(Job, { id: request.jobId }, 'That job');
  const ctx = await loadOrgContext(tx);
  const { today } = ctx;
  if (request.history) return recordHistory(tx, actor, request, assetIds, purpose, today);
  if (request.endsOn < today) {
    const f = formatOf(ctx);
    throw ruleBroken(
      'dates_past',
      `Every day of this booking (${f.dateRange(request.startsOn, request.endsOn)}) is before today (${f.date(today)}). Pick days from today on; the owner can record past use as history.`,
    );
  }
  await assertBookable(tx, assetIds, window);
  const booking = await tx.insert(Booking, {
    startsOn: request.startsOn,
    endsOn: request.endsOn,
    state: 'reserved',
    purpose,
    jobId: request.jobId ?? null,
    rentalId: request.rentalId ?? null,
    kitId: request.kitId ?? null,
    note: request.note ?? null,
    createdBy: actor.userId,
  });
  await holdingDates(tx, assetIds, window, () =>
    tx.insertMany(
      BookingItem,
      assetIds.map((assetId) => ({ bookingId: booking.id, assetId, startsOn: request.startsOn, endsOn: request.endsOn, active: true })),
    ),
  );
  await recordAudit(
    tx,
    actor,
    'booking.created',
    { type: 'booking', id: booking.id },
    { assetIds, startsOn: request.startsOn, endsOn: request.endsOn, purpose },
  );
  return loadBooking(tx, booking.id);
}

/**
 * Past use the owner records so impact reviews see it: already over, so it holds no days and passes no
 * booking rule (those guard what goes out from now on). Every day must lie before today.
 */
async function recordHistory(tx: Scoped, actor: Actor, request: BookingRequest, assetIds: string[], purpose: BookingPurpose, today: string) {
  if (actor.role !== 'owner') throw forbidden('Only the owner records past use as history.');
  if (request.endsOn >= today)
    throw ruleBroken('history_not_past', `History ends before today (${(await loadFirmFormat(tx)).date(today)}); book days from today on as usual.`);
  const booking = await tx.insert(Booking, {
    startsOn: request.startsOn,
    endsOn: request.endsOn,
    state: 'returned',
    purpose,
    history: true,
    jobId: request.jobId ?? null,
    rentalId: null,
    kitId: request.kitId ?? null,
    note: request.note ?? null,
    createdBy: actor.userId,
  });
  await tx.insertMany(
    BookingItem,
    assetIds.map((assetId) => ({ bookingId: booking.id, assetId, startsOn: request.startsOn, endsOn: request.endsOn, active: false })),
  );
  await recordAudit(
    tx,
    actor,
    'booking.recorded_as_history',
    { type: 'booking', id: booking.id },
    { assetIds, startsOn: request.startsOn, endsOn: request.endsOn },
  );
  return loadBooking(tx, booking.id);
}

/**
 * Reservations (not lab trips: those are sent, late or not) whose last day passed before `today` without checkout are not collected: they stop
 * holding their items (so nothing of theirs blocks a later day) and wait on the counter's list
 * for the manager to cancel them or check them out late.
 */
export async function markNotCollected(tx: Scoped, today: string): Promise<number> {
  const ids = (
    await tx.sql<{ id: string }>(
      `WITH lapsed AS (UPDATE bookings SET state = 'not_collected', updated_at = now()
                        WHERE organization_id = $1 AND state = 'reserved' AND purpose <> 'lab' AND ends_on < $2::date RETURNING id)
       SELECT id FROM lapsed`,
      [today],
    )
  ).map((r) => r.id);
  if (!ids.length) return 0;
  await tx.sql(
    `WITH freed AS (UPDATE booking_items SET active = false WHERE organization_id = $1 AND booking_id = ANY($2) RETURNING id) SELECT count(*) FROM freed`,
    [ids],
  );
  await recordAudits(
    tx,
    null,
    ids.map((id) => ({ action: 'booking.not_collected', subject: { type: 'booking', id }, details: { today } })),
  );
  return ids.length;
}

/** Add, remove or swap items of a reserved booking: added items pass the same refusals (with alternatives) and overlap rule. */
export async function changeItems(tx: Scoped, actor: Actor, id: string, change: { add: string[]; remove: string[] }): Promise<BookingView> {
  const booking = await lockedIn(tx, id, ['reserved'], 'Only a reserved booking can change its items');
  const current = await itemsOf(tx, id);
  const add = (await resolveAssets(tx, change.add)).filter((a) => !current.includes(a));
  const remove = change.remove.filter((a) => current.includes(a));
  const strangers = change.remove.filter((a) => !current.includes(a));
  if (strangers.length) throw ruleBroken('not_on_booking', 'An item to remove is not on this booking.', { assetIds: strangers });
  if (current.length - remove.length + add.length === 0) throw ruleBroken('booking_empty', 'A booking keeps at least one item; cancel it instead.');
  const window: Window = { startsOn: booking.startsOn, endsOn: booking.endsOn, purpose: booking.purpose, exceptBookingId: id };
  if (add.length) await assertBookable(tx, add, window);
  if (remove.length)
    await tx.sql(
      `WITH gone AS (DELETE FROM booking_items WHERE organization_id = $1 AND booking_id = $2 AND asset_id = ANY($3) RETURNING id) SELECT count(*) FROM gone`,
      [id, remove],
    );
  await holdingDates(tx, add, window, () =>
    tx.insertMany(
      BookingItem,
      add.map((assetId) => ({ bookingId: id, assetId, startsOn: booking.startsOn, endsOn: booking.endsOn, active: true })),
    ),
  );
  // A kit booking with items swapped is no longer the kit as packed.
  if (booking.kitId && (add.length || remove.length)) {
    booking.kitId = null;
    await tx.save(Booking, booking);
  }
  await recordAudit(tx, actor, 'booking.items_changed', { type: 'booking', id }, { added: add, removed: remove });
  return loadBooking(tx, id);
}

/** Move a reserved booking to other dates under the same rules. */
export async function moveBooking(tx: Scoped, actor: Actor, id: string, dates: { startsOn: string; endsOn: string; note?: string }): Promise<BookingView> {
  const booking = await lockedIn(tx, id, ['reserved'], 'Only a reserved booking can move');
  const assetIds = await itemsOf(tx, id);
  const window: Window = { startsOn: dates.startsOn, endsOn: dates.endsOn, purpose: booking.purpose, exceptBookingId: id };
  await assertBookable(tx, assetIds, window);
  const before = { startsOn: booking.startsOn, endsOn: booking.endsOn };
  Object.assign(booking, { startsOn: dates.startsOn, endsOn: dates.endsOn, note: dates.note ?? booking.note });
  await tx.save(Booking, booking);
  await holdingDates(tx, assetIds, window, () => tx.updateWhere(BookingItem, { bookingId: id }, { startsOn: dates.startsOn, endsOn: dates.endsOn }));
  await recordAudit(tx, actor, 'booking.rescheduled', { type: 'booking', id }, { before, after: dates });
  return loadBooking(tx, id);
}

/** Cancel a reserved (or not collected) booking: its days are free again. */
export async function cancelBooking(tx: Scoped, actor: Actor, id: string): Promise<BookingView> {
  const booking = await lockedIn(tx, id, ['reserved', 'not_collected'], 'Only a reserved or not collected booking can be cancelled');
  booking.state = 'cancelled';
  await tx.save(Booking, booking);
  await tx.updateWhere(BookingItem, { bookingId: id }, { active: false });
  await recordAudit(tx, actor, 'booking.cancelled', { type: 'booking', id });
  return loadBooking(tx, id);
}

export type CheckoutRequest = {
  takenBy: string;
  takenByUserId?: string | null;
  checklist?: ChecklistLine[];
  /** Why it goes before the checkout window opens (`checkoutOpensDaysBefore`); required then, recorded. */
  earlyReason?: string;
  /** A reservation not collected goes late: why, and its new last day. */
  late?: { note: string; endsOn: string };
};

/**
 * The booking goes out: to a person at the counter (with the packing list as
 * ticked) or to a calibration lab. Refuses (422) items that may no longer go.
 * Checkout opens the firm's set number of days before the start; earlier needs a
 * reason, and the booking then starts today so the board shows the days the kit is
 * really away. A reservation not collected goes late with a note and a new last day,
 * under the same refusals and overlap rule as a new booking.
 */
export async function checkOut(tx: Scoped, actor: Actor, id: string, to: CheckoutRequest): Promise<BookingView> {
  const booking = await lockedIn(tx, id, ['reserved', 'not_collected'], 'Only a reserved or not collected booking can be checked out');
  const ctx = await loadOrgContext(tx);
  const { today, checkoutOpensDaysBefore } = ctx;
  const f = formatOf(ctx);
  const assetIds = await itemsOf(tx, id);
  let note: string | null = null;
  if (booking.state === 'not_collected' || (booking.purpose !== 'lab' && booking.endsOn < today)) {
    if (!to.late)
      throw ruleBroken(
        'checkout_late',
        `This reservation ended ${f.date(booking.endsOn)} and was not collected: give a note and a new last day to check it out late.`,
      );
    if (to.late.endsOn < today) throw ruleBroken('dates_past', `The new last day must be today (${f.date(today)}) or later.`);
    await setDays(tx, booking, assetIds, today, to.late.endsOn);
    note = to.late.note;
  } else if (booking.purpose !== 'lab' && booking.startsOn > addDays(today, checkoutOpensDaysBefore)) {
    const opensOn = addDays(booking.startsOn, -checkoutOpensDaysBefore);
    if (!to.earlyReason)
      throw ruleBroken(
        'checkout_early',
        `Checkout opens ${f.date(opensOn)}, ${checkoutOpensDaysBefore} day${checkoutOpensDaysBefore === 1 ? '' : 's'} before the start (${f.date(booking.startsOn)}). Confirm with a reason to hand over earlier.`,
        { opensOn },
      );
    await setDays(tx, booking, assetIds, today, booking.endsOn);
    note = to.earlyReason;
  }
  const refused = await refusals(tx, assetIds, booking.endsOn, booking.purpose);
  if (refused.length) throw blockedError('Cannot hand over', refused, f);
  Object.assign(booking, {
    checkoutNote: note,
    state: 'out',
    checkedOutAt: new Date(),
    handedOverBy: actor.userId,
    takenBy: to.takenBy,
    takenByUserId: to.takenByUserId ?? null,
    checkoutChecklist: to.checklist ?? null,
  });
  await tx.save(Booking, booking);
  await recordAudit(
    tx,
    actor,
    'booking.checked_out',
    { type: 'booking', id },
    { takenBy: to.takenBy, items: assetIds.length, ...(to.earlyReason && note ? { early: note } : {}), ...(to.late && note ? { late: note } : {}) },
  );
  return loadBooking(tx, id);
}

/** New days for a booking going out early or late: held again under the overlap rule (409 naming the other booking). */
async function setDays(tx: Scoped, booking: Booking, assetIds: string[], startsOn: string, endsOn: string) {
  const window: Window = { startsOn, endsOn, purpose: booking.purpose, exceptBookingId: booking.id };
  await assertBookable(tx, assetIds, window);
  Object.assign(booking, { startsOn, endsOn });
  await tx.save(Booking, booking);
  await holdingDates(tx, assetIds, window, () => tx.updateWhere(BookingItem, { bookingId: booking.id }, { startsOn, endsOn, active: true }));
}

/** Taken back at the counter against the packing list; what the return opened (incidents) goes on the record. */
export async function takeBack(
  tx: Scoped,
  actor: Actor,
  id: string,
  from: { broughtBackBy: string; checklist: ChecklistLine[]; incidents: { assetId: string; incidentId: string }[] },
): Promise<BookingView> {
  const booking = await lockedIn(tx, id, ['out'], 'Only a booking that is out can come back');
  Object.assign(booking, { receivedBy: actor.userId, broughtBackBy: from.broughtBackBy, returnChecklist: from.checklist });
  return end(tx, actor, booking, 'booking.returned', { broughtBackBy: from.broughtBackBy, incidents: from.incidents });
}

/** A booking that is out ends without the counter (every item of a lab trip is back): its days are free again. */
export async function closeBooking(tx: Scoped, actor: Actor, id: string, why: string): Promise<BookingView> {
  return end(tx, actor, await lockedIn(tx, id, ['out'], 'Only a booking that is out can be closed'), 'booking.closed', { why });
}

async function end(tx: Scoped, actor: Actor, booking: Booking, action: string, details: Record<string, unknown>) {
  Object.assign(booking, { state: 'returned', returnedAt: new Date() });
  await tx.save(Booking, booking);
  await tx.updateWhere(BookingItem, { bookingId: booking.id }, { active: false });
  await recordAudit(tx, actor, action, { type: 'booking', id: booking.id }, details);
  return loadBooking(tx, booking.id);
}

/** The booking row, locked until the transaction ends so two steps never cross, or 422 `booking_state`. */
async function lockedIn(tx: Scoped, id: string, states: BookingState[], only: string) {
  const booking = await tx.get(Booking, { id }, 'That booking', { lock: { mode: 'pessimistic_write' } });
  if (!states.includes(booking.state)) throw ruleBroken('booking_state', `${only}; this one is ${booking.state}.`);
  return booking;
}

const itemsOf = async (tx: Scoped, bookingId: string) => (await tx.find(BookingItem, { where: { bookingId } })).map((i) => i.assetId);

/** The requested items plus the kit's members; 404 for an item or kit the firm does not have. */
async function resolveAssets(tx: Scoped, assetIds: string[], kitId?: string) {
  const ids = new Set(assetIds);
  if (kitId) {
    await getKit(tx, kitId);
    for (const m of await kitMembers(tx, kitId)) ids.add(m.id);
    if (ids.size === 0) throw ruleBroken('kit_empty', 'That kit has no members to book.');
  }
  await getAssets(tx, [...ids]);
  return [...ids];
}

/** 422 for items the rule refuses, else 409 for items another booking holds, each with alternatives of the same type. */
async function assertBookable(tx: Scoped, assetIds: string[], w: Window) {
  const facts = await itemFacts(tx, assetIds);
  const refused = refusedItems(facts, w.endsOn, w.purpose);
  const conflicts = refused.length ? [] : await conflictingItems(tx, assetIds, w.startsOn, w.endsOn, w.exceptBookingId);
  if (!refused.length && !conflicts.length) return;
  const alternatives: Record<string, AlternativeItem[]> = {};
  if (w.purpose !== 'lab') {
    for (const assetId of new Set([...refused, ...conflicts].map((x) => x.assetId))) {
      const type = facts.find((f) => f.assetId === assetId)!.type;
      alternatives[assetId] = (await availableAssets(tx, { type, startsOn: w.startsOn, endsOn: w.endsOn, exclude: assetIds, limit: 5 })).map(
        ({ id, assetTag, model, dueOn }) => ({ id, assetTag, model, dueOn }),
      );
    }
  }
  // The firm's format is read only for a refusal: an accepted booking costs no extra query.
  const f = await loadFirmFormat(tx);
  if (refused.length) throw blockedError('Cannot book', refused, f, { alternatives });
  throw conflict(`Already booked: ${conflicts.map((c) => `${c.assetTag} (booked ${f.dateRange(c.startsOn, c.endsOn)})`).join('; ')}.`, {
    conflicts,
    alternatives,
  } satisfies BookingRefusalDetails);
}

/**
 * Writes a booking's days so that losing a race to another request (the
 * exclusion constraint's 23P01) is answered like a booking seen first: 409
 * naming the one that won. The savepoint keeps the caller's transaction able
 * to look that booking up.
 */
async function holdingDates(tx: Scoped, assetIds: string[], w: Window, write: () => Promise<unknown>) {
  await tx.manager.query('SAVEPOINT booking_days');
  try {
    await write();
  } catch (err) {
    if ((err as { code?: string })?.code !== '23P01') throw err;
    await tx.manager.query('ROLLBACK TO SAVEPOINT booking_days');
    await assertBookable(tx, assetIds, w);
    throw conflict('Another booking took one of these items a moment ago.');
  }
  await tx.manager.query('RELEASE SAVEPOINT booking_days');
}
