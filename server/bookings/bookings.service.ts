import { In, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { blockReasonText } from '../../shared/bookings/rules';
import type { availabilityQuery, BookingPayload, bookingListQuery, BookingPurpose } from '../../shared/schemas/bookings';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { Asset } from '../fleet/asset.entity';
import { Kit } from '../fleet/kit.entity';
import { AppError, conflict, notFound, ruleBroken } from '../http/errors';
import { availableAssets, blockedItems, conflictingItems } from './booking-queries';
import { Booking, BookingItem } from './booking.entity';
import { Job } from './job.entity';
import { listReply } from '../http/list-reply';

const isExclusionViolation = (err: unknown) => (err as { code?: string })?.code === '23P01';

type RentalLabel = { id: string; number: string; customerCompany: string };

/** The rental (number and customer) behind each rental booking, in one query. */
export async function bookingRentals(tx: Scoped, bookings: Pick<Booking, 'rentalId'>[]): Promise<Map<string, RentalLabel>> {
  const ids = [...new Set(bookings.map((b) => b.rentalId).filter((id): id is string => !!id))];
  if (!ids.length) return new Map();
  const rows = await tx.sql<RentalLabel>(`SELECT r.id, r.number, c.company AS "customerCompany" FROM rentals r JOIN customers c ON c.id = r.customer_id WHERE r.organization_id = $1 AND r.id = ANY($2)`, [ids]);
  return new Map(rows.map((r) => [r.id, r]));
}

export type BookingView = ReturnType<typeof bookingView>;
export const bookingView = (b: Booking, items: Pick<Asset, 'id' | 'assetTag' | 'type' | 'status'>[], rentals: Map<string, RentalLabel>) => ({
  id: b.id,
  state: b.state,
  purpose: b.purpose,
  startsOn: b.startsOn,
  endsOn: b.endsOn,
  jobId: b.jobId,
  job: b.job ? { id: b.job.id, reference: b.job.reference, customerName: b.job.customerName } : null,
  rentalId: b.rentalId,
  rental: b.rentalId ? (rentals.get(b.rentalId) ?? null) : null,
  kitId: b.kitId,
  kit: b.kit ? { id: b.kit.id, name: b.kit.name } : null,
  note: b.note,
  assetIds: items.map((i) => i.id),
  items: items.map((i) => ({ id: i.id, assetTag: i.assetTag, type: i.type, status: i.status })),
  checkedOutAt: b.checkedOutAt?.toISOString() ?? null,
  takenBy: b.takenBy,
  takenByUserId: b.takenByUserId,
  checkoutChecklist: b.checkoutChecklist,
  returnedAt: b.returnedAt?.toISOString() ?? null,
  broughtBackBy: b.broughtBackBy,
  returnChecklist: b.returnChecklist,
  createdAt: b.createdAt.toISOString(),
});

/** Items of the booking, in packing-list order. */
export async function bookingAssets(tx: Scoped, bookingIds: string[]) {
  if (!bookingIds.length) return [];
  return tx.sql<{ bookingId: string; id: string; assetTag: string; type: Asset['type']; status: Asset['status'] }>(
    `SELECT bi.booking_id AS "bookingId", a.id, a.asset_tag AS "assetTag", a.type, a.status
       FROM booking_items bi JOIN assets a ON a.id = bi.asset_id
      WHERE bi.organization_id = $1 AND bi.booking_id = ANY($2) ORDER BY a.type, a.asset_tag`,
    [bookingIds],
  );
}

export type BookingHooks = {
  onReschedule?: (tx: Scoped, booking: Booking) => Promise<void>;
  onCancel?: (tx: Scoped, booking: Booking) => Promise<void>;
};

export class BookingsService {
  constructor(
    private readonly db: DataSource,
    /** What other components do when a reservation moves or is cancelled (rentals: re-price, let the deposit hold go). */
    private readonly hooks: BookingHooks = {},
  ) {}

  /**
   * Book whole days; `within` runs in the same transaction once the booking exists. Refuses (422) items that may not go out for the window,
   * then (409) items another booking holds; the exclusion constraint settles
   * any race between two requests. Both answers offer free, valid alternatives.
   */
  async create(actor: Actor, input: BookingPayload, within?: (tx: Scoped, booking: BookingView) => Promise<void>) {
    try {
      return await inOrganization(this.db, actor.organizationId, async (tx) => {
        // Every record the request names is the firm's (else 404) before any rule about them is judged.
        const assetIds = await this.resolveAssets(tx, input.assetIds ?? [], input.kitId);
        if (input.jobId) await tx.get(Job, { id: input.jobId }, 'That job');
        await this.assertBookable(tx, assetIds, input.startsOn, input.endsOn, null);
        const purpose: BookingPurpose = input.rentalId ? 'rental' : input.jobId ? 'job' : 'internal';
        const booking = await tx.insert(Booking, {
          startsOn: input.startsOn,
          endsOn: input.endsOn,
          state: 'reserved',
          purpose,
          jobId: input.jobId ?? null,
          rentalId: input.rentalId ?? null,
          kitId: input.kitId ?? null,
          note: input.note ?? null,
          createdBy: actor.userId,
        });
        await tx.insertMany(BookingItem, assetIds.map((assetId) => ({ bookingId: booking.id, assetId, startsOn: input.startsOn, endsOn: input.endsOn, active: true })));
        await recordAudit(tx, actor, 'booking.created', { type: 'booking', id: booking.id }, { assetIds, startsOn: input.startsOn, endsOn: input.endsOn, purpose });
        const view = await this.load(tx, booking.id);
        // What the booking is for (a rental, say) is written in the same transaction.
        if (within) await within(tx, view);
        return view;
      });
    } catch (err) {
      if (!isExclusionViolation(err)) throw err;
      // Another request booked one of these items a moment ago: answer as if we had seen it first.
      return inOrganization(this.db, actor.organizationId, async (tx) => {
        const assetIds = await this.resolveAssets(tx, input.assetIds ?? [], input.kitId);
        await this.assertBookable(tx, assetIds, input.startsOn, input.endsOn, null);
        throw conflict('Another booking took one of these items a moment ago.');
      });
    }
  }

  /** Change the dates under the same rules. */
  async reschedule(actor: Actor, id: string, input: { startsOn: string; endsOn: string; note?: string }) {
    try {
      return await inOrganization(this.db, actor.organizationId, async (tx) => {
        const booking = await tx.get(Booking, { id }, 'That booking');
        if (booking.state !== 'reserved') throw ruleBroken('booking_state', `Only a reserved booking can move; this one is ${booking.state}.`);
        const assetIds = (await tx.find(BookingItem, { where: { bookingId: id } })).map((i) => i.assetId);
        await this.assertBookable(tx, assetIds, input.startsOn, input.endsOn, id);
        const before = { startsOn: booking.startsOn, endsOn: booking.endsOn };
        Object.assign(booking, { startsOn: input.startsOn, endsOn: input.endsOn, note: input.note ?? booking.note });
        await tx.save(Booking, booking);
        await tx.updateWhere(BookingItem, { bookingId: id }, { startsOn: input.startsOn, endsOn: input.endsOn });
        await this.hooks.onReschedule?.(tx, booking);
        await recordAudit(tx, actor, 'booking.rescheduled', { type: 'booking', id }, { before, after: input });
        return this.load(tx, id);
      });
    } catch (err) {
      if (isExclusionViolation(err)) throw conflict('Another booking took one of these items for those dates a moment ago.');
      throw err;
    }
  }

  cancel(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await tx.get(Booking, { id }, 'That booking');
      if (booking.state !== 'reserved') throw ruleBroken('booking_state', `Only a reserved booking can be cancelled; this one is ${booking.state}.`);
      booking.state = 'cancelled';
      await tx.save(Booking, booking);
      await tx.updateWhere(BookingItem, { bookingId: id }, { active: false });
      await this.hooks.onCancel?.(tx, booking);
      await recordAudit(tx, actor, 'booking.cancelled', { type: 'booking', id });
      return this.load(tx, id);
    });
  }

  get(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, (tx) => this.load(tx, id));
  }

  async load(tx: Scoped, id: string) {
    const booking = await tx.get(Booking, { id }, 'That booking', { relations: { job: true, kit: true } });
    return bookingView(booking, await bookingAssets(tx, [id]), await bookingRentals(tx, [booking]));
  }

  list(actor: Actor, q: z.infer<typeof bookingListQuery>) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const qb = tx.select(Booking, 'b').leftJoinAndSelect('b.job', 'j').leftJoinAndSelect('b.kit', 'k').orderBy('b.starts_on', 'ASC').addOrderBy('b.created_at', 'ASC');
      if (q.from) qb.andWhere('b.ends_on >= :from', { from: q.from });
      if (q.to) qb.andWhere('b.starts_on <= :to', { to: q.to });
      if (q.state?.length) qb.andWhere('b.state IN (:...states)', { states: q.state });
      if (q.jobId) qb.andWhere('b.job_id = :jobId', { jobId: q.jobId });
      if (q.kitId) qb.andWhere('b.kit_id = :kitId', { kitId: q.kitId });
      if (q.assetId) qb.andWhere('EXISTS (SELECT 1 FROM booking_items bi WHERE bi.booking_id = b.id AND bi.asset_id = :assetId)', { assetId: q.assetId });
      const [rows, total] = await qb.take(q.limit).skip(q.offset).getManyAndCount();
      const items = await bookingAssets(tx, rows.map((r) => r.id));
      const rentals = await bookingRentals(tx, rows);
      return { items: rows.map((b) => bookingView(b, items.filter((i) => i.bookingId === b.id), rentals)), total };
    });
  }

  availability(actor: Actor, q: z.infer<typeof availabilityQuery>) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => listReply(await availableAssets(tx, { type: q.type, startsOn: q.startsOn, endsOn: q.endsOn, limit: q.limit })));
  }

  private async resolveAssets(tx: Scoped, assetIds: string[], kitId?: string) {
    const ids = new Set(assetIds);
    if (kitId) {
      await tx.get(Kit, { id: kitId }, 'That kit');
      for (const m of await tx.find(Asset, { where: { kitId } })) ids.add(m.id);
      if (ids.size === 0) throw ruleBroken('kit_empty', 'That kit has no members to book.');
    }
    const found = await tx.find(Asset, { where: { id: In([...ids]) } });
    const missing = [...ids].filter((id) => !found.some((a) => a.id === id));
    if (missing.length) throw notFound(`Asset ${missing[0]}`);
    return [...ids];
  }

  private async assertBookable(tx: Scoped, assetIds: string[], startsOn: string, endsOn: string, exceptBookingId: string | null) {
    const blocked = await blockedItems(tx, assetIds, endsOn);
    const conflicts = blocked.length ? [] : await conflictingItems(tx, assetIds, startsOn, endsOn, exceptBookingId);
    if (!blocked.length && !conflicts.length) return;
    const troubled = [...blocked.map((b) => ({ assetId: b.assetId, type: b.type })), ...(await this.typesOf(tx, conflicts.map((c) => c.assetId)))];
    const alternatives: Record<string, { id: string; assetTag: string; model: string | null; dueOn: string | null }[]> = {};
    for (const t of troubled) {
      alternatives[t.assetId] = (await availableAssets(tx, { type: t.type, startsOn, endsOn, exclude: assetIds, limit: 5 })).map(({ id, assetTag, model, dueOn }) => ({ id, assetTag, model, dueOn }));
    }
    if (blocked.length) {
      throw new AppError(422, 'booking_blocked', `Cannot book: ${blocked.map((b) => `${b.assetTag} — ${blockReasonText[b.reason]}`).join('; ')}.`, {
        blocked: blocked.map(({ assetId, assetTag, reason }) => ({ assetId, assetTag, reason })),
        alternatives,
      });
    }
    throw conflict(`Already booked: ${conflicts.map((c) => `${c.assetTag} (${c.startsOn} to ${c.endsOn})`).join('; ')}.`, { conflicts, alternatives });
  }

  private async typesOf(tx: Scoped, assetIds: string[]) {
    const unique = [...new Set(assetIds)];
    if (!unique.length) return [];
    return (await tx.find(Asset, { where: { id: In(unique) } })).map((a) => ({ assetId: a.id, type: a.type as string }));
  }
}
