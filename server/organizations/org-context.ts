import { DEFAULT_LOCALE, firmFormat } from '../../shared/formatting/firm-format';
import { DEFAULT_DUE_SOON_DAYS, todayIn } from '../../shared/calibration/due-date';
import { DEFAULT_TRIAGE_RATIO } from '../../shared/calibration/triage';
import { defaultIntervalPolicy, type IntervalPolicy } from '../../shared/calibration/interval-review';
import type { DecisionRule } from '../../shared/checks/decision';
import type { Tolerance } from '../../shared/checks/tolerance';
import type { CalibrationProvider, DepositPolicy, InvoiceIssuer } from '../../shared/organizations/views';
import { defaultTolerances, type CheckKind } from '../../shared/schemas/checks';
import type { Scoped } from '../db/scoped';
import type { Organization } from './organization.entity';

/** The organization facts most rules need: its calendar "today", due-soon window, currency. */
export type OrgContext = {
  id: string;
  name: string;
  locale: string;
  timeZone: string;
  mailReplyTo: string;
  currency: string;
  dueSoonDays: number;
  checkoutOpensDaysBefore: number;
  today: string;
  decisionRule: DecisionRule;
  triageRatio: number;
  tolerances: Record<CheckKind, Tolerance>;
  providers: CalibrationProvider[];
  intervalPolicy: IntervalPolicy;
  taxRateBasisPoints: number;
  depositPolicy: DepositPolicy;
  issuer: InvoiceIssuer;
  secondStepRequired: boolean;
};

/** Turnaround when a provider is not in the settings (common practice: about two weeks). */
export const DEFAULT_TURNAROUND_DAYS = 14;

/** Checkout opens the day before a booking starts unless the firm sets otherwise (common practice: pack the evening before). */
export const DEFAULT_CHECKOUT_OPENS_DAYS_BEFORE = 1;

/** Days' credit on an invoice when the firm has not set its own (common practice). */
export const DEFAULT_PAYMENT_DAYS = 30;

/** The firm's voice for formatting (shared/formatting). */
export const voiceOf = (ctx: Pick<OrgContext, 'locale' | 'timeZone' | 'currency'>) => ({ locale: ctx.locale, timeZone: ctx.timeZone, currency: ctx.currency });

/** The firm's format for what the server writes (documents, refusals): no reader's zone is known, so times name the firm's zone. */
export const formatOf = (ctx: Pick<OrgContext, 'locale' | 'timeZone' | 'currency'>) => firmFormat(voiceOf(ctx));

/** The firm as its documents name it: its name and its format (documents/document-layout.ts `DocumentFirm`). */
export const documentFirm = (ctx: OrgContext) => ({ name: ctx.name, format: formatOf(ctx) });

/** The firm's format for a refusal or notice, read in the caller's transaction. */
export const loadFirmFormat = async (tx: Scoped) => formatOf(await loadOrgContext(tx));

export async function loadOrgContext(tx: Scoped, now: Date = new Date()): Promise<OrgContext> {
  const [org] = await tx.sql<Pick<Organization, 'name' | 'currency' | 'settings'> & { time_zone: string }>(
    `SELECT name, time_zone, currency, settings FROM organizations WHERE id = $1`,
  );
  return {
    id: tx.organizationId,
    name: org.name,
    locale: org.settings.locale ?? DEFAULT_LOCALE,
    timeZone: org.time_zone,
    mailReplyTo: org.settings.mailReplyTo ?? '',
    currency: org.currency,
    dueSoonDays: org.settings.dueSoonDays ?? DEFAULT_DUE_SOON_DAYS,
    checkoutOpensDaysBefore: org.settings.checkoutOpensDaysBefore ?? DEFAULT_CHECKOUT_OPENS_DAYS_BEFORE,
    today: todayIn(org.time_zone, now),
    decisionRule: org.settings.decisionRule ?? 'simple',
    triageRatio: org.settings.triageRatio ?? DEFAULT_TRIAGE_RATIO,
    tolerances: { ...defaultTolerances, ...org.settings.tolerances },
    providers: org.settings.providers ?? [],
    intervalPolicy: { ...defaultIntervalPolicy, ...org.settings.intervalPolicy },
    taxRateBasisPoints: org.settings.taxRateBasisPoints ?? 0,
    // Common practice starting point: a tenth of the replacement value, within sensible bounds.
    depositPolicy: org.settings.depositPolicy ?? { percent: 10, minMinor: 50_000, maxMinor: 2_500_000 },
    // Common practice: 30 days' credit when a firm has not said otherwise.
    issuer: { address: '', taxNumber: '', paymentTerms: '', paymentDays: DEFAULT_PAYMENT_DAYS, bankDetails: '', ...org.settings.issuer },
    secondStepRequired: org.settings.secondStepRequired ?? false,
  };
}
