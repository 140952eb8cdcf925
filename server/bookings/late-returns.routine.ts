import { Scoped } from '../db/scoped';
import { enqueueMail, staffAddresses } from '../notifications';
import type { Routine } from '../routines';
import { todayIn } from '../../shared/calibration/due-date';
import { lateReturnsMail } from './late-returns-mail';
import { markNotCollected } from './lifecycle';

type LateRow = {
  organization_id: string;
  time_zone: string;
  id: string;
  starts_on: string;
  ends_on: string;
  taken_by: string | null;
  reference: string | null;
  tags: string;
};

/**
 * Once a day: reservations whose days passed without checkout become not collected (they stop holding their items),
 * then one e-mail per firm lists bookings past their end date and not back. Set-based, one query each.
 */
export const lateReturnsRoutine = (): Routine => ({
  name: 'late-returns',
  description: 'Marks reservations whose days passed as not collected, and e-mails each firm one list of bookings past their end date and not returned.',
  schedule: '0 7 * * *',
  run: async ({ db, now, organizationId }) => {
    const firms: { id: string; time_zone: string }[] = await db.query(`SELECT id, time_zone FROM organizations WHERE ($1::uuid IS NULL OR id = $1)`, [
      organizationId,
    ]);
    let notCollected = 0;
    for (const firm of firms) notCollected += await db.transaction((manager) => markNotCollected(new Scoped(manager, firm.id), todayIn(firm.time_zone, now)));
    const rows: LateRow[] = await db.query(
      `SELECT b.organization_id, o.time_zone, b.id, to_char(b.starts_on, 'YYYY-MM-DD') AS starts_on, to_char(b.ends_on, 'YYYY-MM-DD') AS ends_on,
              b.taken_by, j.reference, string_agg(a.asset_tag, ', ' ORDER BY a.asset_tag) AS tags
         FROM bookings b JOIN organizations o ON o.id = b.organization_id
         LEFT JOIN jobs j ON j.id = b.job_id
         JOIN booking_items bi ON bi.booking_id = b.id JOIN assets a ON a.id = bi.asset_id
        WHERE b.state = 'out' AND b.ends_on < ($2::timestamptz AT TIME ZONE o.time_zone)::date AND ($1::uuid IS NULL OR b.organization_id = $1)
        GROUP BY b.organization_id, o.time_zone, b.id, j.reference ORDER BY b.ends_on`,
      [organizationId, now],
    );
    const byOrg = new Map<string, LateRow[]>();
    for (const r of rows) byOrg.set(r.organization_id, [...(byOrg.get(r.organization_id) ?? []), r]);
    for (const [organizationId, late] of byOrg) {
      await db.transaction(async (manager) => {
        const tx = new Scoped(manager, organizationId);
        const today = todayIn(late[0].time_zone, now);
        await enqueueMail(tx, await staffAddresses(tx, ['owner', 'manager']), lateReturnsMail, {
          today,
          late: late.map((r) => ({ reference: r.reference, startsOn: r.starts_on, endsOn: r.ends_on, takenBy: r.taken_by, tags: r.tags })),
        });
      });
    }
    return { firms: byOrg.size, lateBookings: rows.length, notCollected };
  },
});
