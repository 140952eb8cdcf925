import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { RentalSummary, RevenueRow, UtilisationRow } from '../../shared/billing/views';
import { bookingDays } from '../../shared/bookings/rules';
import type { rentalListQuery } from '../../shared/schemas/rentals';
import { readInOrganization, type Actor } from '../db/transaction';
import { listReply } from '../http/list-reply';
import type { Page } from '../../shared/lists/page';

/** The owner's and clerk's money views: rentals by what is left to settle, revenue per kit and month, kit utilisation. */
export class BillingReportsService {
  constructor(private readonly db: DataSource) {}

  /**
   * Rentals with their deposit and invoice: open ones (not invoiced), those to
   * settle at return (back, with the invoice or the card authorization still
   * open), or all. One set-based query over rentals' rows and billing's own.
   */
  rentals(actor: Actor, q: z.infer<typeof rentalListQuery>) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const filter = {
        open: `b.state <> 'cancelled' AND inv.number IS NULL`,
        to_settle: `b.state = 'returned' AND (inv.number IS NULL OR d.state = 'authorized')`,
        all: 'true',
      }[q.view];
      const rows = await tx.sql<RentalSummary & { total: number }>(
        `SELECT r.id, r.number, c.id AS "customerId", c.company AS "customerCompany", k.name AS "kitName",
                (SELECT count(*)::int FROM booking_items bi WHERE bi.booking_id = b.id) AS "itemCount",
                to_char(b.starts_on, 'YYYY-MM-DD') AS "startsOn", to_char(b.ends_on, 'YYYY-MM-DD') AS "endsOn",
                r.currency, (r.quote->>'totalMinor')::int AS "totalMinor", r.deposit_minor AS "depositMinor",
                CASE WHEN b.state = 'cancelled' THEN 'cancelled' WHEN inv.number IS NOT NULL THEN 'invoiced' ELSE b.state END AS state,
                coalesce(d.state, 'none') AS "depositState", d.capture_before AS "authorizationCaptureBefore", inv.number AS "invoiceNumber",
                count(*) OVER ()::int AS total
           FROM rentals r JOIN bookings b ON b.id = r.booking_id JOIN customers c ON c.id = r.customer_id
           LEFT JOIN kits k ON k.id = b.kit_id
           LEFT JOIN LATERAL (SELECT a.state, a.capture_before FROM deposit_authorizations a
                               WHERE a.rental_id = r.id AND a.kind = 'authorization' AND a.state <> 'replaced' ORDER BY a.created_at DESC LIMIT 1) d ON true
           LEFT JOIN invoices inv ON inv.rental_id = r.id AND inv.kind = 'invoice'
          WHERE r.organization_id = $1 AND ${filter} AND ($2::uuid IS NULL OR r.customer_id = $2)
          ORDER BY b.starts_on DESC, r.number DESC LIMIT $3 OFFSET $4`,
        [q.customerId ?? null, q.limit, q.offset],
      );
      return {
        items: rows.map(({ total: _t, ...r }) => ({
          ...r,
          authorizationCaptureBefore: r.authorizationCaptureBefore ? new Date(r.authorizationCaptureBefore).toISOString() : null,
        })),
        total: rows[0]?.total ?? 0,
      };
    });
  }

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
