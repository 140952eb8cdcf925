import { addDays, todayIn } from '../../shared/calibration/due-date';
import { Scoped } from '../db/scoped';
import { enqueueMail, staffAddresses } from '../notifications';
import type { Routine } from '../routines';
import { dueDigestMail } from './calibration-mail';
import { dueItems } from './review.service';

type Changed = { organization_id: string; asset_tag: string; state: string };

/**
 * The daily due scan. One set-based statement marks every item whose
 * calibration state became due-soon or overdue since the last scan (so each
 * change is reported once, however many instances or re-runs), then each
 * firm's owners and managers get one digest through the outbox.
 */
export const dueScanRoutine = (): Routine => ({
  name: 'due-scan',
  description: 'Marks calibration states and e-mails each owner and manager one digest of newly due-soon and overdue items and the bookings they threaten.',
  // Hourly; a firm is scanned in the hour its own clock reads 06:00 (every firm on "run now").
  schedule: '5 * * * *',
  run: async ({ db, now, trigger, organizationId }) => {
    const changed: Changed[] = await db.query(
      `WITH states AS (
         SELECT a.id, a.organization_id, a.asset_tag,
                CASE WHEN a.due_on IS NULL OR a.due_on < ($2::timestamptz AT TIME ZONE o.time_zone)::date THEN 'overdue' ELSE 'due_soon' END AS state
           FROM assets a JOIN organizations o ON o.id = a.organization_id
          WHERE a.calibration_required AND a.status <> 'retired'
            AND ($1 OR extract(hour FROM $2::timestamptz AT TIME ZONE o.time_zone) = 6)
            AND ($3::uuid IS NULL OR a.organization_id = $3)
            AND (a.due_on IS NULL OR a.due_on <= ($2::timestamptz AT TIME ZONE o.time_zone)::date + coalesce((o.settings->>'dueSoonDays')::int, 30)))
       , marked AS (
         UPDATE assets a SET notified_calibration_state = s.state
           FROM states s WHERE a.id = s.id AND a.notified_calibration_state IS DISTINCT FROM s.state
         RETURNING s.organization_id, s.asset_tag, s.state)
       SELECT * FROM marked`,
      [trigger === 'manual', now, organizationId],
    );
    const byOrg = new Map<string, Changed[]>();
    for (const c of changed) byOrg.set(c.organization_id, [...(byOrg.get(c.organization_id) ?? []), c]);
    let digests = 0;
    for (const [organizationId, rows] of byOrg) {
      await db.transaction(async (manager) => {
        const tx = new Scoped(manager, organizationId);
        const [org] = await tx.sql<{ time_zone: string; due_soon: number | null }>(
          `SELECT time_zone, (settings->>'dueSoonDays')::int AS due_soon FROM organizations WHERE id = $1`,
        );
        const today = todayIn(org.time_zone, now);
        const tags = new Set(rows.map((r) => r.asset_tag));
        const details = (await dueItems(tx, today, org.due_soon ?? 30)).filter((d) => tags.has(d.assetTag));
        // A long list helps nobody in a mail: the first hundred, then a pointer to the review page.
        const DIGEST_LINES = 100;
        const overdue = details.filter((d) => d.state === 'overdue');
        const soon = details.filter((d) => d.state === 'due_soon');
        const withinDays = org.due_soon ?? 30;
        await enqueueMail(tx, await staffAddresses(tx, ['owner', 'manager']), dueDigestMail, {
          today,
          overdue: overdue.slice(0, DIGEST_LINES),
          overdueMore: Math.max(0, overdue.length - DIGEST_LINES),
          overdueCount: overdue.length,
          soon: soon.slice(0, DIGEST_LINES),
          soonMore: Math.max(0, soon.length - DIGEST_LINES),
          soonCount: soon.length,
          withinDays,
          soonBy: addDays(today, withinDays),
        });
        digests += 1;
      });
    }
    return { itemsChanged: changed.length, digests };
  },
});
