import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { Page } from '../../shared/lists/page';
import type { availabilityQuery, BookingPayload, bookingListQuery } from '../../shared/schemas/bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { listReply } from '../http/list-reply';
import { availableAssets } from './booking-queries';
import { bookingViews, type BookingView } from './booking-view';
import { Booking } from './booking.entity';
import { book, cancelBooking, changeItems, loadBooking, moveBooking } from './lifecycle';

export type BookingHooks = {
  /** After new dates or new items. */
  onReschedule?: (tx: Scoped, booking: BookingView) => Promise<void>;
  onCancel?: (tx: Scoped, booking: BookingView) => Promise<void>;
};

/** The booking board over HTTP: each step one transaction around the lifecycle (lifecycle.ts). */
export class BookingsService {
  constructor(
    private readonly db: DataSource,
    /** What other components do when a reservation moves or is cancelled (rentals: re-price, let the deposit hold go). */
    private readonly hooks: BookingHooks = {},
  ) {}

  create(actor: Actor, input: BookingPayload) {
    return inOrganization(this.db, actor.organizationId, (tx) => book(tx, actor, input));
  }

  reschedule(actor: Actor, id: string, input: { startsOn: string; endsOn: string; note?: string }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await moveBooking(tx, actor, id, input);
      await this.hooks.onReschedule?.(tx, booking);
      return booking;
    });
  }

  /** Add, remove or swap items; a rental's price follows its items as it follows its dates. */
  changeItems(actor: Actor, id: string, change: { add: string[]; remove: string[] }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await changeItems(tx, actor, id, change);
      await this.hooks.onReschedule?.(tx, booking);
      return booking;
    });
  }

  cancel(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await cancelBooking(tx, actor, id);
      await this.hooks.onCancel?.(tx, booking);
      return booking;
    });
  }

  get(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, (tx) => loadBooking(tx, id));
  }

  list(actor: Actor, q: z.infer<typeof bookingListQuery>): Promise<Page<BookingView>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const qb = tx
        .select(Booking, 'b')
        .leftJoinAndSelect('b.job', 'j')
        .leftJoinAndSelect('b.kit', 'k')
        .orderBy('b.starts_on', 'ASC')
        .addOrderBy('b.created_at', 'ASC');
      if (q.from) qb.andWhere('b.ends_on >= :from', { from: q.from });
      if (q.to) qb.andWhere('b.starts_on <= :to', { to: q.to });
      if (q.state?.length) qb.andWhere('b.state IN (:...states)', { states: q.state });
      if (q.jobId) qb.andWhere('b.job_id = :jobId', { jobId: q.jobId });
      if (q.kitId) qb.andWhere('b.kit_id = :kitId', { kitId: q.kitId });
      if (q.assetId) qb.andWhere('EXISTS (SELECT 1 FROM booking_items bi WHERE bi.booking_id = b.id AND bi.asset_id = :assetId)', { assetId: q.assetId });
      const [rows, total] = await qb.take(q.limit).skip(q.offset).getManyAndCount();
      return { items: await bookingViews(tx, rows), total };
    });
  }

  availability(actor: Actor, q: z.infer<typeof availabilityQuery>) {
    return readInOrganization(this.db, actor.organizationId, async (tx) =>
      listReply(await availableAssets(tx, { type: q.type, startsOn: q.startsOn, endsOn: q.endsOn, limit: q.limit })),
    );
  }
}
