import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import { bookingDays } from '../../shared/bookings/rules';
import { addDays } from '../../shared/calibration/due-date';
import type { LabTripView, LabWindowsView } from '../../shared/calibration/views';
import type { Page } from '../../shared/lists/page';
import type { labTripPayload } from '../../shared/schemas/calibration';
import { recordAudit } from '../audit/audit.service';
import { book, busyDays, checkOut } from '../bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { getAssets, moveAssets } from '../fleet';
import { conflict, ruleBroken } from '../http/errors';
import { DEFAULT_TURNAROUND_DAYS, formatOf, loadFirmFormat, loadOrgContext, type OrgContext } from '../organizations';
import { LabTrip, LabTripItem } from './lab-trip.entity';
import { listReply } from '../http/list-reply';

/** Whole free days from `from` to `to`, both included. */
const freeDays = (from: string, to: string) => (to < from ? 0 : bookingDays(from, to));

const turnaround = (ctx: OrgContext, provider: string | null) => ctx.providers.find((p) => p.name === provider)?.turnaroundDays ?? DEFAULT_TURNAROUND_DAYS;

/** Trips not yet back that carry any of these items (one per item), with the item's tag. */
function openTrips(tx: Scoped, assetIds: string[]) {
  return tx.sql<NonNullable<LabWindowsView['plannedTrip']> & { assetId: string; assetTag: string }>(
    `SELECT DISTINCT ON (i.asset_id) t.id, t.provider, to_char(t.sent_on, 'YYYY-MM-DD') AS "sentOn", to_char(t.expected_back_on, 'YYYY-MM-DD') AS "expectedBackOn",
            t.state, i.asset_id AS "assetId", a.asset_tag AS "assetTag"
       FROM lab_trip_items i JOIN lab_trips t ON t.id = i.lab_trip_id JOIN assets a ON a.id = i.asset_id
      WHERE i.organization_id = $1 AND i.asset_id = ANY($2) AND t.state IN ('planned', 'at_lab') AND i.received_on IS NULL
      ORDER BY i.asset_id, t.sent_on`,
    [assetIds],
  );
}

/** Lab trips and the window finder: when an item can go to the lab without breaking a booking. */
export class LabService {
  constructor(private readonly db: DataSource) {}

  /**
   * Gaps between the items' active bookings long enough for the longest turnaround of their labs, earliest first, and the
   * bookings that sending them today would break. Several items are one trip: a window must be free for every one of them.
   */
  windows(actor: Actor, assetIds: string[]): Promise<LabWindowsView> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const assets = await getAssets(tx, [...new Set(assetIds)]);
      const providers = [...new Set(assets.map((a) => a.calibrationProvider).filter((p) => p !== null))];
      const days = Math.max(...assets.map((a) => turnaround(ctx, a.calibrationProvider)));
      const dues = assets.map((a) => a.dueOn).filter((d) => d !== null);
      // The trip must beat the earliest due date among the items.
      const dueOn = dues.length ? dues.reduce((a, b) => (a < b ? a : b)) : null;
      const busy = await busyDays(
        tx,
        assets.map((a) => a.id),
        ctx.today,
      );
      const gaps: LabWindowsView['gaps'] = [];
      let cursor = ctx.today;
      for (const b of [...busy, null]) {
        const gapEnd = b ? addDays(b.startsOn, -1) : null;
        const free = gapEnd ? freeDays(cursor, gapEnd) : null;
        const beforeDue = !dueOn || cursor <= dueOn;
        if (free === null || free >= days) gaps.push({ startsOn: cursor, endsOn: gapEnd, freeDays: free, returnBy: addDays(cursor, days - 1), beforeDue });
        if (b && b.endsOn >= cursor) cursor = addDays(b.endsOn, 1);
        if (gaps.length >= 5) break;
      }
      // Windows that start on or before the due date first (earliest first within each): the trip is meant to beat the due date.
      gaps.sort((a, b) => Number(b.beforeDue) - Number(a.beforeDue) || (a.startsOn < b.startsOn ? -1 : 1));
      const sendNowUntil = addDays(ctx.today, days - 1);
      const threatenedIfSentNow = busy.filter((b) => b.startsOn <= sendNowUntil);
      const noneBeforeDue = !!dueOn && !gaps.some((g) => g.beforeDue);
      const plannedTrips = await openTrips(
        tx,
        assets.map((a) => a.id),
      );
      return {
        assetId: assets[0].id,
        assets: assets.map((a) => ({ id: a.id, assetTag: a.assetTag })),
        // One lab named for all of them, else none: the person names it.
        provider: providers.length === 1 ? providers[0] : null,
        turnaroundDays: days,
        dueOn,
        gaps,
        noneBeforeDue,
        plannedTrip: plannedTrips[0] ?? null,
        plannedTrips,
        threatenedIfSentNow,
      };
    });
  }

  /** Plan a trip: a lab booking holds the window on the board (booked like any other, so overlap is a 409), the trip waits to be sent. */
  plan(actor: Actor, input: z.infer<typeof labTripPayload>): Promise<LabTripView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const assets = await this.assets(tx, input.assetIds);
      const already = await openTrips(tx, input.assetIds);
      if (already.length) {
        const f = formatOf(ctx);
        throw conflict(
          `Already on a lab trip: ${already.map((t) => `${t.assetTag} (${t.provider}, ${t.state === 'planned' ? `planned for ${f.date(t.sentOn)}` : 'at the lab'})`).join('; ')}.`,
          { trips: already },
        );
      }
      const expectedBackOn = input.expectedBackOn ?? addDays(input.sentOn, turnaround(ctx, input.provider) - 1);
      const booking = await book(tx, actor, {
        assetIds: assets.map((a) => a.id),
        startsOn: input.sentOn,
        endsOn: expectedBackOn,
        purpose: 'lab',
        note: `Calibration at ${input.provider}`,
      });
      const trip = await tx.insert(LabTrip, {
        provider: input.provider,
        sentOn: input.sentOn,
        expectedBackOn,
        state: 'planned',
        bookingId: booking.id,
        createdBy: actor.userId,
      });
      await tx.insertMany(
        LabTripItem,
        assets.map((a) => ({ labTripId: trip.id, assetId: a.id, receivedOn: null, calibrationEventId: null })),
      );
      await recordAudit(
        tx,
        actor,
        'lab_trip.planned',
        { type: 'lab_trip', id: trip.id },
        { provider: input.provider, assets: assets.map((a) => a.assetTag), sentOn: input.sentOn, expectedBackOn },
      );
      return this.view(tx, trip);
    });
  }

  /** The items leave for the lab: status at_lab, a custody event each. */
  send(actor: Actor, tripId: string): Promise<LabTripView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const trip = await tx.get(LabTrip, { id: tripId }, 'That lab trip');
      if (trip.state !== 'planned') throw ruleBroken('lab_trip_state', `This trip is already ${trip.state === 'at_lab' ? 'at the lab' : 'back'}.`);
      const items = await tx.find(LabTripItem, { where: { labTripId: tripId } });
      const f = await loadFirmFormat(tx);
      // Only what is in the shop (ready or held) may leave for the lab: custody.ts refuses the rest.
      const moved = await moveAssets(
        tx,
        actor,
        items.map((i) => i.assetId),
        'at_lab',
        { why: `Expected back ${f.date(trip.expectedBackOn)}`, bookingId: trip.bookingId, where: trip.provider, counterpart: trip.provider },
      );
      trip.state = 'at_lab';
      await tx.save(LabTrip, trip);
      if (trip.bookingId) await checkOut(tx, actor, trip.bookingId, { takenBy: trip.provider });
      await recordAudit(tx, actor, 'lab_trip.sent', { type: 'lab_trip', id: tripId }, { assets: moved.map((a) => a.assetTag) });
      return this.view(tx, trip);
    });
  }

  list(actor: Actor, state?: string): Promise<Page<LabTripView>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const trips = await tx.find(LabTrip, { where: state ? { state: state as LabTrip['state'] } : {}, order: { sentOn: 'DESC' }, take: 200 });
      return listReply(await Promise.all(trips.map((t) => this.view(tx, t))));
    });
  }

  private async assets(tx: Scoped, ids: string[]) {
    const assets = await getAssets(tx, ids);
    const retired = assets.filter((a) => a.status === 'retired');
    if (retired.length) throw ruleBroken('asset_retired', `Retired: ${retired.map((a) => a.assetTag).join(', ')}.`);
    return assets;
  }

  private async view(tx: Scoped, trip: LabTrip): Promise<LabTripView> {
    const items = await tx.sql<LabTripView['items'][number]>(
      `SELECT i.asset_id AS "assetId", a.asset_tag AS "assetTag", a.type, to_char(i.received_on, 'YYYY-MM-DD') AS "receivedOn", i.calibration_event_id AS "calibrationEventId"
         FROM lab_trip_items i JOIN assets a ON a.id = i.asset_id WHERE i.organization_id = $1 AND i.lab_trip_id = $2 ORDER BY a.asset_tag`,
      [trip.id],
    );
    return {
      id: trip.id,
      provider: trip.provider,
      sentOn: trip.sentOn,
      expectedBackOn: trip.expectedBackOn,
      state: trip.state,
      bookingId: trip.bookingId,
      items,
    };
  }
}
