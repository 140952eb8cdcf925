import { formatMoney } from '../../shared/billing/money';
import { todayIn } from '../../shared/calibration/due-date';
import { Scoped } from '../db/scoped';
import type { JobDefinition } from '../jobs/job';
import { enqueueMail } from '../notifications/outbox';
import { staffAddresses } from '../notifications/staff';
import { DepositHold } from './deposit-hold.entity';
import type { DepositsService } from './deposits.service';
import { lockRental } from './deposits.service';

/** Renew a hold when it would lapse within this long: a daily job then always has a second chance. */
export const RENEW_WITHIN_HOURS = 48;

type DueHold = { id: string; organization_id: string; rental_id: string; time_zone: string };

/**
 * Once a day: every deposit hold still counted on (rental not invoiced or
 * cancelled) that lapses within 48 hours is renewed on the saved card; when
 * the card will not take it, the firm's billing clerk and owner are told.
 */
export const depositRenewalsJob = (deposits: DepositsService): JobDefinition => ({
  name: 'deposit-renewals',
  description: 'Renews card holds for deposits that would lapse within two days, and says when a card refuses.',
  schedule: '30 5 * * *',
  run: async ({ db, now, organizationId }) => {
    const due: DueHold[] = await db.query(
      `SELECT d.id, d.organization_id, d.rental_id, o.time_zone
         FROM deposit_holds d JOIN rentals r ON r.id = d.rental_id JOIN bookings b ON b.id = r.booking_id
         JOIN organizations o ON o.id = d.organization_id
        WHERE d.kind = 'hold' AND d.state = 'authorized' AND d.payment_intent_id IS NOT NULL AND d.capture_before < $1 AND b.state <> 'cancelled'
          AND ($2::uuid IS NULL OR d.organization_id = $2)
          AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.rental_id = r.id AND i.kind = 'invoice')
        ORDER BY d.capture_before`,
      [new Date(now.getTime() + RENEW_WITHIN_HOURS * 3_600_000), organizationId],
    );
    let renewed = 0;
    let refused = 0;
    let unreachable = 0;
    for (const row of due) {
      // One rental's trouble (the provider down, say) must not stop the others; tomorrow's run tries again.
      await db.transaction(async (manager) => {
        const tx = new Scoped(manager, row.organization_id);
        const rental = await lockRental(tx, row.rental_id);
        const hold = await tx.get(DepositHold, { id: row.id }, 'That hold');
        if (hold.state !== 'authorized') return; // settled meanwhile
        const result = await deposits.renew(tx, rental, hold, todayIn(row.time_zone, now));
        if (result.ok) {
          renewed += 1;
          return;
        }
        refused += 1;
        await enqueueMail(tx, await staffAddresses(tx, ['billing', 'owner']), {
          subject: `Deposit hold not renewed: rental ${rental.number}`,
          heading: `The card refused to renew the deposit for rental ${rental.number}`,
          paragraphs: [
            `The hold of ${formatMoney(hold.amountMinor, rental.currency, 'en-GB')} lapses at ${hold.captureBefore?.toISOString() ?? 'an unknown time'}; renewing it on the saved card failed: ${result.message}`,
            'Ask the customer for another card, or settle the rental before the hold lapses.',
          ],
        });
      }).catch((err: Error) => {
        unreachable += 1;
        console.error(`[deposit-renewals] hold ${row.id}: ${err.message}`);
      });
    }
    return { due: due.length, renewed, refused, unreachable };
  },
});
