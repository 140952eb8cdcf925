import type { AssetStatus, AssetType } from '../../shared/schemas/assets';
import type { Scoped } from '../db/scoped';

/** True when a tip (alias `a`) has a mounting position whose latest validation did not pass. */
const TIP_NOT_VALIDATED = (a: string) => `(${a}.type = 'tip' AND EXISTS (
  SELECT 1 FROM jsonb_array_elements_text(coalesce(${a}.specs->'positions', '[]'::jsonb)) AS pos(position)
   WHERE coalesce((SELECT fc.decision FROM field_checks fc
                    WHERE fc.organization_id = ${a}.organization_id AND fc.asset_id = ${a}.id AND fc.kind = 'tip_validation' AND fc.position = pos.position
                    ORDER BY fc.performed_at DESC, fc.created_at DESC LIMIT 1), 'none') <> 'pass'))`;

export type ItemFacts = {
  assetId: string;
  assetTag: string;
  type: AssetType;
  status: AssetStatus;
  calibrationRequired: boolean;
  dueOn: string | null;
  tipValidated: boolean;
};

/** What the booking rule (shared/bookings/rules.ts) needs to know of each item, in one query. */
export function itemFacts(tx: Scoped, assetIds: string[]) {
  return tx.sql<ItemFacts>(
    `SELECT a.id AS "assetId", a.asset_tag AS "assetTag", a.type, a.status, a.calibration_required AS "calibrationRequired",
            to_char(a.due_on, 'YYYY-MM-DD') AS "dueOn", NOT ${TIP_NOT_VALIDATED('a')} AS "tipValidated"
       FROM assets a
      WHERE a.organization_id = $1 AND a.id = ANY($2)
      ORDER BY a.asset_tag`,
    [assetIds],
  );
}

/** Active bookings that hold any of these assets on any day of the window. */
export function conflictingItems(tx: Scoped, assetIds: string[], startsOn: string, endsOn: string, exceptBookingId: string | null = null) {
  return tx.sql<{ assetId: string; assetTag: string; bookingId: string; startsOn: string; endsOn: string }>(
    `SELECT bi.asset_id AS "assetId", a.asset_tag AS "assetTag", bi.booking_id AS "bookingId",
            to_char(bi.starts_on, 'YYYY-MM-DD') AS "startsOn", to_char(bi.ends_on, 'YYYY-MM-DD') AS "endsOn"
       FROM booking_items bi JOIN assets a ON a.id = bi.asset_id
      WHERE bi.organization_id = $1 AND bi.active AND bi.asset_id = ANY($2)
        AND daterange(bi.starts_on, bi.ends_on, '[]') && daterange($3::date, $4::date, '[]')
        AND ($5::uuid IS NULL OR bi.booking_id <> $5::uuid)
      ORDER BY a.asset_tag, bi.starts_on`,
    [assetIds, startsOn, endsOn, exceptBookingId],
  );
}

/** The availability statement (exported for the prepared-statement benchmark); $1 is the organization. */
export const AVAILABLE_ASSETS = `SELECT a.id, a.asset_tag AS "assetTag", a.type, a.model, to_char(a.due_on, 'YYYY-MM-DD') AS "dueOn", k.name AS "kitName"
       FROM assets a LEFT JOIN kits k ON k.id = a.kit_id
      WHERE a.organization_id = $1 AND ($2::text IS NULL OR a.type = $2)
        AND a.status NOT IN ('retired', 'held', 'at_lab')
        AND (NOT a.calibration_required OR a.due_on >= $4::date)
        AND NOT (a.id = ANY($5))
        AND NOT EXISTS (SELECT 1 FROM booking_items bi
                         WHERE bi.asset_id = a.id AND bi.active AND bi.ends_on >= $3::date AND bi.starts_on <= $4::date)
        AND NOT ${TIP_NOT_VALIDATED('a')}
      ORDER BY a.kit_id IS NOT NULL, a.asset_tag
      LIMIT $6`;

/**
 * Assets of a type that are free and valid for the whole window (GET /api/availability,
 * and the alternatives a refusal offers). The booking rule written as a filter, so
 * the list can stop at `limit`; tests/api/booking-rule.test.ts proves it equal to
 * `blockReason` over generated fleets. Prepared, and shaped for that plan: assets in display
 * order (assets_availability_order), each probed for an overlapping active
 * booking (booking_items_active_by_asset; inclusive dates, so overlap is
 * ends_on >= start and starts_on <= end).
 */
export function availableAssets(tx: Scoped, opts: { type?: string; startsOn: string; endsOn: string; exclude?: string[]; limit: number }) {
  return tx.prepared<{ id: string; assetTag: string; type: string; model: string | null; dueOn: string | null; kitName: string | null }>(
    'available_assets',
    AVAILABLE_ASSETS,
    [opts.type ?? null, opts.startsOn, opts.endsOn, opts.exclude ?? [], opts.limit],
  );
}

export type BusyDays = { bookingId: string; startsOn: string; endsOn: string; purpose: string; jobReference: string | null };

/** The items' active bookings that end on or after `from`, earliest first, one row per booking (the lab window finder's gaps lie between them). */
export function busyDays(tx: Scoped, assetIds: string[], from: string) {
  return tx.sql<BusyDays>(
    `SELECT b.id AS "bookingId", to_char(min(bi.starts_on), 'YYYY-MM-DD') AS "startsOn", to_char(max(bi.ends_on), 'YYYY-MM-DD') AS "endsOn", b.purpose,
            j.reference AS "jobReference"
       FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id LEFT JOIN jobs j ON j.id = b.job_id
      WHERE bi.organization_id = $1 AND bi.asset_id = ANY($2) AND bi.active AND bi.ends_on >= $3::date
      GROUP BY b.id, j.reference ORDER BY min(bi.starts_on), b.id`,
    [assetIds, from],
  );
}
