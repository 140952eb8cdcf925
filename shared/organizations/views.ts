/** What the settings API answers. Plain types, no zod: the browser imports them as types only. */
import type { IntervalPolicy } from '../calibration/interval-review';
import type { DecisionRule } from '../checks/decision';
import type { Tolerance } from '../checks/tolerance';
import type { CheckKind } from '../schemas/check-kinds';

/** A calibration lab the firm sends items to, and its usual turnaround (whole days, 1–180). */
export type CalibrationProvider = { name: string; turnaroundDays: number };

/** How rental deposits are worked out: a percentage of the replacement value, kept between a minimum and a maximum. */
export type DepositPolicy = { percent: number; minMinor: number; maxMinor: number };

/** What every invoice must say about who issues it; kept on each invoice as it was on the day of issue. */
export type InvoiceIssuer = {
  address: string;
  taxNumber: string;
  /** The words printed under "How to pay". */
  paymentTerms: string;
  /** Days from the invoice date to its due date (0 = due on receipt). */
  paymentDays: number;
  /** Bank details printed on every invoice (account holder, IBAN, BIC or the local equivalent). */
  bankDetails: string;
};

/** `GET /api/settings`: the firm's settings, each with its default filled in. */
export type OrganizationSettingsView = {
  name: string;
  /** The firm's locale (dates, numbers, money on screens, mails, PDFs). */
  locale: string;
  /** IANA time zone; the firm's calendar and clock. */
  timeZone: string;
  currency: string;
  /** Where replies to the firm's mails go (Reply-To); empty means the sending address. */
  mailReplyTo: string;
  /** Days before the due date an item counts as "due soon". */
  dueSoonDays: number;
  /** How many days before a booking starts its checkout opens; earlier needs a reason (default 1). */
  checkoutOpensDaysBefore: number;
  /** ILAC-G8 decision rule for field checks. */
  decisionRule: DecisionRule;
  /** Impact triage: an as-found error within a job's tolerance ÷ this ratio suggests "no effect likely" (default 4, common practice). */
  triageRatio: number;
  /** The firm's tolerance per check kind. */
  tolerances: Record<CheckKind, Tolerance>;
  /** Tax on rentals in basis points (1 % = 100). */
  taxRateBasisPoints: number;
  depositPolicy: DepositPolicy;
  /** Calibration providers and their turnaround; the window finder uses 14 days for a provider not listed. */
  providers: CalibrationProvider[];
  /** The staircase interval review (OIML D 10 / ILAC-G24). */
  intervalPolicy: IntervalPolicy;
  /** The firm as its invoices name it. */
  issuer: InvoiceIssuer;
  /** Owners and billing clerks must sign in with a second step (TOTP). */
  secondStepRequired: boolean;
};
