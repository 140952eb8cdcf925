import type { BookingPayload, BookingPurpose, BookingState } from '../../shared/schemas/bookings';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import type { Actor } from '../db/transaction';
import { getAssets, getKit, kitMembers } from '../fleet';
import { conflict, notFound, ruleBroken } from '../http/errors';
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

/** The booking, or 422 `booking_state`: `only` says which state a step needs ("Only a reserved booking can move"). */
export async function bookingIn(tx: Scoped, id: string, state: BookingState, only: string): Promise<BookingView> {
  const booking = await loadBooking(tx, id);
  if (booking.state !== state) throw ruleBroken('booking_state', `${only}; this one is ${booking.state}.`);
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

/** Move a reserved booking to other dates under the same rules. */
export async function moveBooking(tx: Scoped, actor: Actor, id: string, dates: { startsOn: string; endsOn: string; note?: string }): Promise<BookingView> {
  const booking = await lockedIn(tx, id, 'reserved', 'Only a reserved booking can move');
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

/** Cancel a reserved booking: its days are free again. */
export async function cancelBooking(tx: Scoped, actor: Actor, id: string): Promise<BookingView> {
  const booking = await lockedIn(tx, id, 'reserved', 'Only a reserved booking can be cancelled');
  booking.state = 'cancelled';
  await tx.save(Booking, booking);
  await tx.updateWhere(BookingItem, { bookingId: id }, { active: false });
  await recordAudit(tx, actor, 'booking.cancelled', { type: 'booking', id });
  return loadBooking(tx, id);
}

/**
 * The booking goes out: to a person at the counter (with the packing list as
 * ticked) or to a calibration lab. Refuses (422) items that may no longer go.
 */
export async function checkOut(
  tx: Scoped,
  actor: Actor,
  id: string,
  to: { takenBy: string; takenByUserId?: string | null; checklist?: ChecklistLine[] },
): Promise<BookingView> {
  const booking = await lockedIn(tx, id, 'reserved', 'Only a reserved booking can be checked out');
  const assetIds = await itemsOf(tx, id);
  const refused = await refusals(tx, assetIds, booking.endsOn, booking.purpose);
  if (refused.length) throw blockedError('Cannot hand over', refused);
  Object.assign(booking, {
    state: 'out',
    checkedOutAt: new Date(),
    handedOverBy: actor.userId,
    takenBy: to.takenBy,
    takenByUserId: to.takenByUserId ?? null,
    checkoutChecklist: to.checklist ?? null,
  });
  await tx.save(Booking, booking);
  await recordAudit(tx, actor, 'booking.checked_out', { type: 'booking', id }, { takenBy: to.takenBy, items: assetIds.length });
  return loadBooking(tx, id);
}

/** Taken back at the counter against the packing list; what the return opened (incidents) goes on the record. */
export async function takeBack(
  tx: Scoped,
  actor: Actor,
  id: string,
  from: { broughtBackBy: string; checklist: ChecklistLine[]; incidents: { assetId: string; incidentId: string }[] },
): Promise<BookingView> {
  const booking = await lockedIn(tx, id, 'out', 'Only a booking that is out can come back');
  Object.assign(booking, { receivedBy: actor.userId, broughtBackBy: from.broughtBackBy, returnChecklist: from.checklist });
  return end(tx, actor, booking, 'booking.returned', { broughtBackBy: from.broughtBackBy, incidents: from.incidents });
}

/** A booking that is out ends without the counter (every item of a lab trip is back): its days are free again. */
export async function closeBooking(tx: Scoped, actor: Actor, id: string, why: string): Promise<BookingView> {
  return end(tx, actor, await lockedIn(tx, id, 'out', 'Only a booking that is out can be closed'), 'booking.closed', { why });
}

async function end(tx: Scoped, actor: Actor, booking: Booking, action: string, details: Record<string, unknown>) {
  Object.assign(booking, { state: 'returned', returnedAt: new Date() });
  await tx.save(Booking, booking);
  await tx.updateWhere(BookingItem, { bookingId: booking.id }, { active: false });
  await recordAudit(tx, actor, action, { type: 'booking', id: booking.id }, details);
  return loadBooking(tx, booking.id);
}

/** The booking row, locked until the transaction ends so two steps never cross, or 422 `booking_state`. */
async function lockedIn(tx: Scoped, id: string, state: BookingState, only: string) {
  const booking = await tx.get(Booking, { id }, 'That booking', { lock: { mode: 'pessimistic_write' } });
  if (booking.state !== state) throw ruleBroken('booking_state', `${only}; this one is ${booking.state}.`);
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
  if (refused.length) throw blockedError('Cannot book', refused, { alternatives });
  throw conflict(`Already booked: ${conflicts.map((c) => `${c.assetTag} (${c.startsOn} to ${c.endsOn})`).join('; ')}.`, {
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
