import { In, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { blockReasonText } from '../../shared/bookings/rules';
import type { checklistPayload } from '../../shared/schemas/bookings';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { handoverSheetPdf } from '../documents/handover-sheet-pdf';
import { Asset } from '../fleet/asset.entity';
import { CustodyEvent } from '../fleet/custody-event.entity';
import { isRecordId } from '../http/endpoint';
import { AppError, ruleBroken } from '../http/errors';
import { openIncident } from '../incidents/incidents.service';
import { loadOrgContext } from '../organizations/org-context';
import { User } from '../users/user.entity';
import { blockedItems } from './booking-queries';
import type { BookingRefusalDetails, ChecklistLine, ReturnView } from '../../shared/bookings/views';
import { Booking, BookingItem } from './booking.entity';
import type { BookingsService } from './bookings.service';

type Checklist = z.infer<typeof checklistPayload>;

/** Rules other components add to the counter (rentals: a deposit hold before handing over, papers to the renter after). */
export type HandoverGates = {
  beforeCheckout?: (tx: Scoped, booking: Booking) => Promise<void>;
  afterCheckout?: (tx: Scoped, booking: Booking) => Promise<void>;
};

/** Checkout and return: the packing list walked at the counter, custody recorded either way. */
export class HandoverService {
  constructor(
    private readonly db: DataSource,
    private readonly bookings: BookingsService,
    private readonly gates: HandoverGates = {},
  ) {}

  checkout(actor: Actor, id: string, input: Checklist) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const booking = await tx.get(Booking, { id }, 'That booking');
      if (booking.state !== 'reserved') throw ruleBroken('booking_state', `Only a reserved booking can be checked out; this one is ${booking.state}.`);
      const assets = await this.walk(tx, booking, input.checklist);
      const absent = input.checklist.filter((l) => !l.present);
      if (absent.length) throw ruleBroken('checkout_incomplete', `Not here: ${tags(assets, absent)}. Find them, or take them off the booking, before handing over.`, { missing: absent.map((l) => l.assetId) });
      const damaged = input.checklist.filter((l) => l.condition === 'damaged');
      if (damaged.length) throw ruleBroken('checkout_damaged', `Damaged: ${tags(assets, damaged)}. Report the damage (the item goes on hold) and book an alternative.`, { damaged: damaged.map((l) => l.assetId) });
      const blocked = await blockedItems(tx, assets.map((a) => a.id), booking.endsOn);
      if (blocked.length) {
        throw new AppError(422, 'booking_blocked', `Cannot hand over: ${blocked.map((b) => `${b.assetTag} — ${blockReasonText[b.reason]}`).join('; ')}.`, { blocked: blocked.map(({ assetId, assetTag, reason }) => ({ assetId, assetTag, reason })) } satisfies BookingRefusalDetails);
      }
      const stillOut = assets.filter((a) => a.status === 'out');
      if (stillOut.length) throw ruleBroken('still_out', `Still out on an earlier booking: ${stillOut.map((a) => a.assetTag).join(', ')}. Take them back in first.`);
      await this.gates.beforeCheckout?.(tx, booking);
      const taker = await this.counterpart(tx, input.counterpart);
      const now = new Date();
      await tx.updateWhere(Asset, { id: In(assets.map((a) => a.id)) }, { status: 'out' });
      await tx.insertMany(CustodyEvent, assets.map((a) => ({ assetId: a.id, kind: 'checked_out' as const, actorUserId: actor.userId, holder: taker.name, location: null, bookingId: id, note: noteFor(input.checklist, a.id) })));
      Object.assign(booking, { state: 'out', checkedOutAt: now, handedOverBy: actor.userId, takenBy: taker.name, takenByUserId: taker.userId, checkoutChecklist: input.checklist as ChecklistLine[] });
      await tx.save(Booking, booking);
      await recordAudit(tx, actor, 'booking.checked_out', { type: 'booking', id }, { takenBy: taker.name, items: assets.length });
      await this.gates.afterCheckout?.(tx, booking);
      return this.bookings.load(tx, id);
    });
  }

  /** A missing or damaged item opens an incident (and so a hold) linked to the booking; the rest go back to ready. */
  return(actor: Actor, id: string, input: Checklist): Promise<ReturnView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const booking = await tx.get(Booking, { id }, 'That booking');
      if (booking.state !== 'out') throw ruleBroken('booking_state', `Only a booking that is out can come back; this one is ${booking.state}.`);
      const assets = await this.walk(tx, booking, input.checklist);
      const bringer = await this.counterpart(tx, input.counterpart);
      const now = new Date();
      const incidents: { assetId: string; incidentId: string }[] = [];
      for (const line of input.checklist) {
        const asset = assets.find((a) => a.id === line.assetId)!;
        if (!line.present || line.condition === 'damaged') {
          const { incident } = await openIncident(tx, actor, asset, {
            kind: line.present ? 'impact' : 'missing',
            description: line.note || (line.present ? `Came back damaged from booking ${booking.startsOn}–${booking.endsOn}.` : `Not returned with booking ${booking.startsOn}–${booking.endsOn}.`),
            occurredAt: now.toISOString(),
            location: ctx.name,
            bookingId: id,
          });
          incidents.push({ assetId: asset.id, incidentId: incident.id });
        }
        if (line.present) {
          await tx.insert(CustodyEvent, { assetId: asset.id, kind: 'returned', actorUserId: actor.userId, holder: ctx.name, location: asset.location, bookingId: id, note: line.note ?? null });
        }
      }
      // Items that came back fine are ready again, unless something else holds them (a failed field check, say).
      const fine = input.checklist.filter((l) => l.present && l.condition !== 'damaged').map((l) => l.assetId);
      if (fine.length) await tx.updateWhere(Asset, { id: In(fine), status: 'out' }, { status: 'ready' });
      Object.assign(booking, { state: 'returned', returnedAt: now, receivedBy: actor.userId, broughtBackBy: bringer.name, returnChecklist: input.checklist as ChecklistLine[] });
      await tx.save(Booking, booking);
      await tx.updateWhere(BookingItem, { bookingId: id }, { active: false });
      await recordAudit(tx, actor, 'booking.returned', { type: 'booking', id }, { broughtBackBy: bringer.name, incidents });
      return { ...(await this.bookings.load(tx, id)), incidents };
    });
  }

  /** The printable hand-over sheet: the packing list as handed over (or still to tick), cautions, signatures. */
  sheet(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const booking = await tx.get(Booking, { id }, 'That booking', { relations: { job: true, kit: true } });
      const ids = (await tx.find(BookingItem, { where: { bookingId: id } })).map((i) => i.assetId);
      const items = await tx.find(Asset, { where: { id: In(ids) }, order: { type: 'ASC', assetTag: 'ASC' } });
      const rental = booking.rentalId ? (await tx.sql<{ number: string; company: string }>(`SELECT r.number, c.company FROM rentals r JOIN customers c ON c.id = r.customer_id WHERE r.organization_id = $1 AND r.id = $2`, [booking.rentalId]))[0] : undefined;
      const title = booking.job ? `Job ${booking.job.reference}, ${booking.job.customerName}` : rental ? `Rental ${rental.number}, ${rental.company}` : `${booking.purpose} booking`;
      return handoverSheetPdf(
        { name: ctx.name, timeZone: ctx.timeZone },
        { title, startsOn: booking.startsOn, endsOn: booking.endsOn, kitName: booking.kit?.name ?? null, takenBy: booking.takenBy, checkedOutAt: booking.checkedOutAt?.toISOString() ?? null, items, checklist: booking.checkoutChecklist },
      );
    });
  }

  /** The checklist must name exactly the booking's items. */
  private async walk(tx: Scoped, booking: Booking, checklist: ChecklistLine[]) {
    const ids = (await tx.find(BookingItem, { where: { bookingId: booking.id } })).map((i) => i.assetId);
    const assets = await tx.find(Asset, { where: { id: In(ids) } });
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
    if (!isRecordId(who)) return { name: who, userId: null };
    const user = await tx.findOne(User, { id: who });
    if (!user) throw new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields: { counterpart: 'is not one of your people' } });
    return { name: user.name, userId: user.id };
  }
}

const tags = (assets: Asset[], lines: { assetId: string }[]) => lines.map((l) => assets.find((a) => a.id === l.assetId)?.assetTag).join(', ');
const noteFor = (checklist: ChecklistLine[], assetId: string) => {
  const line = checklist.find((l) => l.assetId === assetId);
  return line ? `${line.condition}${line.note ? `: ${line.note}` : ''}` : null;
};
