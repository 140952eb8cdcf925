import type { DataSource } from 'typeorm';
import type { RevenueRow, UtilisationRow } from '../../shared/billing/views';
import { bookingDays } from '../../shared/bookings/rules';
import { readInOrganization, type Actor } from '../db/transaction';
import { listReply } from '../http/list-reply';
import type { Page } from '../../shared/lists/page';

/** The owner's and clerk's money views: revenue per kit and month, kit utilisation. */
export class BillingReportsService {
  constructor(private readonly db: DataSource) {}

  /** Net invoiced per kit (loose items together) and month of issue, credit notes subtracted. */
  revenue(actor: Actor, q: { from: string; to: string }): Promise<Page<RevenueRow>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) =>
      listReply(
        await tx.sql<RevenueRow>(
          `SELECT b.kit_id AS "kitId", coalesce(k.name, 'Loose items') AS "kitName", to_char(i.issued_on, 'YYYY-MM') AS month,
                  sum(CASE WHEN i.kind = 'invoice' THEN i.subtotal_minor ELSE -i.subtotal_minor END)::int AS "revenueMinor"
             FROM invoices i JOIN rentals r ON r.id = i.rental_id JOIN bookings b ON b.id = r.booking_id
             LEFT JOIN kits k ON k.id = b.kit_id
            WHERE i.organization_id = $1 AND i.issued_on >= to_date($2, 'YYYY-MM') AND i.issued_on < to_date($3, 'YYYY-MM') + interval '1 month'
            GROUP BY 1, 2, 3 ORDER BY 3, 2`,
          [q.from, q.to],
        ),
      ),
    );
  }

  /** Days each kit was booked out (jobs and rentals) within the period, over the days in the period. */
  utilisation(actor: Actor, q: { from: string; to: string }): Promise<Page<UtilisationRow>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const availableDays = bookingDays(q.from, q.to);
      const rows = await tx.sql<{ kitId: string; kitName: string; bookedDays: number }>(
        `SELECT k.id AS "kitId", k.name AS "kitName", count(DISTINCT d.day)::int AS "bookedDays"
           FROM kits k
           LEFT JOIN bookings b ON b.kit_id = k.id AND b.state <> 'cancelled' AND b.purpose IN ('job', 'rental') AND b.starts_on <= $3::date AND b.ends_on >= $2::date
           LEFT JOIN LATERAL generate_series(greatest(b.starts_on, $2::date), least(b.ends_on, $3::date), interval '1 day') AS d(day) ON b.id IS NOT NULL
          WHERE k.organization_id = $1
          GROUP BY k.id, k.name ORDER BY k.name`,
        [q.from, q.to],
      );
      return listReply(rows.map((r): UtilisationRow => ({ ...r, availableDays, ratio: r.bookedDays / availableDays })));
    });
  }
}
