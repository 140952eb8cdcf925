import { In, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { bookingDays } from '../../shared/bookings/rules';
import { addDays } from '../../shared/calibration/due-date';
import type { labTripPayload } from '../../shared/schemas/calibration';
import { recordAudit } from '../audit/audit.service';
import { Booking, BookingItem } from '../bookings/booking.entity';
import { conflictingItems } from '../bookings/booking-queries';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { Asset } from '../fleet/asset.entity';
import { CustodyEvent } from '../fleet/custody-event.entity';
import { conflict, ruleBroken } from '../http/errors';
import { DEFAULT_TURNAROUND_DAYS, loadOrgContext, type OrgContext } from '../organizations/org-context';
import { LabTrip, LabTripItem } from './lab-trip.entity';
import { listReply } from '../http/list-reply';

/** Whole free days from `from` to `to`, both included. */
const freeDays = (from: string, to: string) => (to < from ? 0 : bookingDays(from, to));

const turnaround = (ctx: OrgContext, provider: string | null) => ctx.providers.find((p) => p.name === provider)?.turnaroundDays ?? DEFAULT_TURNAROUND_DAYS;

type Busy = { bookingId: string; startsOn: string; endsOn: string; purpose: string; jobReference: string | null };

/** Lab trips and the window finder: when an item can go to the lab without breaking a booking. */
export class LabService {
  constructor(private readonly db: DataSource) {}

  /**
   * Gaps between the item's active bookings long enough for its provider's
   * turnaround, earliest first, and the bookings that sending it today would break.
   */
  windows(actor: Actor, assetId: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const asset = await tx.get(Asset, { id: assetId }, 'That asset');
      const days = turnaround(ctx, asset.calibrationProvider);
      const busy = await tx.sql<Busy>(
        `SELECT b.id AS "bookingId", to_char(bi.starts_on, 'YYYY-MM-DD') AS "startsOn", to_char(bi.ends_on, 'YYYY-MM-DD') AS "endsOn", b.purpose, j.reference AS "jobReference"
           FROM booking_items bi JOIN bookings b ON b.id = bi.booking_id LEFT JOIN jobs j ON j.id = b.job_id
          WHERE bi.organization_id = $1 AND bi.asset_id = $2 AND bi.active AND bi.ends_on >= $3::date ORDER BY bi.starts_on`,
        [assetId, ctx.today],
      );
      const gaps: { startsOn: string; endsOn: string | null; freeDays: number | null; returnBy: string }[] = [];
      let cursor = ctx.today;
      for (const b of [...busy, null]) {
        const gapEnd = b ? addDays(b.startsOn, -1) : null;
        const free = gapEnd ? freeDays(cursor, gapEnd) : null;
        if (free === null || free >= days) gaps.push({ startsOn: cursor, endsOn: gapEnd, freeDays: free, returnBy: addDays(cursor, days - 1) });
        if (b && b.endsOn >= cursor) cursor = addDays(b.endsOn, 1);
        if (gaps.length >= 5) break;
      }
      const sendNowUntil = addDays(ctx.today, days - 1);
      const threatenedIfSentNow = busy.filter((b) => b.startsOn <= sendNowUntil);
      return { assetId, provider: asset.calibrationProvider, turnaroundDays: days, dueOn: asset.dueOn, gaps, threatenedIfSentNow };
    });
  }

  /** Plan a trip: a lab booking holds the window on the board (overlap still refused), the trip waits to be sent. */
  plan(actor: Actor, input: z.infer<typeof labTripPayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const assets = await this.assets(tx, input.assetIds);
      const expectedBackOn = input.expectedBackOn ?? addDays(input.sentOn, turnaround(ctx, input.provider) - 1);
      const clashes = await conflictingItems(tx, input.assetIds, input.sentOn, expectedBackOn);
      if (clashes.length) throw conflict(`Booked during that window: ${clashes.map((c) => `${c.assetTag} (${c.startsOn} to ${c.endsOn})`).join('; ')}.`, { conflicts: clashes });
      const booking = await tx.insert(Booking, { startsOn: input.sentOn, endsOn: expectedBackOn, state: 'reserved', purpose: 'lab', jobId: null, rentalId: null, kitId: null, note: `Calibration at ${input.provider}`, createdBy: actor.userId });
      await tx.insertMany(BookingItem, assets.map((a) => ({ bookingId: booking.id, assetId: a.id, startsOn: input.sentOn, endsOn: expectedBackOn, active: true })));
      const trip = await tx.insert(LabTrip, { provider: input.provider, sentOn: input.sentOn, expectedBackOn, state: 'planned', bookingId: booking.id, createdBy: actor.userId });
      await tx.insertMany(LabTripItem, assets.map((a) => ({ labTripId: trip.id, assetId: a.id, receivedOn: null, calibrationEventId: null })));
      await recordAudit(tx, actor, 'lab_trip.planned', { type: 'lab_trip', id: trip.id }, { provider: input.provider, assets: assets.map((a) => a.assetTag), sentOn: input.sentOn, expectedBackOn });
      return this.view(tx, trip);
    });
  }

  /** The items leave for the lab: status at_lab, a custody event each. */
  send(actor: Actor, tripId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const trip = await tx.get(LabTrip, { id: tripId }, 'That lab trip');
      if (trip.state !== 'planned') throw ruleBroken('lab_trip_state', `This trip is already ${trip.state === 'at_lab' ? 'at the lab' : 'back'}.`);
      const items = await tx.find(LabTripItem, { where: { labTripId: tripId } });
      const assets = await tx.find(Asset, { where: { id: In(items.map((i) => i.assetId)) } });
      const out = assets.filter((a) => a.status === 'out' || a.status === 'retired');
      if (out.length) throw ruleBroken('lab_trip_blocked', `Not in the shop to send: ${out.map((a) => `${a.assetTag} (${a.status})`).join(', ')}.`);
      await tx.updateWhere(Asset, { id: In(assets.map((a) => a.id)) }, { status: 'at_lab' });
      await tx.insertMany(CustodyEvent, assets.map((a) => ({ assetId: a.id, kind: 'sent_to_lab' as const, actorUserId: actor.userId, holder: trip.provider, location: trip.provider, bookingId: trip.bookingId, note: `Expected back ${trip.expectedBackOn}` })));
      trip.state = 'at_lab';
      await tx.save(LabTrip, trip);
      if (trip.bookingId) await tx.updateWhere(Booking, { id: trip.bookingId }, { state: 'out', checkedOutAt: new Date(), handedOverBy: actor.userId, takenBy: trip.provider });
      await recordAudit(tx, actor, 'lab_trip.sent', { type: 'lab_trip', id: tripId }, { assets: assets.map((a) => a.assetTag) });
      return this.view(tx, trip);
    });
  }

  list(actor: Actor, state?: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const trips = await tx.find(LabTrip, { where: state ? { state: state as LabTrip['state'] } : {}, order: { sentOn: 'DESC' }, take: 200 });
      return listReply(await Promise.all(trips.map((t) => this.view(tx, t))));
    });
  }

  private async assets(tx: Scoped, ids: string[]) {
    const assets = await tx.getEach(Asset, ids, 'One of those items');
    const retired = assets.filter((a) => a.status === 'retired');
    if (retired.length) throw ruleBroken('asset_retired', `Retired: ${retired.map((a) => a.assetTag).join(', ')}.`);
    return assets;
  }

  private async view(tx: Scoped, trip: LabTrip) {
    const items = await tx.sql<{ assetId: string; assetTag: string; type: string; receivedOn: string | null; calibrationEventId: string | null }>(
      `SELECT i.asset_id AS "assetId", a.asset_tag AS "assetTag", a.type, to_char(i.received_on, 'YYYY-MM-DD') AS "receivedOn", i.calibration_event_id AS "calibrationEventId"
         FROM lab_trip_items i JOIN assets a ON a.id = i.asset_id WHERE i.organization_id = $1 AND i.lab_trip_id = $2 ORDER BY a.asset_tag`,
      [trip.id],
    );
    return { id: trip.id, provider: trip.provider, sentOn: trip.sentOn, expectedBackOn: trip.expectedBackOn, state: trip.state, bookingId: trip.bookingId, items };
  }
}
