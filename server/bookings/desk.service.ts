import type { DataSource } from 'typeorm';
import type { CounterDayView, MyKitView } from '../../shared/bookings/views';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { loadOrgContext } from '../organizations';
import { itemFacts } from './booking-queries';
import { refusedItems } from './booking-rule';
import { bookingViews } from './booking-view';
import { Booking } from './booking.entity';
import { markNotCollected } from './lifecycle';
import type { Scoped } from '../db/scoped';

/** What the manager's and the technician's home pages show about bookings. */
export class DeskService {
  constructor(private readonly db: DataSource) {}

  private async views(tx: Scoped, where: string, params: unknown[]) {
    const rows = await tx
      .select(Booking, 'b')
      .leftJoinAndSelect('b.job', 'j')
      .leftJoinAndSelect('b.kit', 'k')
      .andWhere(where, Object.fromEntries(params.map((p, i) => [`p${i}`, p])))
      .orderBy('b.starts_on')
      .take(100)
      .getMany();
    return bookingViews(tx, rows);
  }

  /**
   * Today's checkouts and returns, late returns, reservations not collected, and reserved bookings an item
   * no longer qualifies for. The day begins by marking reservations whose days passed as not collected
   * (the daily routine does too), so the counter never offers last month's reservation as today's.
   */
  today(actor: Actor): Promise<CounterDayView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const { today } = await loadOrgContext(tx);
      await markNotCollected(tx, today);
      const [checkouts, returns, late, notCollected, upcoming] = await Promise.all([
        this.views(tx, "b.state = 'reserved' AND b.starts_on <= :p0", [today]),
        this.views(tx, "b.state = 'out' AND b.ends_on = :p0", [today]),
        this.views(tx, "b.state = 'out' AND b.ends_on < :p0", [today]),
        this.views(tx, "b.state = 'not_collected'", []),
        this.views(tx, "b.state = 'reserved' AND b.ends_on >= :p0", [today]),
      ]);
      // Every upcoming item's facts in one query, judged per booking by the booking rule.
      const facts = await itemFacts(tx, [...new Set(upcoming.flatMap((b) => b.assetIds))]);
      const blocked = upcoming.flatMap((b) => {
        const problems = refusedItems(
          facts.filter((f) => b.assetIds.includes(f.assetId)),
          b.endsOn,
          b.purpose,
        );
        return problems.length ? [{ ...b, blocked: problems }] : [];
      });
      return { today, checkouts, returns, late, notCollected, blocked };
    });
  }

  /** Kit a technician carries now and next: taken by them, or on jobs they lead. */
  mine(actor: Actor): Promise<MyKitView> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const { today } = await loadOrgContext(tx);
      const mine = '(b.taken_by_user_id = :p0 OR j.lead_technician_id = :p0) AND b.ends_on >= :p1';
      const [now, next] = await Promise.all([
        this.views(tx, `${mine} AND b.state = 'out'`, [actor.userId, '0001-01-01']),
        this.views(tx, `${mine} AND b.state = 'reserved'`, [actor.userId, today]),
      ]);
      return { now, next };
    });
  }
}
