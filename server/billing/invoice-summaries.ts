import type { InvoiceSummary } from '../../shared/billing/views';
import type { Invoice, InvoicePayment } from './invoice.entity';

/**
 * Invoices of a rental, each with what credit notes took off it and what was
 * received against it; what is outstanding follows from those.
 */
export function invoiceSummaries(
  invoices: Invoice[],
  customerCompany: string,
  payments: Pick<InvoicePayment, 'invoiceId' | 'amountMinor'>[],
): InvoiceSummary[] {
  const byId = new Map(invoices.map((i) => [i.id, i]));
  return invoices.map((i) => {
    const credits = invoices.filter((c) => c.correctsInvoiceId === i.id);
    const receivedMinor = payments.filter((p) => p.invoiceId === i.id).reduce((s, p) => s + p.amountMinor, 0);
    return {
      id: i.id,
      kind: i.kind,
      number: i.number,
      issuedOn: i.issuedOn,
      rentalId: i.rentalId,
      customerId: i.customerId,
      customerCompany,
      correctsInvoiceId: i.correctsInvoiceId,
      correctsNumber: i.correctsInvoiceId ? (byId.get(i.correctsInvoiceId)?.number ?? null) : null,
      currency: i.currency,
      subtotalMinor: i.subtotalMinor,
      taxMinor: i.taxMinor,
      totalMinor: i.totalMinor,
      depositCapturedMinor: i.depositCapturedMinor,
      cardChargedMinor: i.cardChargedMinor,
      balanceMinor: i.balanceMinor,
      creditedMinor: credits.reduce((s, c) => s + c.subtotalMinor, 0),
      receivedMinor,
      outstandingMinor: i.kind === 'invoice' ? i.balanceMinor - credits.reduce((s, c) => s + c.totalMinor, 0) - receivedMinor : 0,
      reason: i.reason,
      taxRateBasisPoints: i.taxRateBasisPoints,
    };
  });
}
