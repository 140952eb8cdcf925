import type { DataSource } from 'typeorm';
import { addDays } from '../../shared/calibration/due-date';
import type { CalibrationReviewView, DueRow } from '../../shared/calibration/views';
import { readInOrganization, type Actor } from '../db/transaction';
import { documentFirm, loadOrgContext } from '../organizations';

/**
 * An item's place in the due order, undated first: the key of the partial index `assets_calibration_due` (items that
 * need calibration and are not retired), so every review query reads that index and never the rest of the fleet.
 */
const DUE_KEY = "coalesce(a.due_on, '-infinity'::date)";
const NEEDS_CALIBRATION = "a.organization_id = $1 AND a.calibration_required AND a.status <> 'retired'";

/**
 * Items overdue or due within `withinDays`, most urgent first, each with the
 * active bookings that end after its due date. Set-based: the due items once,
 * their threatened bookings in one join, not a query per item.
 */
export async function dueItems(tx: import('../db/scoped').Scoped, today: string, withinDays: number, limit: number | null = null) {
  return tx.sql<DueRow>(
    `WITH due AS MATERIALIZED (
       SELECT a.id, a.asset_tag, a.type, a.status, a.due_on, a.calibration_provider, a.kit_id FROM assets a
        WHERE ${NEEDS_CALIBRATION} AND ${DUE_KEY} <= $3::date
        ORDER BY ${DUE_KEY}, a.asset_tag ${limit ? 'LIMIT $4' : ''}),
     threats AS (
       SELECT bi.asset_id, json_agg(json_build_object('bookingId', b.id, 'startsOn', to_char(b.starts_on, 'YYYY-MM-DD'), 'endsOn', to_char(b.ends_on, 'YYYY-MM-DD'),
                                                     'jobReference', j.reference, 'customerName', j.customer_name) ORDER BY b.starts_on) AS list
         FROM due d JOIN booking_items bi ON bi.asset_id = d.id AND bi.active AND bi.ends_on > coalesce(d.due_on, '-infinity'::date)
         JOIN bookings b ON b.id = bi.booking_id AND b.purpose <> 'lab' LEFT JOIN jobs j ON j.id = b.job_id
        GROUP BY bi.asset_id)
     SELECT d.id, d.asset_tag AS "assetTag", d.type, d.status, to_char(d.due_on, 'YYYY-MM-DD') AS "dueOn", d.calibration_provider AS provider,
            d.kit_id AS "kitId", k.name AS "kitName",
            CASE WHEN d.due_on IS NULL OR d.due_on < $2::date THEN 'overdue' ELSE 'due_soon' END AS state,
            coalesce(t.list, '[]'::json) AS threatened
       FROM due d LEFT JOIN threats t ON t.asset_id = d.id LEFT JOIN kits k ON k.id = d.kit_id
      ORDER BY d.due_on NULLS FIRST, d.asset_tag`,
    limit ? [today, addDays(today, withinDays), limit] : [today, addDays(today, withinDays)],
  );
}

/** The review page shows the most urgent items; the CSV has them all. */
export const REVIEW_LIST_LIMIT = 200;

/** The owner's review page: what is due, what it threatens, what is at the lab, the year ahead, open impact reviews. */
export class ReviewService {
  constructor(private readonly db: DataSource) {}

  due(actor: Actor, withinDays: number) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      return { today: ctx.today, withinDays, items: await dueItems(tx, ctx.today, withinDays) };
    });
  }

  /** Every item in the firm's due-soon window (for the CSV and PDF). */
  dueWithinWindow(actor: Actor) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      return { firm: documentFirm(ctx), today: ctx.today, items: await dueItems(tx, ctx.today, ctx.dueSoonDays) };
    });
  }

  review(actor: Actor): Promise<CalibrationReviewView> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const [items, [counts], timeline, atLab, reviews] = await Promise.all([
        dueItems(tx, ctx.today, ctx.dueSoonDays, REVIEW_LIST_LIMIT),
        tx.sql<{ overdue: number; dueSoon: number }>(
          `SELECT count(*) FILTER (WHERE ${DUE_KEY} < $2::date)::int AS overdue, count(*) FILTER (WHERE ${DUE_KEY} >= $2::date)::int AS "dueSoon"
             FROM assets a WHERE ${NEEDS_CALIBRATION} AND ${DUE_KEY} <= $3::date`,
          [ctx.today, addDays(ctx.today, ctx.dueSoonDays)],
        ),
        tx.sql<{ weekStart: string; count: number }>(
          // Counted per due day from the index (a few hundred rows), then summed into the 52 weeks from this ISO week's Monday.
          `WITH monday AS (SELECT $2::date - (extract(isodow FROM $2::date)::int - 1) AS d),
                days AS (SELECT ${DUE_KEY} AS day, count(*)::int AS n FROM assets a, monday
                          WHERE ${NEEDS_CALIBRATION} AND ${DUE_KEY} >= monday.d AND ${DUE_KEY} < monday.d + 364 GROUP BY 1),
                weeks AS (SELECT monday.d + 7 * k AS w FROM monday, generate_series(0, 51) AS k)
           SELECT to_char(w, 'YYYY-MM-DD') AS "weekStart", coalesce(sum(days.n), 0)::int AS count
             FROM weeks LEFT JOIN days ON days.day >= w AND days.day < w + 7
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
        /** Totals, which exceed the lists when more than REVIEW_LIST_LIMIT items are due. */
        counts,
        listLimit: REVIEW_LIST_LIMIT,
        byKit: [...kits.values()],
        timeline,
        atLab,
        impactReviews: reviews,
      };
    });
  }
}
