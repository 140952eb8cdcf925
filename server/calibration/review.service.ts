import type { DataSource } from 'typeorm';
import { addDays } from '../../shared/calibration/due-date';
import { readInOrganization, type Actor } from '../db/transaction';
import { loadOrgContext } from '../organizations/org-context';

export type DueRow = {
  id: string;
  assetTag: string;
  type: string;
  status: string;
  dueOn: string | null;
  provider: string | null;
  kitId: string | null;
  kitName: string | null;
  state: 'overdue' | 'due_soon';
  threatened: { bookingId: string; startsOn: string; endsOn: string; jobReference: string | null; customerName: string | null }[];
};

/** Items overdue or due within `withinDays`, each with the active bookings that end after its due date. One query. */
export async function dueItems(tx: import('../db/scoped').Scoped, today: string, withinDays: number) {
  return tx.sql<DueRow>(
    `SELECT a.id, a.asset_tag AS "assetTag", a.type, a.status, to_char(a.due_on, 'YYYY-MM-DD') AS "dueOn", a.calibration_provider AS provider,
            a.kit_id AS "kitId", k.name AS "kitName",
            CASE WHEN a.due_on IS NULL OR a.due_on < $2::date THEN 'overdue' ELSE 'due_soon' END AS state,
            coalesce((SELECT json_agg(json_build_object('bookingId', b.id, 'startsOn', to_char(b.starts_on, 'YYYY-MM-DD'), 'endsOn', to_char(b.ends_on, 'YYYY-MM-DD'),
                                                        'jobReference', j.reference, 'customerName', j.customer_name) ORDER BY b.starts_on)
                        FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id LEFT JOIN jobs j ON j.id = b.job_id
                       WHERE bi.asset_id = a.id AND bi.active AND b.purpose <> 'lab' AND (a.due_on IS NULL OR bi.ends_on > a.due_on)), '[]'::json) AS threatened
       FROM assets a LEFT JOIN kits k ON k.id = a.kit_id
      WHERE a.organization_id = $1 AND a.calibration_required AND a.status <> 'retired'
        AND (a.due_on IS NULL OR a.due_on <= $3::date)
      ORDER BY a.due_on NULLS FIRST, a.asset_tag`,
    [today, addDays(today, withinDays)],
  );
}

/** The owner's review page: what is due, what it threatens, what is at the lab, the year ahead, open impact reviews. */
export class ReviewService {
  constructor(private readonly db: DataSource) {}

  due(actor: Actor, withinDays: number) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      return { today: ctx.today, withinDays, items: await dueItems(tx, ctx.today, withinDays) };
    });
  }

  review(actor: Actor) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const [items, timeline, atLab, reviews] = await Promise.all([
        dueItems(tx, ctx.today, ctx.dueSoonDays),
        tx.sql<{ weekStart: string; count: number }>(
          `SELECT to_char(w, 'YYYY-MM-DD') AS "weekStart", count(a.id)::int AS count
             FROM generate_series(date_trunc('week', $2::date), date_trunc('week', $2::date) + interval '51 weeks', interval '1 week') AS w
             LEFT JOIN assets a ON a.organization_id = $1 AND a.calibration_required AND a.status <> 'retired'
                               AND a.due_on >= w::date AND a.due_on < (w + interval '1 week')::date
            GROUP BY w ORDER BY w`,
          [ctx.today],
        ),
        tx.sql<{ tripId: string; provider: string; sentOn: string; expectedBackOn: string; late: boolean; assetId: string; assetTag: string }>(
          `SELECT t.id AS "tripId", t.provider, to_char(t.sent_on, 'YYYY-MM-DD') AS "sentOn", to_char(t.expected_back_on, 'YYYY-MM-DD') AS "expectedBackOn",
                  t.expected_back_on < $2::date AS late, a.id AS "assetId", a.asset_tag AS "assetTag"
             FROM lab_trips t JOIN lab_trip_items i ON i.lab_trip_id = t.id JOIN assets a ON a.id = i.asset_id
            WHERE t.organization_id = $1 AND t.state = 'at_lab' AND i.received_on IS NULL ORDER BY t.expected_back_on, a.asset_tag`,
          [ctx.today],
        ),
        tx.sql<{ id: string; assetId: string; assetTag: string; foundOn: string; bookings: number; assessed: number }>(
          `SELECT r.id, r.asset_id AS "assetId", a.asset_tag AS "assetTag", to_char(r.found_on, 'YYYY-MM-DD') AS "foundOn",
                  count(i.id)::int AS bookings, count(i.assessment)::int AS assessed
             FROM impact_reviews r JOIN assets a ON a.id = r.asset_id LEFT JOIN impact_review_items i ON i.review_id = r.id
            WHERE r.organization_id = $1 AND r.state = 'open' GROUP BY r.id, a.asset_tag ORDER BY r.found_on`,
        ),
      ]);
      const kits = new Map<string, { kitId: string; kitName: string; items: typeof items }>();
      for (const item of items.filter((i) => i.kitId)) {
        const entry = kits.get(item.kitId!) ?? { kitId: item.kitId!, kitName: item.kitName!, items: [] };
        entry.items.push(item);
        kits.set(item.kitId!, entry);
      }
      return {
        firm: ctx.name,
        today: ctx.today,
        dueSoonDays: ctx.dueSoonDays,
        overdue: items.filter((i) => i.state === 'overdue'),
        dueSoon: items.filter((i) => i.state === 'due_soon'),
        byKit: [...kits.values()],
        timeline,
        atLab,
        impactReviews: reviews,
      };
    });
  }
}
