import { In, type DataSource } from 'typeorm';
import type { z } from 'zod';
import { creditNoteAmounts, paymentDueOn } from '../../shared/billing/settlement';
import { firmFormat } from '../../shared/formatting/firm-format';
import type { InvoiceSummary, InvoiceView } from '../../shared/billing/views';
import { columnHeading, plainAmount } from '../../shared/formatting/csv-columns';
import type { Page } from '../../shared/lists/page';
import type { creditNotePayload, invoiceListQuery, invoicePaymentPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { loadBooking } from '../bookings';
import type { Scoped } from '../db/scoped';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { toCsv } from '../documents/csv';
import { invoicePdf } from '../documents/invoice-pdf';
import { conflict, ruleBroken } from '../http/errors';
import { documentFirm, loadOrgContext, voiceOf } from '../organizations';
import { invoiceMail } from './billing-mail';
import { getCustomer, getRental, loadRentalView, lockRental, type CustomerRecord } from '../rentals';
import { invoiceSummaries } from './invoice-summaries';
import { Invoice, InvoicePayment } from './invoice.entity';
import { mailCustomerAbout } from './money-mails';
import { rentalMoney } from './rental-money';
import { nextNumber, padded } from '../db/numbering';

/**
 * Invoices and credit notes: numbered per firm and year without gaps (the
 * counter is taken in the issuing transaction), never edited, each e-mailed
 * to the customer's billing contact with its PDF through the outbox.
 */
export class InvoicesService {
  constructor(private readonly db: DataSource) {}

  issue(actor: Actor, rentalId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const rental = await lockRental(tx, rentalId);
      const existing = await tx.findOne(Invoice, { rentalId, kind: 'invoice' });
      if (existing) throw conflict(`Rental ${rental.number} is already invoiced as ${existing.number}; correct it with a credit note.`);
      const booking = await loadBooking(tx, rental.bookingId);
      if (booking.state !== 'returned') throw ruleBroken('booking_state', `The invoice is issued once the kit is back; this rental is ${booking.state}.`);
      const view = await loadRentalView(tx, rental, rentalMoney);
      if (view.deposit.state === 'authorized')
        throw ruleBroken('deposit_unsettled', 'Capture or release the deposit’s card authorization first, so the invoice can show what was taken.');
      const unpriced = view.charges.filter((c) => c.amountMinor === null);
      if (unpriced.length) throw ruleBroken('charge_unpriced', `Set a charge (or 0) for: ${unpriced.map((c) => c.assetTag).join(', ')}.`);
      const customer = await getCustomer(tx, rental.customerId);
      const s = view.settlement;
      return this.write(tx, actor, {
        kind: 'invoice',
        number: await this.number(tx, 'invoice'),
        rentalId,
        customer,
        correctsInvoiceId: null,
        currency: rental.currency,
        lines: s.lines,
        subtotalMinor: s.subtotalMinor,
        taxRateBasisPoints: rental.quote.taxRateBasisPoints,
        taxMinor: s.taxMinor,
        totalMinor: s.totalMinor,
        depositCapturedMinor: s.depositCapturedMinor,
        cardChargedMinor: s.cardChargedMinor,
        balanceMinor: s.balanceMinor,
        reason: null,
      });
    });
  }

  /** Corrects an issued invoice by crediting part or all of its net amount (tax at the invoice's rate). */
  creditNote(actor: Actor, invoiceId: string, input: z.infer<typeof creditNotePayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const invoice = await tx.get(Invoice, { id: invoiceId, kind: 'invoice' }, 'That invoice');
      await lockRental(tx, invoice.rentalId);
      const credited = (await tx.find(Invoice, { where: { correctsInvoiceId: invoice.id } })).reduce((s, c) => s + c.subtotalMinor, 0);
      // The same amounts the clerk's confirmation showed (shared/billing/settlement.ts).
      const credit = creditNoteAmounts(
        { subtotalMinor: invoice.subtotalMinor, creditedMinor: credited, taxRateBasisPoints: invoice.taxRateBasisPoints },
        input.amountMinor,
      );
      if (credit.netMinor === null) {
        throw ruleBroken(
          'credit_too_large',
          `At most ${await this.money(tx, credit.leftMinor, invoice.currency)} (net) of invoice ${invoice.number} is left to credit.`,
          {
            leftMinor: credit.leftMinor,
          },
        );
      }
      const amount = credit.netMinor;
      const customer = await getCustomer(tx, invoice.customerId);
      return this.write(tx, actor, {
        kind: 'credit_note',
        number: await this.number(tx, 'credit_note'),
        rentalId: invoice.rentalId,
        customer,
        correctsInvoiceId: invoice.id,
        currency: invoice.currency,
        lines: [
          { kind: 'credit', description: `Credit against invoice ${invoice.number}: ${input.reason}`, quantity: 1, unitMinor: amount, amountMinor: amount },
        ],
        subtotalMinor: amount,
        taxRateBasisPoints: invoice.taxRateBasisPoints,
        taxMinor: credit.taxMinor,
        totalMinor: credit.totalMinor,
        depositCapturedMinor: 0,
        cardChargedMinor: 0,
        balanceMinor: -credit.totalMinor,
        reason: input.reason,
      });
    });
  }

  /** Money received against an invoice (a transfer, say); never more than is outstanding. */
  recordPayment(actor: Actor, invoiceId: string, input: z.infer<typeof invoicePaymentPayload>) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const invoice = await tx.get(Invoice, { id: invoiceId, kind: 'invoice' }, 'That invoice');
      await lockRental(tx, invoice.rentalId);
      const { outstandingMinor } = await this.view(tx, invoice);
      if (input.amountMinor > outstandingMinor) {
        throw ruleBroken(
          'overpaid',
          `Invoice ${invoice.number} has ${await this.money(tx, outstandingMinor, invoice.currency)} outstanding; record at most that.`,
          { outstandingMinor },
        );
      }
      const payment = await tx.insert(InvoicePayment, {
        invoiceId,
        amountMinor: input.amountMinor,
        receivedOn: input.receivedOn,
        reference: input.reference,
        recordedBy: actor.userId,
      });
      await recordAudit(
        tx,
        actor,
        'invoice.payment_recorded',
        { type: 'invoice', id: invoiceId },
        { paymentId: payment.id, amountMinor: input.amountMinor, receivedOn: input.receivedOn, reference: input.reference },
      );
      return this.view(tx, invoice);
    });
  }

  list(actor: Actor, q: z.infer<typeof invoiceListQuery>): Promise<Page<InvoiceSummary>> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      const qb = tx.select(Invoice, 'i').orderBy('i.issued_at', 'DESC').addOrderBy('i.number', 'DESC');
      if (q.kind) qb.andWhere('i.kind = :kind', { kind: q.kind });
      if (q.customerId) qb.andWhere('i.customer_id = :customerId', { customerId: q.customerId });
      const [rows, total] = await qb.take(q.limit).skip(q.offset).getManyAndCount();
      return { items: await this.summaries(tx, rows), total };
    });
  }

  get(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => this.view(tx, await tx.get(Invoice, { id }, 'That invoice')));
  }

  async pdf(actor: Actor, id: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => this.render(tx, await this.view(tx, await tx.get(Invoice, { id }, 'That invoice'))));
  }

  /** The rental's invoice (its latest document when credit notes followed). */
  async rentalPdf(actor: Actor, rentalId: string) {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      await getRental(tx, rentalId);
      const invoice = await tx.findOne(Invoice, { rentalId, kind: 'invoice' });
      if (!invoice) throw ruleBroken('not_invoiced', 'This rental has no invoice yet.');
      return this.render(tx, await this.view(tx, invoice));
    });
  }

  /** Every invoice and credit note as CSV (shared/formatting/csv-columns.ts): amounts as plain decimals, the currency in the headings. */
  async csv(actor: Actor) {
    const { items } = await this.list(actor, { limit: 100_000, offset: 0 } as z.infer<typeof invoiceListQuery>);
    const currencies = new Set(items.map((i) => i.currency));
    // A firm bills in its one currency; should the list ever hold two, each row's Currency column says which.
    const unit =
      currencies.size > 1 ? 'see Currency' : (items[0]?.currency ?? (await readInOrganization(this.db, actor.organizationId, loadOrgContext)).currency);
    const amount = (label: string) => columnHeading(label, unit);
    return toCsv(
      [
        'Number',
        'Kind',
        'Issued on',
        'Customer',
        'Corrects',
        'Currency',
        amount('Subtotal'),
        amount('Tax'),
        amount('Total'),
        amount('Deposit captured'),
        amount('Charged to card'),
        // What the invoice left to pay on the day it was issued; Balance is what is still owed today.
        amount('Due at issue'),
        amount('Credited'),
        amount('Received'),
        amount('Balance'),
      ],
      items.map((i) => [
        i.number,
        i.kind,
        i.issuedOn,
        i.customerCompany,
        i.correctsNumber ?? '',
        i.currency,
        ...[
          i.subtotalMinor,
          i.taxMinor,
          i.totalMinor,
          i.depositCapturedMinor,
          i.cardChargedMinor,
          i.balanceMinor,
          i.creditedMinor,
          i.receivedMinor,
          i.outstandingMinor,
        ].map((minor) => plainAmount(minor, i.currency)),
      ]),
    );
  }

  private async number(tx: Scoped, kind: Invoice['kind']) {
    const year = (await loadOrgContext(tx)).today.slice(0, 4);
    const n = await nextNumber(tx, `${kind}:${year}`);
    return kind === 'invoice' ? `${year}-${padded(n)}` : `CN-${year}-${padded(n)}`;
  }

  private async write(
    tx: Scoped,
    actor: Actor,
    v: Omit<Invoice, 'id' | 'organizationId' | 'issuedOn' | 'issuedAt' | 'issuedBy' | 'customer' | 'customerId' | 'issuer'> & { customer: CustomerRecord },
  ) {
    const ctx = await loadOrgContext(tx);
    const { customer, ...rest } = v;
    const invoice = await tx.insert(Invoice, {
      ...rest,
      customerId: customer.id,
      customer: {
        company: customer.company,
        billingContact: customer.billingContact,
        billingEmail: customer.billingEmail,
        address: customer.address,
        taxNumber: customer.taxNumber,
      },
      issuer: ctx.issuer,
      issuedOn: ctx.today,
      issuedAt: new Date(),
      issuedBy: actor.userId,
    });
    await recordAudit(
      tx,
      actor,
      v.kind === 'invoice' ? 'invoice.issued' : 'credit_note.issued',
      { type: 'invoice', id: invoice.id },
      { number: invoice.number, totalMinor: invoice.totalMinor, rentalId: invoice.rentalId },
    );
    const view = await this.view(tx, invoice);
    await mailCustomerAbout(
      tx,
      view.rentalId,
      v.kind === 'invoice' ? 'invoice_issued' : 'credit_note_issued',
      { documentNumber: view.number, totalMinor: view.totalMinor },
      customer.billingEmail,
      invoiceMail,
      { invoice: view, isInvoice: v.kind === 'invoice', firm: ctx.name, paymentTerms: ctx.issuer.paymentTerms },
      [
        {
          fileName: `${v.kind === 'invoice' ? 'invoice' : 'credit-note'}-${view.number}.pdf`,
          contentType: 'application/pdf',
          content: (await this.render(tx, view)).pdf,
        },
      ],
    );
    return view;
  }

  /** Summaries of `rows`, each knowing its corrected invoice's number, what was credited against it and what was received. */
  private async summaries(tx: Scoped, rows: Invoice[]) {
    if (!rows.length) return [];
    const siblings = await tx.find(Invoice, { where: { rentalId: In([...new Set(rows.map((r) => r.rentalId))]) } });
    const payments = await tx.find(InvoicePayment, { where: { invoiceId: In(siblings.map((i) => i.id)) } });
    return rows.map((r) =>
      invoiceSummaries(
        siblings.filter((i) => i.rentalId === r.rentalId),
        r.customer.company,
        payments,
      ).find((s) => s.id === r.id)!,
    );
  }

  private async view(tx: Scoped, invoice: Invoice): Promise<InvoiceView> {
    const [summary] = await this.summaries(tx, [invoice]);
    const corrected = invoice.correctsInvoiceId ? await tx.findOne(Invoice, { id: invoice.correctsInvoiceId }) : null;
    const payments = await tx.find(InvoicePayment, { where: { invoiceId: invoice.id }, order: { receivedOn: 'ASC', createdAt: 'ASC' } });
    return {
      ...summary,
      payments: payments.map((p) => ({
        id: p.id,
        amountMinor: p.amountMinor,
        receivedOn: p.receivedOn,
        reference: p.reference,
        createdAt: p.createdAt.toISOString(),
      })),
      issuer: invoice.issuer,
      lines: invoice.lines,
      taxRateBasisPoints: invoice.taxRateBasisPoints,
      customer: invoice.customer,
      issuedAt: invoice.issuedAt.toISOString(),
      dueOn: invoice.kind === 'invoice' && invoice.issuer?.paymentDays !== undefined ? paymentDueOn(invoice.issuedOn, invoice.issuer.paymentDays) : null,
      rental: await this.rentalFacts(tx, invoice.rentalId),
      corrects: corrected ? { number: corrected.number, issuedOn: corrected.issuedOn } : null,
    };
  }

  /** The rental an invoice bills: its number, period and items (they do not change once the kit is back). */
  private async rentalFacts(tx: Scoped, rentalId: string): Promise<InvoiceView['rental']> {
    const view = await loadRentalView(tx, await getRental(tx, rentalId), rentalMoney);
    return {
      number: view.number,
      startsOn: view.startsOn,
      endsOn: view.endsOn,
      items: view.items.map((i) => ({ assetTag: i.assetTag, type: i.type, serialNumber: i.serialNumber, manufacturer: i.manufacturer, model: i.model })),
    };
  }

  private async money(tx: Scoped, minor: number, currency: string) {
    return firmFormat(voiceOf(await loadOrgContext(tx))).money(minor, currency);
  }

  private async render(tx: Scoped, invoice: InvoiceView) {
    const ctx = await loadOrgContext(tx);
    return { pdf: await invoicePdf({ firm: documentFirm(ctx), invoice }), number: invoice.number, kind: invoice.kind };
  }
}
