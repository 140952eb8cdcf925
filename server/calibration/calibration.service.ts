import { fileTypeFromBuffer } from 'file-type';
import { IsNull, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { dueDate } from '../../shared/calibration/due-date';
import { suggestInterval, type AsFound } from '../../shared/calibration/interval-review';
import type { CalibrationEventView } from '../../shared/calibration/views';
import type { calibrationEventFields } from '../../shared/schemas/calibration';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { Asset } from '../fleet/asset.entity';
import { CustodyEvent } from '../fleet/custody-event.entity';
import { Hold } from '../holds/hold.entity';
import { releaseHold } from '../holds/holds.service';
import { AppError, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations/org-context';
import { CalibrationEvent, CertificateFile } from './calibration-event.entity';
import { openImpactReview } from './impact.service';
import { LabTrip, LabTripItem } from './lab-trip.entity';
import { listReply } from '../http/list-reply';

export type UploadedCertificate = { originalname: string; buffer: Buffer; size: number };

const eventView = (e: CalibrationEvent): CalibrationEventView => ({
  id: e.id,
  assetId: e.assetId,
  performedOn: e.performedOn,
  provider: e.provider,
  certificateNumber: e.certificateNumber,
  certificateUrl: `/api/calibrations/${e.id}/certificate.pdf`,
  asFound: e.asFound,
  asLeft: e.asLeft,
  intervalMonths: e.intervalMonths,
  dueOn: e.dueOn,
  suggestedIntervalMonths: e.suggestedIntervalMonths,
  suggestionReason: e.suggestionReason,
  intervalDecision: e.intervalDecision,
  labTripId: e.labTripId,
  note: e.note,
  recordedBy: e.recordedBy,
  createdAt: e.createdAt.toISOString(),
});

export class CalibrationService {
  constructor(private readonly db: DataSource) {}

  /**
   * Record a certificate. Moves the due date, brings the item back from the lab,
   * clears a hold that was waiting for calibration, opens the impact review when
   * the item was found out of tolerance, and suggests the next interval.
   */
  async record(actor: Actor, assetId: string, fields: z.infer<typeof calibrationEventFields>, file: UploadedCertificate | undefined) {
    if (!file) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { certificate: 'attach the certificate PDF' } });
    // Judge the bytes, not the name: a renamed photo is not a certificate.
    if ((await fileTypeFromBuffer(file.buffer))?.mime !== 'application/pdf') throw new AppError(415, 'unsupported_type', `"${file.originalname}" is not a PDF.`);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const asset = await tx.get(Asset, { id: assetId }, 'That asset');
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired.`);
      if (fields.performedOn > ctx.today) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { performedOn: 'cannot be in the future' } });
      const stored = await tx.insert(CertificateFile, { fileName: file.originalname.slice(0, 200), sizeBytes: file.size, data: file.buffer });
      const intervalMonths = fields.intervalMonths ?? asset.calibrationIntervalMonths ?? 12;
      const history = (await tx.find(CalibrationEvent, { where: { assetId }, order: { performedOn: 'ASC' } })).map((e) => e.asFound);
      const suggestion = suggestInterval(intervalMonths, [...history, fields.asFound as AsFound], ctx.intervalPolicy);
      const event = await tx.insert(CalibrationEvent, {
        assetId,
        performedOn: fields.performedOn,
        provider: fields.provider,
        certificateNumber: fields.certificateNumber,
        certificateFileId: stored.id,
        asFound: fields.asFound,
        asLeft: fields.asLeft,
        intervalMonths,
        dueOn: dueDate(fields.performedOn, intervalMonths),
        suggestedIntervalMonths: suggestion.suggestedMonths,
        suggestionReason: suggestion.reason,
        intervalDecision: null,
        labTripId: null,
        note: fields.note ?? null,
        recordedBy: actor.userId,
      });
      // The newest calibration sets the plan; an older certificate entered late only joins the history.
      if (!asset.lastCalibratedOn || fields.performedOn >= asset.lastCalibratedOn) {
        Object.assign(asset, { calibrationRequired: true, lastCalibratedOn: fields.performedOn, calibrationIntervalMonths: intervalMonths, calibrationProvider: fields.provider, dueOn: event.dueOn, notifiedCalibrationState: null });
      }
      const wasAtLab = asset.status === 'at_lab';
      if (wasAtLab) {
        asset.status = 'ready';
        const [item] = await tx.sql<{ id: string; lab_trip_id: string }>(
          `SELECT i.id, i.lab_trip_id FROM lab_trip_items i JOIN lab_trips t ON t.id = i.lab_trip_id WHERE i.organization_id = $1 AND i.asset_id = $2 AND i.received_on IS NULL AND t.state = 'at_lab' LIMIT 1`,
          [assetId],
        );
        if (item) {
          event.labTripId = item.lab_trip_id;
          await tx.manager.save(CalibrationEvent, event);
          await tx.updateWhere(LabTripItem, { id: item.id }, { receivedOn: ctx.today, calibrationEventId: event.id });
          const [{ open }] = await tx.sql<{ open: number }>(`SELECT count(*)::int AS open FROM lab_trip_items WHERE organization_id = $1 AND lab_trip_id = $2 AND received_on IS NULL`, [item.lab_trip_id]);
          if (open === 0) {
            await tx.updateWhere(LabTrip, { id: item.lab_trip_id }, { state: 'back' });
            await tx.sql(`UPDATE bookings SET state = 'returned', returned_at = now() WHERE organization_id = $1 AND id = (SELECT booking_id FROM lab_trips WHERE id = $2)`, [item.lab_trip_id]);
            await tx.sql(`UPDATE booking_items SET active = false WHERE organization_id = $1 AND booking_id = (SELECT booking_id FROM lab_trips WHERE id = $2)`, [item.lab_trip_id]);
          }
        }
      }
      await tx.save(Asset, asset);
      await tx.insert(CustodyEvent, { assetId, kind: wasAtLab ? 'back_from_lab' : 'calibrated', actorUserId: actor.userId, holder: ctx.name, location: asset.location, bookingId: null, note: `Certificate ${fields.certificateNumber} from ${fields.provider}` });
      await recordAudit(tx, actor, 'calibration.recorded', { type: 'asset', id: assetId }, { eventId: event.id, asFound: fields.asFound, asLeft: fields.asLeft, dueOn: event.dueOn });
      if (fields.asFound === 'out_of_tolerance') await openImpactReview(tx, actor, asset, { trigger: 'calibration', triggerId: event.id, foundOn: fields.performedOn });
      const hold = await tx.findOne(Hold, { assetId, releasedAt: IsNull() });
      if (hold && fields.asLeft === 'in_tolerance' && fields.performedOn >= hold.startedAt.toISOString().slice(0, 10)) {
        await releaseHold(tx, actor, asset, hold, [{ kind: 'calibration', id: event.id, performedAt: fields.performedOn }], `Calibrated: certificate ${fields.certificateNumber}`);
      }
      return eventView(event);
    });
  }

  list(actor: Actor, assetId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await tx.get(Asset, { id: assetId }, 'That asset');
      return listReply((await tx.find(CalibrationEvent, { where: { assetId }, order: { performedOn: 'DESC', createdAt: 'DESC' } })).map(eventView));
    });
  }

  certificate(actor: Actor, eventId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const [row] = await tx.sql<{ data: Buffer; file_name: string }>(
        `SELECT f.data, f.file_name FROM calibration_events e JOIN certificate_files f ON f.id = e.certificate_file_id WHERE e.organization_id = $1 AND e.id = $2`,
        [eventId],
      );
      if (!row) throw new AppError(404, 'not_found', 'That certificate was not found.');
      return { data: row.data, fileName: row.file_name };
    });
  }

  /** The owner accepts or declines the suggested interval; accepting moves the due date from the last calibration. */
  decideInterval(actor: Actor, eventId: string, decision: 'accept' | 'decline') {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const event = await tx.get(CalibrationEvent, { id: eventId }, 'That calibration');
      if (event.intervalDecision) throw ruleBroken('interval_decided', `This suggestion was already ${event.intervalDecision}.`);
      event.intervalDecision = decision === 'accept' ? 'accepted' : 'declined';
      await tx.manager.save(CalibrationEvent, event);
      const asset = await tx.get(Asset, { id: event.assetId }, 'That asset');
      if (decision === 'accept' && asset.lastCalibratedOn === event.performedOn) {
        asset.calibrationIntervalMonths = event.suggestedIntervalMonths;
        asset.dueOn = dueDate(event.performedOn, event.suggestedIntervalMonths);
        asset.notifiedCalibrationState = null;
        await tx.save(Asset, asset);
      }
      await recordAudit(tx, actor, 'calibration.interval_' + event.intervalDecision, { type: 'asset', id: event.assetId }, {
        eventId,
        from: event.intervalMonths,
        suggested: event.suggestedIntervalMonths,
        reason: event.suggestionReason,
      });
      return eventView(event);
    });
  }
}
