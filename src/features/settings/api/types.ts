import type { IntervalPolicy } from '../../../../shared/calibration/interval-review';
import type { CheckKind, DecisionRule, Tolerance } from '../../../lib/checks';

export type { IntervalPolicy } from '../../../../shared/calibration/interval-review';

/** A calibration lab the firm sends items to, and its usual turnaround. */
export interface CalibrationProvider {
  name: string;
  /** Whole days, 1–180. The window finder uses 14 days for a provider not listed. */
  turnaroundDays: number;
}

/** How rental deposits are worked out: a percentage of the replacement value, kept between a minimum and a maximum. */
export interface DepositPolicy {
  percent: number;
  minMinor: number;
  maxMinor: number;
}

export interface OrganizationSettings {
  /** Days before the due date an item counts as "due soon". */
  dueSoonDays: number;
  timeZone: string;
  currency: string;
  name: string;
  /** ILAC-G8 decision rule for field checks (absent from servers before field checks). */
  decisionRule?: DecisionRule;
  /** The firm's tolerance per check kind. */
  tolerances?: Record<CheckKind, Tolerance>;
  /** Calibration providers and their turnaround (absent from servers before lab planning). */
  providers?: CalibrationProvider[];
  /** The staircase interval review (OIML D 10 / ILAC-G24) settings (absent from older servers). */
  intervalPolicy?: IntervalPolicy;
  /** Tax on rentals in basis points (1 % = 100). */
  taxRateBasisPoints?: number;
  depositPolicy?: DepositPolicy;
  /** The firm as its invoices name it (absent from older servers). */
  issuer?: InvoiceIssuer;
}

/** What every invoice must say about who issues it; kept on each invoice as it was on the day of issue. */
export interface InvoiceIssuer {
  address: string;
  taxNumber: string;
  paymentTerms: string;
}
