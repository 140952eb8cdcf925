import { randomBytes } from 'node:crypto';
import ical, { ICalCalendarMethod } from 'ical-generator';
import type { DataSource } from 'typeorm';
import { addDays } from '../../shared/calibration/due-date';
import { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { AppError } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { calendarOwner, setCalendarToken } from '../users';
import type { CalendarFeedView } from '../../shared/bookings/views';

/**
 * A per-person secret calendar feed (RFC 5545, written by ical-generator):
 * the firm's bookings and calibration due dates as all-day events.
 */
export class CalendarService {
  constructor(
    private readonly db: DataSource,
    private readonly publicUrl: string,
  ) {}

  /** A new secret replaces the old one, so a leaked address can be shut. */
  rotateToken(actor: Actor): Promise<CalendarFeedView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const token = randomBytes(24).toString('base64url');
      await setCalendarToken(tx, actor.userId, token);
      return { url: `${this.publicUrl.replace(/\/$/, '')}/api/calendar.ics?token=${token}` };
    });
  }

  async feed(token: string) {
    const owner = await calendarOwner(this.db, token);
    if (!owner) throw new AppError(404, 'not_found', 'There is no calendar at that address (it may have been replaced).');
    const tx = new Scoped(this.db.manager, owner.organizationId);
    const ctx = await loadOrgContext(tx);
    const from = addDays(ctx.today, -90);
    const to = addDays(ctx.today, 365);
    const bookings = await tx.sql<{
      id: string;
      starts_on: string;
      ends_on: string;
      state: string;
      reference: string | null;
      customer_name: string | null;
      tags: string;
      kit_name: string | null;
    }>(
      `SELECT b.id, to_char(b.starts_on, 'YYYY-MM-DD') AS starts_on, to_char(b.ends_on, 'YYYY-MM-DD') AS ends_on, b.state,
              j.reference, j.customer_name, k.name AS kit_name, string_agg(a.asset_tag, ', ' ORDER BY a.asset_tag) AS tags
         FROM bookings b LEFT JOIN jobs j ON j.id = b.job_id LEFT JOIN kits k ON k.id = b.kit_id
         JOIN booking_items bi ON bi.booking_id = b.id JOIN assets a ON a.id = bi.asset_id
        WHERE b.organization_id = $1 AND b.state <> 'cancelled' AND b.ends_on >= $2 AND b.starts_on <= $3
        GROUP BY b.id, j.reference, j.customer_name, k.name`,
      [from, to],
    );
    const due = await tx.sql<{ id: string; asset_tag: string; due_on: string }>(
      `SELECT id, asset_tag, to_char(due_on, 'YYYY-MM-DD') AS due_on FROM assets
        WHERE organization_id = $1 AND calibration_required AND status <> 'retired' AND due_on BETWEEN $2 AND $3`,
      [from, to],
    );
    const cal = ical({
      name: `Nestkeeper — ${ctx.name}`,
      method: ICalCalendarMethod.PUBLISH,
      prodId: { company: 'Nestkeeper', product: 'bookings', language: 'EN' },
    });
    // All-day events: DTEND is the day after the last day (RFC 5545 §3.6.1).
    const day = (d: string) => new Date(`${d}T00:00:00Z`);
    for (const b of bookings) {
      const what = b.reference ? `Job ${b.reference}${b.customer_name ? ` (${b.customer_name})` : ''}` : b.state === 'reserved' ? 'Booking' : 'Booking';
      cal.createEvent({
        id: `booking-${b.id}@nestkeeper`,
        start: day(b.starts_on),
        end: day(addDays(b.ends_on, 1)),
        allDay: true,
        summary: `${what}: ${b.kit_name ?? b.tags}`,
        description: `Items: ${b.tags}\nState: ${b.state}`,
      });
    }
    for (const d of due) {
      cal.createEvent({
        id: `due-${d.id}-${d.due_on}@nestkeeper`,
        start: day(d.due_on),
        end: day(addDays(d.due_on, 1)),
        allDay: true,
        summary: `Calibration due: ${d.asset_tag}`,
      });
    }
    return cal.toString();
  }
}
