import type { AsFound } from '../../shared/calibration/interval-review';
import type { ImpactAssessment } from '../../shared/calibration/views';
import type { RecordPeriod } from '../../shared/records/views';
import type { Scoped } from '../db/scoped';

/** A calibration as the equipment record lists it; people and files are named by id for the record to resolve. */
export type CalibrationEntry = {
  id: string;
  assetId: string;
  performedOn: string;
  provider: string;
  certificateNumber: string;
  certificateFileId: string | null;
  fileName: string | null;
  sizeBytes: number | null;
  asFound: AsFound;
  asLeft: AsFound;
  intervalMonths: number;
  dueOn: string;
  note: string | null;
  recordedById: string;
  createdAt: Date;
};

/**
 * The items' calibrations within the period, and for each item the one before it began (the certificate that
 * covered its first days), oldest first.
 */
export function calibrationsForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod): Promise<CalibrationEntry[]> {
  return tx.sql<CalibrationEntry>(
    `SELECT e.id, e.asset_id AS "assetId", to_char(e.performed_on, 'YYYY-MM-DD') AS "performedOn", e.provider, e.certificate_number AS "certificateNumber",
            f.id AS "certificateFileId", f.file_name AS "fileName", f.size_bytes AS "sizeBytes", e.as_found AS "asFound", e.as_left AS "asLeft",
            e.interval_months AS "intervalMonths", to_char(e.due_on, 'YYYY-MM-DD') AS "dueOn", e.note, e.recorded_by AS "recordedById", e.created_at AS "createdAt"
       FROM calibration_events e LEFT JOIN certificate_files f ON f.id = e.certificate_file_id AND f.organization_id = e.organization_id
      WHERE e.organization_id = $1 AND e.asset_id = ANY($2::uuid[]) AND ($4::date IS NULL OR e.performed_on <= $4::date)
        AND ($3::date IS NULL OR e.performed_on >= $3::date OR e.id = (
              SELECT x.id FROM calibration_events x WHERE x.organization_id = $1 AND x.asset_id = e.asset_id AND x.performed_on < $3::date
               ORDER BY x.performed_on DESC, x.created_at DESC LIMIT 1))
      ORDER BY e.asset_id, e.performed_on, e.created_at`,
    [assetIds, period.from, period.to],
  );
}

/** A stored certificate's bytes, or null when the file is gone. */
export async function certificateBytes(tx: Scoped, fileId: string): Promise<Buffer | null> {
  const [row] = await tx.sql<{ data: Buffer | null }>(`SELECT data FROM certificate_files WHERE organization_id = $1 AND id = $2`, [fileId]);
  return row?.data ?? null;
}

export type ImpactReviewEntry = {
  id: string;
  assetId: string;
  trigger: 'calibration' | 'check';
  triggerId: string;
  since: string | null;
  foundOn: string;
  state: 'open' | 'closed';
  openedAt: Date;
  closedAt: Date | null;
  bookings: {
    bookingId: string;
    jobReference: string | null;
    customerName: string | null;
    contactEmail: string | null;
    startsOn: string;
    endsOn: string;
    assessment: ImpactAssessment | null;
    note: string | null;
    assessedById: string | null;
    assessedAt: string | null;
    noticeQueuedAt: string | null;
  }[];
};

/** The items' impact reviews found in the period or still open during it, each with its assessed bookings. */
export function impactReviewsForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod): Promise<ImpactReviewEntry[]> {
  return tx.sql<ImpactReviewEntry>(
    `SELECT r.id, r.asset_id AS "assetId", r.trigger, r.trigger_id AS "triggerId", to_char(r.since, 'YYYY-MM-DD') AS since,
            to_char(r.found_on, 'YYYY-MM-DD') AS "foundOn", r.state, r.created_at AS "openedAt", r.closed_at AS "closedAt",
            coalesce((SELECT json_agg(json_build_object(
                'bookingId', i.booking_id, 'jobReference', j.reference, 'customerName', j.customer_name, 'contactEmail', j.contact_email,
                'startsOn', to_char(b.starts_on, 'YYYY-MM-DD'), 'endsOn', to_char(b.ends_on, 'YYYY-MM-DD'), 'assessment', i.assessment, 'note', i.note,
                'assessedById', i.assessed_by, 'assessedAt', i.assessed_at, 'noticeQueuedAt', i.notice_queued_at) ORDER BY b.starts_on, i.booking_id)
               FROM impact_review_items i JOIN bookings b ON b.id = i.booking_id LEFT JOIN jobs j ON j.id = b.job_id
              WHERE i.organization_id = $1 AND i.review_id = r.id), '[]') AS bookings
       FROM impact_reviews r
      WHERE r.organization_id = $1 AND r.asset_id = ANY($2::uuid[]) AND ($4::date IS NULL OR r.found_on <= $4::date)
        AND ($3::date IS NULL OR r.found_on >= $3::date OR r.state = 'open' OR r.closed_at >= $3::date)
      ORDER BY r.asset_id, r.found_on, r.created_at`,
    [assetIds, period.from, period.to],
  );
}

/** Items found out of tolerance as found at a calibration in the period. */
export async function outOfToleranceAssetIds(tx: Scoped, period: RecordPeriod): Promise<string[]> {
  const rows = await tx.sql<{ id: string }>(
    `SELECT DISTINCT asset_id AS id FROM calibration_events WHERE organization_id = $1 AND as_found = 'out_of_tolerance'
        AND ($2::date IS NULL OR performed_on >= $2::date) AND ($3::date IS NULL OR performed_on <= $3::date)`,
    [period.from, period.to],
  );
  return rows.map((r) => r.id);
}
