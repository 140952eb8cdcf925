import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { calendarDayIn, dueDate } from '../../shared/calibration/due-date';
import { suggestInterval, type AsFound } from '../../shared/calibration/interval-review';
import type { CalibrationEventView } from '../../shared/calibration/views';
import type { calibrationEventFields } from '../../shared/schemas/calibration';
import { recordAudit } from '../audit/audit.service';
import { closeBooking } from '../bookings';
import { inOrganization, type Actor } from '../db/transaction';
import { describeActiveContent, inspectPdf } from '../documents/pdf-inspection';
import { getAsset, lockAssets, moveAssets, noteCustody, updateCalibrationPlan } from '../fleet';
import { openHoldFor, releaseHold } from '../holds/holds.service';
import { AppError, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
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
  asFoundErrorUm: e.asFoundErrorUm,
  asLeft: e.asLeft,
  intervalMonths: e.intervalMonths,
  dueOn: e.dueOn,
  suggestedIntervalMonths: e.suggestedIntervalMonths,
  suggestionReason: e.suggestionReason,
  suggestedChange: e.suggestedChange,
  intervalDecision: e.intervalDecision,
  labTripId: e.labTripId,
  note: e.note,
  recordedBy: e.recordedBy,
  createdAt: e.createdAt.toISOString(),
});

/**
 * Judge the bytes, not the name: a renamed photo is not a certificate, a "%PDF"
 * header in front of HTML is not a PDF, and a certificate that runs scripts or
 * carries files is not kept (people open it in a browser's PDF viewer).
 */
async function refuseUnlessPlainPdf(file: UploadedCertificate) {
  const result = await inspectPdf(file.buffer);
  const name = `"${file.originalname}"`;
  if (result.kind === 'not_pdf') throw new AppError(415, 'unsupported_type', `${name} is not a PDF: ${result.reason}.`);
  if (result.kind === 'encrypted')
    throw ruleBroken(
      'certificate_encrypted',
      `${name} is encrypted or password-protected, so Nestkeeper cannot check what it contains. Ask the lab for an unprotected copy.`,
    );
  if (result.activeContent.length) {
    throw ruleBroken(
      'certificate_active_content',
      `${name} contains ${describeActiveContent(result.activeContent)}. A certificate is kept as a plain PDF: ask the lab for a copy without scripts or attachments, or print it to a new PDF.`,
      { found: result.activeContent },
    );
  }
}

export class CalibrationService {
  constructor(private readonly db: DataSource) {}

  /**
   * Record a certificate. Moves the due date, brings the item back from the lab,
   * clears a hold that was waiting for calibration, opens the impact review when
   * the item was found out of tolerance, and suggests the next interval.
   */
  async record(actor: Actor, assetId: string, fields: z.infer<typeof calibrationEventFields>, file: UploadedCertificate | undefined) {
    if (!file) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { certificate: 'attach the certificate PDF' } });
    await refuseUnlessPlainPdf(file);
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const [asset] = await lockAssets(tx, [assetId]);
      if (asset.status === 'retired') throw ruleBroken('asset_retired', `${asset.assetTag} is retired.`);
      if (fields.performedOn > ctx.today)
        throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { performedOn: 'cannot be in the future' } });
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
        asFoundErrorUm: fields.asFoundErrorUm ?? null,
        asLeft: fields.asLeft,
        intervalMonths,
        dueOn: dueDate(fields.performedOn, intervalMonths),
        suggestedIntervalMonths: suggestion.suggestedMonths,
        suggestionReason: suggestion.reason,
        suggestedChange: suggestion.change,
        intervalDecision: null,
        labTripId: null,
        note: fields.note ?? null,
        recordedBy: actor.userId,
      });
      // The newest calibration sets the plan; an older certificate entered late only joins the history.
      if (!asset.lastCalibratedOn || fields.performedOn >= asset.lastCalibratedOn) {
        await updateCalibrationPlan(tx, assetId, {
          calibrationRequired: true,
          lastCalibratedOn: fields.performedOn,
          calibrationIntervalMonths: intervalMonths,
          calibrationProvider: fields.provider,
          dueOn: event.dueOn,
          notifiedCalibrationState: null,
        });
      }
      const wasAtLab = asset.status === 'at_lab';
      if (wasAtLab) {
        const [item] = await tx.sql<{ id: string; lab_trip_id: string }>(
          `SELECT i.id, i.lab_trip_id FROM lab_trip_items i JOIN lab_trips t ON t.id = i.lab_trip_id WHERE i.organization_id = $1 AND i.asset_id = $2 AND i.received_on IS NULL AND t.state = 'at_lab' LIMIT 1`,
          [assetId],
        );
        if (item) {
          event.labTripId = item.lab_trip_id;
          await tx.manager.save(CalibrationEvent, event);
          await tx.updateWhere(LabTripItem, { id: item.id }, { receivedOn: ctx.today, calibrationEventId: event.id });
          const [{ open }] = await tx.sql<{ open: number }>(
            `SELECT count(*)::int AS open FROM lab_trip_items WHERE organization_id = $1 AND lab_trip_id = $2 AND received_on IS NULL`,
            [item.lab_trip_id],
          );
          if (open === 0) {
            await tx.updateWhere(LabTrip, { id: item.lab_trip_id }, { state: 'back' });
            const trip = await tx.get(LabTrip, { id: item.lab_trip_id }, 'That lab trip');
            if (trip.bookingId) await closeBooking(tx, actor, trip.bookingId, `Every item is back from ${trip.provider}`);
          }
        }
      }
      const custody = { why: `Certificate ${fields.certificateNumber} from ${fields.provider}`, counterpart: ctx.name };
      if (wasAtLab) await moveAssets(tx, actor, [assetId], 'ready', custody);
      else await noteCustody(tx, actor, [assetId], 'calibrated', custody);
      await recordAudit(
        tx,
        actor,
        'calibration.recorded',
        { type: 'asset', id: assetId },
        { eventId: event.id, asFound: fields.asFound, asFoundErrorUm: event.asFoundErrorUm, asLeft: fields.asLeft, dueOn: event.dueOn },
      );
      if (fields.asFound === 'out_of_tolerance')
        await openImpactReview(tx, actor, asset, { trigger: 'calibration', triggerId: event.id, foundOn: fields.performedOn });
      const hold = await openHoldFor(tx, assetId);
      if (hold && fields.asLeft === 'in_tolerance' && fields.performedOn >= calendarDayIn(hold.startedAt, ctx.timeZone)) {
        await releaseHold(
          tx,
          actor,
          hold,
          [{ kind: 'calibration', id: event.id, performedAt: fields.performedOn }],
          `Calibrated: certificate ${fields.certificateNumber}`,
        );
      } else if (hold && wasAtLab) {
        // Back from the lab without the evidence that ends its hold: it stays held, not bookable.
        await moveAssets(tx, actor, [assetId], 'held', { why: `Still on hold: ${hold.summary}`, details: { holdId: hold.id } });
      }
      return eventView(event);
    });
  }

  list(actor: Actor, assetId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      await getAsset(tx, assetId);
      return listReply((await tx.find(CalibrationEvent, { where: { assetId }, order: { performedOn: 'DESC', createdAt: 'DESC' } })).map(eventView));
    });
  }

  /** The stored file; it opens in the browser only when it is a plain PDF (files stored before the check may not be). */
  async certificate(actor: Actor, eventId: string) {
    const file = await inOrganization(this.db, actor.organizationId, async (tx) => {
      const [row] = await tx.sql<{ data: Buffer; file_name: string }>(
        `SELECT f.data, f.file_name FROM calibration_events e JOIN certificate_files f ON f.id = e.certificate_file_id WHERE e.organization_id = $1 AND e.id = $2`,
        [eventId],
      );
      if (!row) throw new AppError(404, 'not_found', 'That certificate was not found.');
      return { data: row.data, fileName: row.file_name };
    });
    const inspection = await inspectPdf(file.data);
    return { ...file, inline: inspection.kind === 'pdf' && inspection.activeContent.length === 0 };
  }

  /** The owner accepts or declines the suggested interval; accepting moves the due date from the last calibration. */
  decideInterval(actor: Actor, eventId: string, decision: 'accept' | 'decline') {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const event = await tx.get(CalibrationEvent, { id: eventId }, 'That calibration');
      if (event.intervalDecision) throw ruleBroken('interval_decided', `This suggestion was already ${event.intervalDecision}.`);
      if (event.suggestedChange === 'outside_policy')
        throw ruleBroken('interval_outside_policy', `There is no suggestion to decide: ${event.suggestionReason}`);
      event.intervalDecision = decision === 'accept' ? 'accepted' : 'declined';
      await tx.manager.save(CalibrationEvent, event);
      const asset = await getAsset(tx, event.assetId);
      if (decision === 'accept' && asset.lastCalibratedOn === event.performedOn) {
        await updateCalibrationPlan(tx, asset.id, {
          calibrationIntervalMonths: event.suggestedIntervalMonths,
          dueOn: dueDate(event.performedOn, event.suggestedIntervalMonths),
          notifiedCalibrationState: null,
        });
      }
      await recordAudit(
        tx,
        actor,
        'calibration.interval_' + event.intervalDecision,
        { type: 'asset', id: event.assetId },
        {
          eventId,
          from: event.intervalMonths,
          suggested: event.suggestedIntervalMonths,
          reason: event.suggestionReason,
        },
      );
      return eventView(event);
    });
  }
}
