import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';

/** A firm that rents kit (DESIGN.md §3 "Customer"). */
@Entity({ name: 'customers' })
@Index(['organizationId', 'company'], { unique: true })
export class Customer extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  company: string;

  @Column({ name: 'billing_contact', type: 'text', nullable: true })
  billingContact: string | null;

  @Column({ name: 'billing_email', type: 'text' })
  billingEmail: string;

  @Column({ type: 'text', nullable: true })
  address: string | null;

  @Column({ name: 'tax_number', type: 'text', nullable: true })
  taxNumber: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  /** The customer's record with the payment provider, made at their first deposit. */
  @Column({ name: 'payment_customer_id', type: 'text', nullable: true })
  paymentCustomerId: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
