import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { InvoiceLine, InvoiceView } from '../../shared/billing/views';
import { OrgOwned } from '../db/org-owned';

/**
 * An issued invoice or credit note. Append-only (a database trigger refuses
 * updates and deletes): a mistake is corrected by a credit note, never by an edit.
 */
@Entity({ name: 'invoices' })
@Index(['organizationId', 'number'], { unique: true })
@Index(['rentalId'], { unique: true, where: `"kind" = 'invoice'` })
@Index(['organizationId', 'issuedAt'])
export class Invoice extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  kind: 'invoice' | 'credit_note';

  @Column({ type: 'text' })
  number: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  // Rentals' rows, named rather than imported: billing reads rentals and customers through server/rentals.
  @ManyToOne('Rental', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: object;

  @Column({ name: 'customer_id', type: 'uuid' })
  customerId: string;

  @ManyToOne('Customer', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'customer_id' })
  customerRow?: object;

  @Column({ name: 'corrects_invoice_id', type: 'uuid', nullable: true })
  correctsInvoiceId: string | null;

  @ManyToOne(() => Invoice, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'corrects_invoice_id' })
  corrects?: Invoice | null;

  @Column({ name: 'issued_on', type: 'date' })
  issuedOn: string;

  @Column({ name: 'issued_at', type: 'timestamptz' })
  issuedAt: Date;

  @Column({ name: 'issued_by', type: 'uuid' })
  issuedBy: string;

  @Column({ type: 'text' })
  currency: string;

  @Column({ type: 'jsonb' })
  lines: InvoiceLine[];

  @Column({ name: 'subtotal_minor', type: 'integer' })
  subtotalMinor: number;

  @Column({ name: 'tax_rate_basis_points', type: 'integer' })
  taxRateBasisPoints: number;

  @Column({ name: 'tax_minor', type: 'integer' })
  taxMinor: number;

  @Column({ name: 'total_minor', type: 'integer' })
  totalMinor: number;

  @Column({ name: 'deposit_captured_minor', type: 'integer' })
  depositCapturedMinor: number;

  @Column({ name: 'card_charged_minor', type: 'integer' })
  cardChargedMinor: number;

  @Column({ name: 'balance_minor', type: 'integer' })
  balanceMinor: number;

  /** The customer's billing details as they were on the day of issue. */
  @Column({ type: 'jsonb' })
  customer: InvoiceView['customer'];

  /** The firm's own address, tax number and payment terms as they were on the day of issue. */
  @Column({ type: 'jsonb', nullable: true })
  issuer: InvoiceView['issuer'];

  /** Why a credit note was issued. */
  @Column({ type: 'text', nullable: true })
  reason: string | null;
}

/** Money received against an invoice (a bank transfer, say). Append-only like the invoice itself. */
@Entity({ name: 'invoice_payments' })
@Index(['organizationId', 'invoiceId'])
export class InvoicePayment extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'invoice_id', type: 'uuid' })
  invoiceId: string;

  @ManyToOne(() => Invoice, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'invoice_id' })
  invoice?: Invoice;

  @Column({ name: 'amount_minor', type: 'integer' })
  amountMinor: number;

  @Column({ name: 'received_on', type: 'date' })
  receivedOn: string;

  /** The payer's reference or the bank statement line. */
  @Column({ type: 'text' })
  reference: string;

  @Column({ name: 'recorded_by', type: 'uuid' })
  recordedBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
