import type { RecordPeriod } from '../../shared/records/views';
import type { Scoped } from '../db/scoped';

export type IncidentEntry = {
  id: string;
  assetId: string;
  kind: string;
  description: string;
  occurredAt: Date;
  location: string | null;
  state: string;
  resolution: string | null;
  reportedById: string;
  photos: { id: string; fileName: string; contentType: string; hasThumbnail: boolean }[];
};

/** The items' incidents that happened in the period, oldest first, with their photos (not their bytes). */
export function incidentsForRecord(tx: Scoped, assetIds: string[], period: RecordPeriod, timeZone: string): Promise<IncidentEntry[]> {
  return tx.sql<IncidentEntry>(
    `SELECT i.id, i.asset_id AS "assetId", i.kind, i.description, i.occurred_at AS "occurredAt", i.location, i.state, i.resolution,
            i.reported_by AS "reportedById",
            coalesce((SELECT json_agg(json_build_object('id', p.id, 'fileName', p.file_name, 'contentType', p.content_type, 'hasThumbnail', p.thumbnail IS NOT NULL)
                        ORDER BY p.created_at, p.id)
                       FROM incident_photos p WHERE p.organization_id = $1 AND p.incident_id = i.id), '[]') AS photos
       FROM incidents i
      WHERE i.organization_id = $1 AND i.asset_id = ANY($2::uuid[])
        AND ($3::date IS NULL OR (i.occurred_at AT TIME ZONE $5)::date >= $3::date)
        AND ($4::date IS NULL OR (i.occurred_at AT TIME ZONE $5)::date <= $4::date)
      ORDER BY i.asset_id, i.occurred_at, i.id`,
    [assetIds, period.from, period.to, timeZone],
  );
}

/** Small JPEG thumbnails of these photos, by photo id (photos without one are left out). */
export async function photoThumbnails(tx: Scoped, photoIds: string[]): Promise<Map<string, Buffer>> {
  if (!photoIds.length) return new Map();
  const rows = await tx.sql<{ id: string; thumbnail: Buffer }>(
    `SELECT id, thumbnail FROM incident_photos WHERE organization_id = $1 AND id = ANY($2::uuid[]) AND thumbnail IS NOT NULL`,
    [photoIds],
  );
  return new Map(rows.map((r) => [r.id, r.thumbnail]));
}
