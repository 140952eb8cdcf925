import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import {
  incidentKindTitles,
  type IncidentKind,
  type incidentListQuery,
  type incidentPayload,
  type IncidentState,
  type incidentUpdatePayload,
} from '../../shared/schemas/incidents';
import type { IncidentView } from '../../shared/incidents/views';
import { recordAudit } from '../audit/audit.service';
import { claimClientRecordId } from '../db/client-records';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { findAsset, getAsset, markDamaged, type AssetRecord } from '../fleet';
import { AppError, notFound, ruleBroken } from '../http/errors';
import { placeHold } from '../holds/holds.service';
import { enqueueMail, staffAddresses } from '../notifications';
import { incidentMail } from './incident-mail';
import { Incident, IncidentPhoto } from './incident.entity';
import { preparePhoto, type PreparedPhoto, type UploadedPhoto } from './photos';

export { preparePhoto, type PreparedPhoto, type UploadedPhoto } from './photos';

const nextStates: Record<IncidentState, IncidentState[]> = { reported: ['reviewing', 'resolved'], reviewing: ['resolved'], resolved: [] };
/** Kinds after which a lithium battery must be treated as damaged. */
const batteryDamageKinds = new Set(['dropped', 'impact', 'malfunction']);

type PhotoRow = Pick<IncidentPhoto, 'id' | 'contentType' | 'fileName' | 'sizeBytes'> & { hasThumbnail: boolean };

const view = (i: Incident, photos: PhotoRow[], asset?: AssetRecord): IncidentView => ({
  id: i.id,
  assetId: i.assetId,
  asset: asset ? { id: asset.id, assetTag: asset.assetTag, type: asset.type, status: asset.status } : undefined,
  kind: i.kind,
  description: i.description,
  occurredAt: i.occurredAt.toISOString(),
  location: i.location,
  bookingId: i.bookingId,
  customerName: i.customerName,
  state: i.state,
  resolution: i.resolution,
  chargeAmountMinor: i.chargeAmountMinor,
  reportedBy: i.reportedBy,
  createdAt: i.createdAt.toISOString(),
  updatedAt: i.updatedAt.toISOString(),
  photos: photos.map((p) => ({
    id: p.id,
    contentType: p.contentType,
    fileName: p.fileName,
    sizeBytes: p.sizeBytes,
    url: `/api/incidents/${i.id}/photos/${p.id}`,
    thumbnailUrl: p.hasThumbnail ? `/api/incidents/${i.id}/photos/${p.id}?size=thumbnail` : null,
  })),
});

type IncidentFields = {
  id?: string;
  kind: IncidentKind;
  description: string;
  occurredAt: string;
  location: string | null;
  bookingId: string | null;
  customerName?: string | null;
};

/**
 * Record an incident inside the caller's transaction: hold the asset, flag a
 * knocked lithium battery as damaged, and queue the e-mail to the manager and
 * owner. Also used by the return desk for missing or damaged items.
 */
export async function openIncident(tx: Scoped, actor: Actor, asset: AssetRecord, input: IncidentFields, photos: PreparedPhoto[] = []) {
  const incident = await tx.insert(Incident, {
    ...(input.id ? { id: input.id } : {}),
    assetId: asset.id,
    kind: input.kind,
    description: input.description,
    occurredAt: new Date(input.occurredAt),
    location: input.location,
    bookingId: input.bookingId,
    customerName: input.customerName ?? null,
    state: 'reported',
    resolution: null,
    chargeAmountMinor: null,
    reportedBy: actor.userId,
  });
  const saved = [];
  for (const p of photos) saved.push(await tx.insert(IncidentPhoto, { incidentId: incident.id, ...p }));
  const flagBattery = asset.type === 'battery' && batteryDamageKinds.has(input.kind);
  if (flagBattery) await markDamaged(tx, asset);
  await placeHold(tx, actor, asset, {
    reason: 'incident',
    summary: `${incidentKindTitles[input.kind]}: ${input.description.slice(0, 200)}`,
    incidentId: incident.id,
  });
  await recordAudit(
    tx,
    actor,
    'incident.reported',
    { type: 'asset', id: asset.id },
    { incidentId: incident.id, kind: input.kind, photos: saved.length, batteryFlaggedDamaged: flagBattery },
  );
  await enqueueMail(tx, await staffAddresses(tx, ['owner', 'manager']), incidentMail, {
    asset,
    kind: incidentKindTitles[input.kind].toLowerCase(),
    description: input.description,
    occurredAt: input.occurredAt,
    location: input.location ?? null,
    photos: saved.length,
    damagedBattery: flagBattery,
  });
  return { incident, photos: saved };
}

/** An incident opened against a booking (damaged or missing at return), with the charge a rental set on it. */
export type BookingIncident = Readonly<Pick<Incident, 'id' | 'assetId' | 'kind' | 'description' | 'chargeAmountMinor'>>;

/** The incidents opened against a booking, oldest first. */
export const bookingIncidents = (tx: Scoped, bookingId: string): Promise<BookingIncident[]> =>
  tx.find(Incident, { where: { bookingId }, order: { createdAt: 'ASC' } });

/** Sets the repair or replacement charge (net of tax) on an incident of the booking; returns the charge it replaced. */
export async function setIncidentCharge(tx: Scoped, bookingId: string, incidentId: string, amountMinor: number): Promise<number | null> {
  const incident = await tx.get(Incident, { id: incidentId, bookingId }, 'That incident on this booking');
  const before = incident.chargeAmountMinor;
  await tx.updateWhere(Incident, { id: incident.id }, { chargeAmountMinor: amountMinor });
  return before;
}

export class IncidentsService {
  constructor(private readonly db: DataSource) {}

  /** `replayed`: the phone sent a report this firm already holds under its id; the stored report is the answer, nothing is recorded again. */
  async report(actor: Actor, input: z.infer<typeof incidentPayload>, files: UploadedPhoto[]): Promise<{ incident: IncidentView; replayed: boolean }> {
    const photos = await Promise.all(files.map(preparePhoto));
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (input.id) {
        await claimClientRecordId(tx, 'incidents', input.id);
        const stored = await tx.findOne(Incident, { id: input.id }, { relations: { asset: true } });
        if (stored) return { incident: view(stored, await this.photoRows(tx, [stored.id]), stored.asset), replayed: true };
      }
      const asset = await getAsset(tx, input.assetId);
      // A read, not an import: bookings already calls incidents when an item comes back damaged.
      if (input.bookingId && !(await tx.sql(`SELECT 1 FROM bookings WHERE organization_id = $1 AND id = $2`, [input.bookingId])).length)
        throw notFound('That booking');
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired.`);
      const { incident, photos: saved } = await openIncident(tx, actor, asset, { ...input, bookingId: input.bookingId ?? null }, photos);
      const refreshed = await getAsset(tx, asset.id);
      return {
        incident: view(
          incident,
          saved.map((p) => ({ ...p, hasThumbnail: !!p.thumbnail })),
          refreshed,
        ),
        replayed: false,
      };
    });
  }

  list(actor: Actor, query: z.infer<typeof incidentListQuery>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const qb = tx.select(Incident, 'i').leftJoinAndSelect('i.asset', 'a').orderBy('i.occurred_at', 'DESC').take(query.limit).skip(query.offset);
      if (query.assetId) qb.andWhere('i.asset_id = :assetId', { assetId: query.assetId });
      if (query.state?.length) qb.andWhere('i.state IN (:...states)', { states: query.state });
      const [rows, total] = await qb.getManyAndCount();
      const photos = rows.length
        ? await this.photoRows(
            tx,
            rows.map((r) => r.id),
          )
        : [];
      return {
        items: rows.map((r) =>
          view(
            r,
            photos.filter((p) => p.incidentId === r.id),
            r.asset,
          ),
        ),
        total,
      };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const incident = await tx.get(Incident, { id }, 'That incident', { relations: { asset: true } });
      return view(incident, await this.photoRows(tx, [id]), incident.asset);
    });
  }

  update(actor: Actor, id: string, patch: z.infer<typeof incidentUpdatePayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const incident = await tx.get(Incident, { id }, 'That incident', { relations: { asset: true } });
      const before = { state: incident.state, resolution: incident.resolution, chargeAmountMinor: incident.chargeAmountMinor };
      if (incident.state === 'resolved') throw ruleBroken('incident_resolved', 'This incident is resolved; its record is closed.');
      if (patch.state && patch.state !== incident.state && !nextStates[incident.state].includes(patch.state)) {
        throw ruleBroken('incident_state', `An incident that is ${incident.state} cannot become ${patch.state}.`);
      }
      if (patch.resolution !== undefined) incident.resolution = patch.resolution;
      if (patch.chargeAmountMinor !== undefined) incident.chargeAmountMinor = patch.chargeAmountMinor;
      if (patch.state) incident.state = patch.state;
      if (incident.state === 'resolved' && !incident.resolution) {
        throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { resolution: 'say how it was resolved' } });
      }
      const saved = await tx.save(Incident, incident);
      await recordAudit(tx, actor, 'incident.updated', { type: 'asset', id: incident.assetId }, { incidentId: id, before, after: patch });
      return view(saved, await this.photoRows(tx, [id]), incident.asset);
    });
  }

  photo(actor: Actor, incidentId: string, photoId: string, thumbnail: boolean) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [row] = await tx.sql<{ content_type: string; data: Buffer; thumbnail: Buffer | null; file_name: string }>(
        `SELECT content_type, data, thumbnail, file_name FROM incident_photos WHERE organization_id = $1 AND incident_id = $2 AND id = $3`,
        [incidentId, photoId],
      );
      if (!row || (thumbnail && !row.thumbnail)) throw new AppError(404, 'not_found', 'That photo was not found.');
      return thumbnail
        ? { contentType: 'image/jpeg', data: row.thumbnail!, fileName: 'thumbnail.jpg' }
        : { contentType: row.content_type, data: row.data, fileName: row.file_name };
    });
  }

  private photoRows(tx: Scoped, incidentIds: string[]) {
    return tx.sql<PhotoRow & { incidentId: string }>(
      `SELECT id, incident_id AS "incidentId", content_type AS "contentType", file_name AS "fileName", size_bytes AS "sizeBytes", thumbnail IS NOT NULL AS "hasThumbnail"
         FROM incident_photos WHERE organization_id = $1 AND incident_id = ANY($2) ORDER BY created_at`,
      [incidentIds],
    );
  }
}
