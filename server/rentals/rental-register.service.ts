import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { RentalSummary } from '../../shared/billing/views';
import { formatMoney } from '../../shared/billing/money';
import type { rentalListQuery, rentalPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { book, type BookingView, type HandoverGates } from '../bookings';
import { nextNumber, padded } from '../db/numbering';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { ruleBroken } from '../http/errors';
import { Incident } from '../incidents/incident.entity';
import { Invoice } from '../billing/invoice.entity';
import { enqueueMail } from '../notifications/outbox';
import { Customer } from './customer.entity';
import { priceRental } from './pricing';
import { agreementFor, certificatePackFor } from './rental-papers';
import { depositState, loadRentalView } from './rental-view';
import { Rental } from './rental.entity';
import { DepositHold } from '../billing/deposit-hold.entity';

/** Rentals: a booking for a customer at quoted prices, its papers, and what the counter must check. */
export class RentalRegisterService {
  constructor(private readonly db: DataSource) {}

  /** Books under the bookings rules unchanged (409/422 as there) and records the rental in the same transaction. */
  async create(actor: Actor, input: z.infer<typeof rentalPayload>) {
    const rentalId = randomUUID();
    await inOrganization(this.db, actor.organizationId, async (tx) => {
      await tx.get(Customer, { id: input.customerId }, 'That customer');
      const booking = await book(tx, actor, { kitId: input.kitId, assetIds: input.assetIds, startsOn: input.startsOn, endsOn: input.endsOn, rentalId, note: input.note });
      const quote = await priceRental(tx, { kitId: input.kitId, assetIds: input.assetIds, startsOn: input.startsOn, endsOn: input.endsOn });
      const number = `R-${padded(await nextNumber(tx, 'rental'))}`;
      await tx.insert(Rental, { id: rentalId, number, customerId: input.customerId, bookingId: booking.id, quote, depositMinor: quote.depositMinor, currency: quote.currency, paymentMethodId: null, note: input.note ?? null, createdBy: actor.userId });
      await recordAudit(tx, actor, 'rental.created', { type: 'rental', id: rentalId }, { number, customerId: input.customerId, totalMinor: quote.totalMinor, depositMinor: quote.depositMinor });
    });
    return this.get(actor, rentalId);
  }

  get(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => loadRentalView(tx, await tx.get(Rental, { id }, 'That rental')));
  }

  list(actor: Actor, q: z.infer<typeof rentalListQuery>) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const filter = {
        open: `b.state <> 'cancelled' AND inv.number IS NULL`,
        to_settle: `b.state = 'returned' AND (inv.number IS NULL OR h.state = 'authorized')`,
        all: 'true',
      }[q.view];
      const rows = await tx.sql<RentalSummary & { total: number }>(
        `SELECT r.id, r.number, c.id AS "customerId", c.company AS "customerCompany", k.name AS "kitName",
                (SELECT count(*)::int FROM booking_items bi WHERE bi.booking_id = b.id) AS "itemCount",
                to_char(b.starts_on, 'YYYY-MM-DD') AS "startsOn", to_char(b.ends_on, 'YYYY-MM-DD') AS "endsOn",
                r.currency, (r.quote->>'totalMinor')::int AS "totalMinor", r.deposit_minor AS "depositMinor",
                CASE WHEN b.state = 'cancelled' THEN 'cancelled' WHEN inv.number IS NOT NULL THEN 'invoiced' ELSE b.state END AS state,
                coalesce(h.state, 'none') AS "depositState", h.capture_before AS "holdCaptureBefore", inv.number AS "invoiceNumber",
                count(*) OVER ()::int AS total
           FROM rentals r JOIN bookings b ON b.id = r.booking_id JOIN customers c ON c.id = r.customer_id
           LEFT JOIN kits k ON k.id = b.kit_id
           LEFT JOIN LATERAL (SELECT state, capture_before FROM deposit_holds d WHERE d.rental_id = r.id AND d.kind = 'hold' AND d.state <> 'replaced' ORDER BY d.created_at DESC LIMIT 1) h ON true
           LEFT JOIN invoices inv ON inv.rental_id = r.id AND inv.kind = 'invoice'
          WHERE r.organization_id = $1 AND ${filter} AND ($2::uuid IS NULL OR r.customer_id = $2)
          ORDER BY b.starts_on DESC, r.number DESC LIMIT $3 OFFSET $4`,
        [q.customerId ?? null, q.limit, q.offset],
      );
      return { items: rows.map(({ total: _t, ...r }) => ({ ...r, holdCaptureBefore: r.holdCaptureBefore ? new Date(r.holdCaptureBefore).toISOString() : null })), total: rows[0]?.total ?? 0 };
    });
  }

  /** The repair or replacement charge for an item that came back damaged or not at all (net of tax). */
  setCharge(actor: Actor, rentalId: string, incidentId: string, amountMinor: number) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await tx.get(Rental, { id: rentalId }, 'That rental');
      if (await tx.count(Invoice, { rentalId, kind: 'invoice' })) throw ruleBroken('already_invoiced', 'This rental is invoiced; correct it with a credit note.');
      const incident = await tx.get(Incident, { id: incidentId, bookingId: rental.bookingId }, 'That incident on this rental');
      const before = incident.chargeAmountMinor;
      incident.chargeAmountMinor = amountMinor;
      await tx.save(Incident, incident);
      await recordAudit(tx, actor, 'rental.charge_set', { type: 'rental', id: rentalId }, { incidentId, before, after: amountMinor });
      return loadRentalView(tx, rental);
    });
  }

  agreementPdf(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await loadRentalView(tx, await tx.get(Rental, { id }, 'That rental'));
      return { pdf: await agreementFor(tx, rental), number: rental.number };
    });
  }

  certificatePackPdf(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await loadRentalView(tx, await tx.get(Rental, { id }, 'That rental'));
      return { pdf: await certificatePackFor(tx, rental), number: rental.number };
    });
  }

  /** What the counter checks for a rental: a deposit hold before handing over; the papers go to the renter after. */
  readonly handoverGates: HandoverGates = {
    beforeCheckout: async (tx: Scoped, booking: BookingView) => {
      if (!booking.rentalId) return;
      const rental = await tx.get(Rental, { id: booking.rentalId }, 'That rental');
      if (rental.depositMinor <= 0) return;
      const { state } = depositState(await tx.find(DepositHold, { where: { rentalId: rental.id } }));
      if (state !== 'authorized') {
        throw ruleBroken('deposit_required', `Rental ${rental.number} needs its deposit hold of ${formatMoney(rental.depositMinor, rental.currency, 'en-GB')} on the customer's card before the kit is handed over${state === 'declined' ? ' (the last card was declined)' : ''}. The billing clerk takes it on the rental's page.`);
      }
    },
    afterCheckout: async (tx: Scoped, booking: BookingView) => {
      if (!booking.rentalId) return;
      const rental = await loadRentalView(tx, await tx.get(Rental, { id: booking.rentalId }, 'That rental'));
      const [agreement, pack] = [await agreementFor(tx, rental), await certificatePackFor(tx, rental)];
      await enqueueMail(
        tx,
        [rental.customer.billingEmail],
        {
          subject: `Rental ${rental.number}: agreement and calibration certificates`,
          heading: `Your rental ${rental.number}, ${rental.startsOn} to ${rental.endsOn}`,
          paragraphs: [
            `${rental.customer.billingContact ? `Dear ${rental.customer.billingContact}, the` : 'The'} kit for rental ${rental.number} was handed over today. Attached are the rental agreement and a certificate pack with the current calibration certificate of every rented item that needs one, for your own auditors.`,
            `Items: ${rental.items.map((i) => i.assetTag).join(', ')}. Please bring everything back by ${rental.endsOn}.`,
            "Laser trackers emit a laser beam: do not stare into it. Damaged lithium-ion batteries are a fire risk: do not charge or fly them. Cases are heavy. Follow local codes, the carrier's rules and the instrument maker's instructions.",
          ],
        },
        [
          { fileName: `agreement-${rental.number}.pdf`, contentType: 'application/pdf', content: agreement },
          { fileName: `certificates-${rental.number}.pdf`, contentType: 'application/pdf', content: pack },
        ],
      );
    },
  };
}
