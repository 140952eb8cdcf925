import { todayIn } from '../../shared/calibration/due-date';
import { Scoped } from '../db/scoped';
import type { Routine } from '../routines';
import { enqueueMail, staffAddresses } from '../notifications';
import { renewalRefusedMail } from './billing-mail';
import { lockRental } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import type { DepositsService } from './deposits.service';

/** Renew an authorization when it would lapse within this long: a daily job then always has a second chance. */
export const RENEW_WITHIN_HOURS = 48;

type DueAuthorization = { id: string; organization_id: string; rental_id: string; time_zone: string };

/**
 * Once a day: every deposit authorization still counted on (rental not
 * invoiced or cancelled) that lapses within 48 hours is renewed on the saved
 * card; when the card will not take it, the firm's billing clerk and owner
 * are told.
 */
export const depositRenewalsRoutine = (deposits: DepositsService): Routine => ({
  name: 'deposit-renewals',
  description: 'Renews the card authorizations of deposits that would lapse within two days, and says when a card refuses.',
  schedule: '30 5 * * *',
  run: async ({ db, now, organizationId, log }) => {
    const due: DueAuthorization[] = await db.query(
      `SELECT d.id, d.organization_id, d.rental_id, o.time_zone
         FROM deposit_authorizations d JOIN rentals r ON r.id = d.rental_id JOIN bookings b ON b.id = r.booking_id
         JOIN organizations o ON o.id = d.organization_id
        WHERE d.kind = 'authorization' AND d.state = 'authorized' AND d.payment_intent_id IS NOT NULL AND d.capture_before < $1 AND b.state <> 'cancelled'
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
      await db
        .transaction(async (manager) => {
          const tx = new Scoped(manager, row.organization_id);
          const rental = await lockRental(tx, row.rental_id);
          const authorization = await tx.get(DepositAuthorization, { id: row.id }, 'That card authorization');
          if (authorization.state !== 'authorized') return; // settled meanwhile
          const result = await deposits.renew(tx, rental, authorization, todayIn(row.time_zone, now));
          if (result.ok) {
            renewed += 1;
            return;
          }
          refused += 1;
          await enqueueMail(tx, await staffAddresses(tx, ['billing', 'owner']), renewalRefusedMail, {
            rental,
            amountMinor: authorization.amountMinor,
            lapsesAt: authorization.captureBefore,
            message: result.message,
          });
        })
        .catch((err: Error) => {
          unreachable += 1;
          log?.warn({ err, authorizationId: row.id }, 'card authorization not renewed');
        });
    }
    return { due: due.length, renewed, refused, unreachable };
  },
});
