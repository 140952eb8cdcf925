import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

import type { IntervalPolicy } from '../../shared/calibration/interval-review';
import type { DecisionRule } from '../../shared/checks/decision';
import type { Tolerance } from '../../shared/checks/tolerance';
import type { CalibrationProvider, DepositPolicy, InvoiceIssuer } from '../../shared/organizations/views';
import type { CheckKind } from '../../shared/schemas/checks';

export type OrganizationSettings = {
  /** BCP 47 locale for dates, numbers and money (shared/formatting). */
  locale: string;
  /** Reply-To of the firm's mails. */
  mailReplyTo: string;
  dueSoonDays: number;
  checkoutOpensDaysBefore: number;
  decisionRule: DecisionRule;
  /** Impact triage: an as-found error within tolerance ÷ this ratio suggests "no effect likely". */
  triageRatio: number;
  /** Default tolerance per check kind; an asset may override it. */
  tolerances: Partial<Record<CheckKind, Tolerance>>;
  /** Calibration providers and their usual turnaround in days. */
  providers: CalibrationProvider[];
  intervalPolicy: IntervalPolicy;
  /** Tax on rentals in basis points (1 900 = 19 %). */
  taxRateBasisPoints: number;
  depositPolicy: DepositPolicy;
  /** The firm as it must appear on its invoices: address, tax number, how to pay. */
  issuer: Partial<InvoiceIssuer>;
  /** Owners and billing clerks must sign in with a second step; auth's per-request check reads this key too. */
  secondStepRequired: boolean;
};

@Entity({ name: 'organizations' })
export class Organization {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  /** IANA zone; dates are calendar dates in this zone (DESIGN.md §5). */
  @Column({ name: 'time_zone', type: 'text', default: 'UTC' })
  timeZone: string;

  /** ISO 4217 code. */
  @Column({ type: 'char', length: 3, default: 'EUR' })
  currency: string;

  @Column({ type: 'jsonb' })
  settings: Partial<OrganizationSettings> = {};

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
