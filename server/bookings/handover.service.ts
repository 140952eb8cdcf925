import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { checklistPayload, returnPayload } from '../../shared/schemas/bookings';
import { MAX_INCIDENT_PHOTOS } from '../../shared/schemas/incidents';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { handoverSheetPdf } from '../documents/handover-sheet-pdf';
import { assetsByIds, lockAssets, moveAssets, noteCustody, type AssetRecord } from '../fleet';
import { AppError, notFound, ruleBroken } from '../http/errors';
import { isUuid } from '../http/ids';
import { openIncident, preparePhoto, type UploadedPhoto } from '../incidents/incidents.service';
import { documentFirm, formatOf, loadOrgContext } from '../organizations';
import { findPerson } from '../users';
import type { ChecklistLine, ReturnView } from '../../shared/bookings/views';
import type { BookingView } from './booking-view';
import { Job } from './job.entity';
import { bookingIn, checkOut, loadBooking, takeBack } from './lifecycle';

type Checklist = z.infer<typeof checklistPayload>;
type ReturnInput = z.infer<typeof returnPayload>;

/** Rules other components add to the counter (rentals: a deposit hold before handing over, papers to the renter after). */
export type HandoverGates = {
  beforeCheckout?: (tx: Scoped, booking: BookingView) => Promise<void>;
  afterCheckout?: (tx: Scoped, booking: BookingView) => Promise<void>;
};

/** Checkout and return: the packing list walked at the counter, custody recorded either way. */
export class HandoverService {
  constructor(
    private readonly db: DataSource,
    private readonly gates: HandoverGates = {},
  ) {}

  checkout(actor: Actor, id: string, input: Checklist) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await bookingIn(tx, id, ['reserved', 'not_collected'], 'Only a reserved or not collected booking can be checked out');
      const assets = await this.walk(tx, booking, input.checklist);
      const taker = await this.counterpart(tx, input.counterpart);
      const absent = input.checklist.filter((l) => !l.present);
      if (absent.length)
        throw ruleBroken('checkout_incomplete', `Not here: ${tags(assets, absent)}. Find them, or take them off the booking, before handing over.`, {
          missing: absent.map((l) => l.assetId),
        });
      const damaged = input.checklist.filter((l) => l.condition === 'damaged');
      if (damaged.length)
        throw ruleBroken('checkout_damaged', `Damaged: ${tags(assets, damaged)}. Report the damage (the item goes on hold) and book an alternative.`, {
          damaged: damaged.map((l) => l.assetId),
        });
      // Refuses (422) items that may no longer go; the rest of the transaction is undone with any later refusal.
      const out = await checkOut(tx, actor, id, {
        takenBy: taker.name,
        takenByUserId: taker.userId,
        checklist: input.checklist as ChecklistLine[],
        earlyReason: input.earlyReason,
        late: input.late,
      });
      const stillOut = assets.filter((a) => a.status === 'out');
      if (stillOut.length)
        throw ruleBroken('still_out', `Still out on an earlier booking: ${stillOut.map((a) => a.assetTag).join(', ')}. Take them back in first.`);
      await this.gates.beforeCheckout?.(tx, out);
      await moveAssets(
        tx,
        actor,
        assets.map((a) => a.id),
        'out',
        { why: (assetId) => noteFor(input.checklist, assetId), bookingId: id, where: null, counterpart: taker.name },
      );
      await this.gates.afterCheckout?.(tx, out);
      return loadBooking(tx, id);
    });
  }

  /**
   * A missing or damaged item opens an incident (and so a hold) linked to the booking and its customer, with the photos
   * taken of it; the rest go back to ready.
   */
  async return(actor: Actor, id: string, input: ReturnInput, files: UploadedPhoto[] = []): Promise<ReturnView> {
    const photoOf = input.photoAssetIds ?? [];
    if (photoOf.length !== files.length)
      throw new AppError(400, 'invalid_input', 'Name the item each photo shows.', {
        fields: { photoAssetIds: `lists ${photoOf.length} item(s) for ${files.length} photo(s)` },
      });
    const reported = new Set(input.checklist.filter((l) => !l.present || l.condition === 'damaged').map((l) => l.assetId));
    const stray = photoOf.filter((assetId) => !reported.has(assetId));
    if (stray.length)
      throw new AppError(400, 'invalid_input', 'Photos go with items marked damaged or missing.', {
        fields: { photoAssetIds: 'names an item not marked damaged or missing' },
      });
    const tooMany = [...reported].find((assetId) => photoOf.filter((p) => p === assetId).length > MAX_INCIDENT_PHOTOS);
    if (tooMany)
      throw new AppError(413, 'too_large', `Attach at most ${MAX_INCIDENT_PHOTOS} photos to one item.`, {
        fields: { photoAssetIds: 'too many photos of one item' },
      });
    // Read and thumbnail the photos before the transaction, as a damage report does.
    const photos = await Promise.all(files.map(preparePhoto));
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const booking = await bookingIn(tx, id, ['out'], 'Only a booking that is out can come back');
      const assets = await this.walk(tx, booking, input.checklist);
      const bringer = await this.counterpart(tx, input.counterpart);
      const now = new Date();
      // Where the damage most likely happened: the job's site, else the renter, else the firm's own shop.
      const site = booking.jobId ? (await tx.get(Job, { id: booking.jobId }, 'That job')).siteAddress : null;
      const place =
        site ??
        (booking.job
          ? `Job ${booking.job.reference}, ${booking.job.customerName}`
          : booking.rental
            ? `Rental ${booking.rental.number}, ${booking.rental.customerCompany}`
            : ctx.name);
      const customerName = booking.job?.customerName ?? booking.rental?.customerCompany ?? null;
      const days = formatOf(ctx).dateRange(booking.startsOn, booking.endsOn);
      const incidents: { assetId: string; incidentId: string }[] = [];
      for (const line of input.checklist) {
        const asset = assets.find((a) => a.id === line.assetId)!;
        if (!line.present || line.condition === 'damaged') {
          const { incident } = await openIncident(
            tx,
            actor,
            asset,
            {
              kind: line.present ? 'impact' : 'missing',
              description: line.note || (line.present ? `Came back damaged from the booking of ${days}.` : `Not returned with the booking of ${days}.`),
              occurredAt: now.toISOString(),
              location: place,
              bookingId: id,
              customerName,
            },
            photos.filter((_, i) => photoOf[i] === asset.id),
          );
          incidents.push({ assetId: asset.id, incidentId: incident.id });
        }
      }
      // Back at the counter: ready again if simply out; still held if something holds it (this damage, a failed field check).
      const back = await lockAssets(
        tx,
        input.checklist.filter((l) => l.present).map((l) => l.assetId),
      );
      const custody = { why: (assetId: string) => input.checklist.find((l) => l.assetId === assetId)?.note ?? null, bookingId: id, counterpart: ctx.name };
      await moveAssets(
        tx,
        actor,
        back.filter((a) => a.status === 'out').map((a) => a.id),
        'ready',
        custody,
      );
      await noteCustody(
        tx,
        actor,
        back.filter((a) => a.status !== 'out').map((a) => a.id),
        'returned',
        custody,
      );
      return { ...(await takeBack(tx, actor, id, { broughtBackBy: bringer.name, checklist: input.checklist as ChecklistLine[], incidents })), incidents };
    });
  }

  /** The printable hand-over sheet: the packing list as handed over (or still to tick), cautions, signatures. */
  sheet(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const booking = await loadBooking(tx, id);
      const items = await assetsByIds(tx, booking.assetIds, { packingOrder: true });
      const { job, rental } = booking;
      const title = job
        ? `Job ${job.reference}, ${job.customerName}`
        : rental
          ? `Rental ${rental.number}, ${rental.customerCompany}`
          : `${booking.purpose} booking`;
      return handoverSheetPdf(documentFirm(ctx), {
        title,
        startsOn: booking.startsOn,
        endsOn: booking.endsOn,
        kitName: booking.kit?.name ?? null,
        takenBy: booking.takenBy,
        checkedOutAt: booking.checkedOutAt,
        items,
        checklist: booking.checkoutChecklist,
      });
    });
  }

  /** The checklist must name exactly the booking's items. */
  private async walk(tx: Scoped, booking: BookingView, checklist: ChecklistLine[]) {
    const ids = booking.assetIds;
    const assets = await assetsByIds(tx, ids);
    const listed = new Set(checklist.map((l) => l.assetId));
    const unticked = assets.filter((a) => !listed.has(a.id));
    const strangers = checklist.filter((l) => !ids.includes(l.assetId));
    if (unticked.length || strangers.length || listed.size !== checklist.length) {
      const fields: Record<string, string> = {};
      if (unticked.length) fields.checklist = `walk every item: ${unticked.map((a) => a.assetTag).join(', ')} not ticked`;
      else fields.checklist = 'lists an item twice or one that is not on this booking';
      throw new AppError(400, 'invalid_input', 'The checklist does not match the packing list.', { fields });
    }
    return assets;
  }

  /** A person's name, or the id of one of the firm's users. */
  private async counterpart(tx: Scoped, who: string): Promise<{ name: string; userId: string | null }> {
    if (!isUuid(who)) return { name: who, userId: null };
    const user = await findPerson(tx, who);
    if (!user) throw notFound('That person');
    return { name: user.name, userId: user.id };
  }
}

const tags = (assets: AssetRecord[], lines: { assetId: string }[]) => lines.map((l) => assets.find((a) => a.id === l.assetId)?.assetTag).join(', ');
const noteFor = (checklist: ChecklistLine[], assetId: string) => {
  const line = checklist.find((l) => l.assetId === assetId);
  return line ? `${line.condition}${line.note ? `: ${line.note}` : ''}` : null;
};
