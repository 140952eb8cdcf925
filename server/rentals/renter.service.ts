import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { RenterRentalView, RentalView } from '../../shared/billing/views';
import type { agreementAcceptancePayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization } from '../db/transaction';
import { agreementTerms } from '../documents/rental-agreement-pdf';
import { assetsByIds } from '../fleet';
import { conflict, ruleBroken } from '../http/errors';
import { formatOf, loadOrgContext, voiceOf } from '../organizations';
import { latestAcceptance } from './agreement-acceptance';
import type { RentalMoney } from './rental-money';
import { agreementFor, certificatePackFor } from './rental-papers';
import { getRental } from './rental-records';
import { loadRentalView } from './rental-view';
import { AgreementAcceptance } from './renter-link.entity';
import { openRenterLink, sha256 } from './renter-links';

type Acceptance = z.infer<typeof agreementAcceptancePayload>;
type Link = Awaited<ReturnType<typeof openRenterLink>>;

const card = (rental: RentalView) => {
  const a = rental.deposit.authorization;
  return a?.cardLast4 && rental.deposit.state === 'authorized'
    ? `${a.cardBrand ? a.cardBrand[0].toUpperCase() + a.cardBrand.slice(1) : 'Card'} ending ${a.cardLast4}`
    : null;
};

/**
 * The renter's own page, opened by the secret link in their mail (no
 * sign-in): the rental, its papers, the agreement to accept and the deposit
 * step. Everything is read in the link's firm only.
 */
export class RenterService {
  constructor(
    private readonly db: DataSource,
    private readonly money: RentalMoney,
  ) {}

  private async within<T>(token: string, work: (tx: Scoped, rental: RentalView, link: Link) => Promise<T>): Promise<T> {
    const link = await openRenterLink(this.db, token);
    return inOrganization(this.db, link.organizationId, async (tx) => work(tx, await loadRentalView(tx, await getRental(tx, link.rentalId), this.money), link));
  }

  view(token: string): Promise<RenterRentalView> {
    return this.within(token, async (tx, rental, link) => {
      const ctx = await loadOrgContext(tx);
      const assets = await assetsByIds(
        tx,
        rental.items.map((i) => i.id),
        { packingOrder: true },
      );
      const accepted = await latestAcceptance(tx, rental.id);
      return {
        firm: { name: ctx.name, ...voiceOf(ctx) },
        number: rental.number,
        state: rental.state,
        customer: { company: rental.customer.company, billingContact: rental.customer.billingContact },
        startsOn: rental.startsOn,
        endsOn: rental.endsOn,
        items: assets.map((a) => ({
          assetTag: a.assetTag,
          type: a.type,
          manufacturer: a.manufacturer,
          model: a.model,
          serialNumber: a.serialNumber,
          calibrationRequired: a.calibrationRequired,
          validThrough: a.calibrationRequired ? a.dueOn : null,
          coversRental: !a.calibrationRequired || (!!a.dueOn && a.dueOn >= rental.endsOn),
        })),
        quote: rental.quote,
        currency: rental.currency,
        depositMinor: rental.depositMinor,
        terms: agreementTerms(rental, formatOf(ctx)),
        agreement: {
          sha256: sha256(await agreementFor(tx, rental)),
          accepted: accepted ? { fullName: accepted.fullName, acceptedAt: accepted.acceptedAt } : null,
        },
        deposit: { state: rental.deposit.state, request: rental.deposit.request, card: card(rental) },
        linkExpiresAt: link.expiresAt.toISOString(),
      };
    });
  }

  agreementPdf(token: string) {
    return this.within(token, async (tx, rental) => ({ pdf: await agreementFor(tx, rental), number: rental.number }));
  }

  certificatePackPdf(token: string) {
    return this.within(token, async (tx, rental) => ({ pdf: await certificatePackFor(tx, rental), number: rental.number }));
  }

  /**
   * Records who accepted, when, from where, and the SHA-256 of the exact
   * agreement bytes (kept too). The fingerprint the renter was shown must
   * match the agreement as it stands: if it changed meanwhile (new dates),
   * they read it again. Accepting the same agreement twice keeps the first.
   */
  async accept(token: string, input: Acceptance, from: { ip: string; userAgent: string | null }): Promise<RenterRentalView> {
    await this.within(token, async (tx, rental, link) => {
      if (rental.state !== 'reserved' && rental.state !== 'out')
        throw ruleBroken('rental_closed', `Rental ${rental.number} is ${rental.state}; there is nothing left to accept.`);
      const pdf = await agreementFor(tx, rental);
      const fingerprint = sha256(pdf);
      if (fingerprint !== input.agreementSha256)
        throw conflict('The agreement changed since this page was opened (dates or prices moved). Reload the page and read it again before accepting.', {
          fields: { agreementSha256: 'is not the current agreement' },
        });
      if ((await latestAcceptance(tx, rental.id))?.agreementSha256 !== fingerprint) {
        const row = await tx.insert(AgreementAcceptance, {
          rentalId: rental.id,
          renterLinkId: link.id,
          fullName: input.fullName,
          ipAddress: from.ip,
          userAgent: from.userAgent?.slice(0, 500) ?? null,
          agreementSha256: fingerprint,
          agreementPdf: pdf,
        });
        await recordAudit(
          tx,
          null,
          'rental.agreement_accepted',
          { type: 'rental', id: rental.id },
          { acceptanceId: row.id, fullName: input.fullName, ipAddress: from.ip, agreementSha256: fingerprint },
        );
      }
    });
    return this.view(token);
  }
}
