import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { rentalPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { book, type BookingView, type HandoverGates } from '../bookings';
import { nextNumber, padded } from '../db/numbering';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { ruleBroken } from '../http/errors';
import { setIncidentCharge } from '../incidents/incidents.service';
import { enqueueMail } from '../notifications';
import { loadFirmFormat } from '../organizations';
import { handoverMail } from './rental-mail';
import { priceRental } from './pricing';
import type { RentalMoney } from './rental-money';
import { latestAcceptance } from './agreement-acceptance';
import { agreementFor, certificatePackFor } from './rental-papers';
import { getCustomer, getRental } from './rental-records';
import { loadRentalView } from './rental-view';
import { Rental } from './rental.entity';

/** Rentals: a booking for a customer at quoted prices, its papers, and what the counter must check. */
export class RentalsService {
  constructor(
    private readonly db: DataSource,
    private readonly money: RentalMoney,
  ) {}

  /** Books under the bookings rules unchanged (409/422 as there) and records the rental in the same transaction. */
  async create(actor: Actor, input: z.infer<typeof rentalPayload>) {
    const rentalId = randomUUID();
    await inOrganization(this.db, actor.organizationId, async (tx) => {
      await getCustomer(tx, input.customerId);
      const booking = await book(tx, actor, {
        kitId: input.kitId,
        assetIds: input.assetIds,
        startsOn: input.startsOn,
        endsOn: input.endsOn,
        rentalId,
        note: input.note,
      });
      const quote = await priceRental(tx, { kitId: input.kitId, assetIds: input.assetIds, startsOn: input.startsOn, endsOn: input.endsOn });
      const number = `R-${padded(await nextNumber(tx, 'rental'))}`;
      await tx.insert(Rental, {
        id: rentalId,
        number,
        customerId: input.customerId,
        bookingId: booking.id,
        quote,
        depositMinor: quote.depositMinor,
        currency: quote.currency,
        paymentMethodId: null,
        note: input.note ?? null,
        createdBy: actor.userId,
      });
      await recordAudit(
        tx,
        actor,
        'rental.created',
        { type: 'rental', id: rentalId },
        { number, customerId: input.customerId, totalMinor: quote.totalMinor, depositMinor: quote.depositMinor },
      );
    });
    return this.get(actor, rentalId);
  }

  get(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => loadRentalView(tx, await getRental(tx, id), this.money));
  }

  /** The repair or replacement charge for an item that came back damaged or not at all (net of tax). */
  setCharge(actor: Actor, rentalId: string, incidentId: string, amountMinor: number) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await getRental(tx, rentalId);
      if (await this.money.invoiced(tx, rental.id)) throw ruleBroken('already_invoiced', 'This rental is invoiced; correct it with a credit note.');
      const before = await setIncidentCharge(tx, rental.bookingId, incidentId, amountMinor);
      await recordAudit(tx, actor, 'rental.charge_set', { type: 'rental', id: rentalId }, { incidentId, before, after: amountMinor });
      return loadRentalView(tx, rental, this.money);
    });
  }

  /** The owner's explicit word that the kit may go out without the accepted agreement or the card authorization (audited). */
  overrideHandover(actor: Actor, rentalId: string, reason: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await tx.get(Rental, { id: rentalId }, 'That rental');
      Object.assign(rental, { handoverOverrideReason: reason, handoverOverrideBy: actor.userId, handoverOverrideAt: new Date() });
      await tx.save(Rental, rental);
      await recordAudit(tx, actor, 'rental.handover_override', { type: 'rental', id: rentalId }, { reason });
      return loadRentalView(tx, rental, this.money);
    });
  }

  agreementPdf(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await loadRentalView(tx, await getRental(tx, id), this.money);
      return { pdf: await agreementFor(tx, rental), number: rental.number };
    });
  }

  certificatePackPdf(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await loadRentalView(tx, await getRental(tx, id), this.money);
      return { pdf: await certificatePackFor(tx, rental), number: rental.number };
    });
  }

  /** What the counter checks for a rental: the deposit authorized on the card and the agreement accepted before handing over (or the owner's override); the papers go to the renter after. */
  readonly handoverGates: HandoverGates = {
    beforeCheckout: async (tx: Scoped, booking: BookingView) => {
      if (!booking.rentalId) return;
      const rental = await getRental(tx, booking.rentalId);
      if (rental.depositMinor <= 0 || rental.handoverOverrideReason) return;
      const state = await this.money.depositState(tx, rental.id);
      if (state !== 'authorized') {
        const f = await loadFirmFormat(tx);
        throw ruleBroken(
          'deposit_required',
          `Rental ${rental.number} needs its deposit of ${f.money(rental.depositMinor, rental.currency)} authorized on the customer's card before the kit is handed over${state === 'declined' ? ' (the last card was declined)' : ''}. The billing clerk sends the renter the link on the rental's page.`,
        );
      }
      if (!(await latestAcceptance(tx, rental.id)))
        throw ruleBroken(
          'agreement_required',
          `Rental ${rental.number} needs the renter's acceptance of the rental agreement before the kit is handed over: they accept it on the page the billing clerk sends them, or the owner lets it go with a reason.`,
        );
    },
    afterCheckout: async (tx: Scoped, booking: BookingView) => {
      if (!booking.rentalId) return;
      const rental = await loadRentalView(tx, await getRental(tx, booking.rentalId), this.money);
      const [agreement, pack] = [await agreementFor(tx, rental), await certificatePackFor(tx, rental)];
      await enqueueMail(tx, [rental.customer.billingEmail], handoverMail, { rental }, [
        { fileName: `agreement-${rental.number}.pdf`, contentType: 'application/pdf', content: agreement },
        { fileName: `certificates-${rental.number}.pdf`, contentType: 'application/pdf', content: pack },
      ]);
    },
  };
}
