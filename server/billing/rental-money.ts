import { In } from 'typeorm';
import type { RentalMoney } from '../rentals';
import { DepositAuthorization } from './deposit-authorization.entity';
import { currentDepositRequest, depositRequestView } from './deposit-request-view';
import { authorizationView, depositState } from './deposit-state';
import { invoiceSummaries } from './invoice-summaries';
import { Invoice, InvoicePayment } from './invoice.entity';
import { moneyMailViews } from './money-mails';

/** Billing's answer to what rentals ask of a rental's money (handed to rentals by app.ts). */
export const rentalMoney: RentalMoney = {
  async depositState(tx, rentalId) {
    return depositState(await tx.find(DepositAuthorization, { where: { rentalId } })).state;
  },

  async invoiced(tx, rentalId) {
    return (await tx.count(Invoice, { rentalId, kind: 'invoice' })) > 0;
  },

  async facts(tx, rental) {
    const authorizations = await tx.find(DepositAuthorization, { where: { rentalId: rental.id }, order: { createdAt: 'ASC' } });
    const invoices = await tx.find(Invoice, { where: { rentalId: rental.id }, order: { issuedAt: 'ASC' } });
    const payments = await tx.find(InvoicePayment, { where: { invoiceId: In(invoices.map((i) => i.id)) } });
    const deposit = depositState(authorizations);
    const request = await currentDepositRequest(tx, rental.id);
    const sum = (kind: DepositAuthorization['kind']) => authorizations.filter((a) => a.kind === kind).reduce((s, a) => s + a.capturedMinor, 0);
    return {
      deposit: {
        state: deposit.state,
        authorization: deposit.authorization ? authorizationView(deposit.authorization) : null,
        authorizations: authorizations.map(authorizationView),
        request: request ? depositRequestView(request) : null,
      },
      depositCapturedMinor: sum('authorization'),
      cardChargedMinor: sum('charge'),
      invoices: invoiceSummaries(invoices, rental.customerCompany, payments),
      moneyMails: await moneyMailViews(tx, rental.id),
    };
  },
};
