/**
 * What the rentals and billing API answers (customers, rate cards, quotes,
 * rentals, deposits, invoices, reports). Plain types, no zod: the browser
 * imports them as types only.
 */
import type { AssetType } from '../assets/vocabulary';
import type { InvoiceIssuer } from '../organizations/views';
import type { Periods } from './quote';

/** A firm that rents kit (DESIGN.md §3 "Customer"). */
export type CustomerView = {
  id: string;
  company: string;
  billingContact: string | null;
  billingEmail: string;
  address: string | null;
  taxNumber: string | null;
  notes: string | null;
};

/** Rates for an asset type, or for a whole kit (which then rents as one line). */
export type RateCardView = {
  id: string;
  assetType: AssetType | null;
  kitId: string | null;
  dayMinor: number;
  weekMinor: number;
  monthMinor: number;
  lateFeePerDayMinor: number;
};

export type QuoteLine = {
  description: string;
  assetIds: string[];
  /** Set when the line is a kit renting as one (its own rate card). */
  kitId: string | null;
  quantity: number;
  periods: Periods;
  unitMinor: number;
  amountMinor: number;
  rates: { dayMinor: number; weekMinor: number; monthMinor: number };
  lateFeePerDayMinor: number;
};

export type Quote = {
  days: number;
  startsOn: string;
  endsOn: string;
  lines: QuoteLine[];
  subtotalMinor: number;
  taxRateBasisPoints: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
  currency: string;
};

/** One card authorization. A renewal replaces an authorization with a new one; a declined attempt is kept for the record. */
export type AuthorizationState = 'authorized' | 'captured' | 'released' | 'lapsed' | 'declined' | 'replaced';
/** The rental's deposit as a whole: `none` until the card is authorized. */
export type DepositState = 'none' | 'authorized' | 'captured' | 'released' | 'lapsed' | 'declined';

export type DepositAuthorizationView = {
  id: string;
  /** The deposit's card authorization, or a charge above it on the saved card. */
  kind: 'authorization' | 'charge';
  state: AuthorizationState;
  amountMinor: number;
  capturedMinor: number;
  cardBrand: string | null;
  cardLast4: string | null;
  /** When the card network lets the authorization lapse (ISO timestamp). */
  captureBefore: string | null;
  /** Customer-initiated at checkout, or merchant-initiated renewal on the saved card. */
  initiatedBy: 'customer' | 'merchant';
  failureMessage: string | null;
  captureReason: string | null;
  createdAt: string;
  settledAt: string | null;
};

/** An incident opened against the rental's booking (damaged or missing at return), with the repair or replacement charge the clerk set (net of tax). */
export type RentalChargeView = {
  incidentId: string;
  assetId: string;
  assetTag: string;
  kind: string;
  description: string;
  amountMinor: number | null;
};

export type RentalState = 'reserved' | 'not_collected' | 'out' | 'returned' | 'invoiced' | 'cancelled';

export type InvoiceLineKind = 'rental' | 'late' | 'damage' | 'credit';
export type InvoiceLine = { kind: InvoiceLineKind; description: string; quantity: number; unitMinor: number; amountMinor: number };

/** Invoice lines from the rental, its late days and its charges, with tax; what was paid and what is left. */
export type Settlement = {
  lateDays: number;
  lines: InvoiceLine[];
  subtotalMinor: number;
  taxMinor: number;
  totalMinor: number;
  /** Late days and charges with their tax: what the deposit's card authorization is there to cover. */
  extrasGrossMinor: number;
  depositCapturedMinor: number;
  cardChargedMinor: number;
  balanceMinor: number;
};

export type InvoiceSummary = {
  id: string;
  kind: 'invoice' | 'credit_note';
  number: string;
  issuedOn: string;
  rentalId: string;
  customerId: string;
  customerCompany: string;
  correctsInvoiceId: string | null;
  correctsNumber: string | null;
  currency: string;
  subtotalMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositCapturedMinor: number;
  cardChargedMinor: number;
  balanceMinor: number;
  /** Credit notes already issued against an invoice, net (0 for credit notes). */
  creditedMinor: number;
  /** Payments recorded against an invoice (bank transfers and the like; 0 for credit notes). */
  receivedMinor: number;
  /** What the customer still owes: the balance less credit notes (with their tax) and payments received. */
  outstandingMinor: number;
  reason: string | null;
  taxRateBasisPoints: number;
};

export type InvoicePaymentView = { id: string; amountMinor: number; receivedOn: string; reference: string; createdAt: string };

export type InvoiceView = InvoiceSummary & {
  payments: InvoicePaymentView[];
  /** Who issued it: the firm's address, tax number and payment terms on the day of issue (null on invoices from before they were kept). */
  issuer: InvoiceIssuer | null;
  lines: InvoiceLine[];
  taxRateBasisPoints: number;
  customer: { company: string; billingContact: string | null; billingEmail: string; address: string | null; taxNumber: string | null };
  issuedAt: string;
  /** An invoice's due date: the issue date plus the payment days it was issued with (null for credit notes and invoices from before payment days were kept). */
  dueOn: string | null;
  /** The rental it bills: its number, period and items (with tags and serials). */
  rental: { number: string; startsOn: string; endsOn: string; items: Pick<RentalItem, 'assetTag' | 'type' | 'serialNumber' | 'manufacturer' | 'model'>[] };
  /** For a credit note, the invoice it corrects. */
  corrects: { number: string; issuedOn: string } | null;
};

/** A money event the customer was mailed about. */
export type MoneyMailEvent = 'deposit_captured' | 'deposit_released' | 'invoice_issued' | 'credit_note_issued';

/** What happened to the customer's money and the mail that told them: queued with the change, sent by the outbox. */
export type MoneyMailView = {
  id: string;
  event: MoneyMailEvent;
  /** When the change was made. */
  at: string;
  /** Captured from the card authorization, released from it, charged to the saved card (capture and release). */
  capturedMinor: number;
  releasedMinor: number;
  chargedMinor: number;
  /** The invoice or credit note (with its total) the mail carried. */
  documentNumber: string | null;
  totalMinor: number | null;
  sentTo: string[];
  /** `waiting` until the outbox has delivered it; `failed` once it gave up. */
  mail: 'waiting' | 'sent' | 'failed';
  sentAt: string | null;
};

export type RentalItem = {
  id: string;
  assetTag: string;
  type: string;
  serialNumber: string;
  model: string | null;
  manufacturer: string | null;
  replacementValueMinor: number | null;
};

export type RentalView = {
  id: string;
  number: string;
  state: RentalState;
  customer: { id: string; company: string; billingContact: string | null; billingEmail: string };
  bookingId: string;
  kit: { id: string; name: string } | null;
  items: RentalItem[];
  startsOn: string;
  endsOn: string;
  note: string | null;
  quote: Quote;
  currency: string;
  depositMinor: number;
  deposit: {
    state: DepositState;
    authorization: DepositAuthorizationView | null;
    authorizations: DepositAuthorizationView[];
    /** The latest link sent to the renter to place the authorization on the provider's hosted page. */
    request: DepositRequestView | null;
  };
  /** The renter's acceptance of the agreement on their page. */
  agreement: AgreementAcceptanceView | null;
  /** The owner let the kit go without the accepted agreement or the card authorization. */
  handoverOverride: HandoverOverrideView | null;
  checkedOutAt: string | null;
  returnedAt: string | null;
  charges: RentalChargeView[];
  settlement: Settlement;
  invoices: InvoiceSummary[];
  /** Captures, releases, invoices and credit notes the customer was mailed about, oldest first. */
  moneyMails: MoneyMailView[];
  createdAt: string;
};

/** Waiting for the renter, authorized through the hosted page, the renter's last card declined (the page still open), or the page expired. */
export type DepositRequestState = 'waiting' | 'authorized' | 'declined' | 'expired';

export type DepositRequestView = {
  id: string;
  state: DepositRequestState;
  /** The provider's hosted page; null once it can no longer be used. */
  url: string | null;
  expiresAt: string;
  sentTo: string;
  createdAt: string;
  declineMessage: string | null;
};

/** `POST /api/rentals/:id/deposit/request`: the hosted page and the renter's own page (mailed; shown once, only its hash is kept). */
export type DepositRequestReply = { url: string; expiresAt: string; renterUrl: string; renterLinkExpiresAt: string; rental: RentalView };

export type AgreementAcceptanceView = { fullName: string; acceptedAt: string; ipAddress: string; agreementSha256: string };

export type HandoverOverrideView = { reason: string; byUserId: string; at: string };

/** Whether the provider keys are test keys (the clerk's test-card shortcut exists only then). */
export type PaymentModeView = { mode: 'test' | 'live'; publishableKey: string };

/** One rented item as the renter sees it: its calibration valid-through date against the rental's last day. */
export type RenterItem = {
  assetTag: string;
  type: string;
  manufacturer: string | null;
  model: string | null;
  serialNumber: string;
  calibrationRequired: boolean;
  validThrough: string | null;
  /** Calibration not needed, or valid through the rental's last day. */
  coversRental: boolean;
};

/** The renter's own page (no sign-in; reached by the link in the mail). */
export type RenterRentalView = {
  /** The firm's name and voice: the renter's page shows dates and money as the firm writes them. */
  firm: { name: string; locale: string; timeZone: string; currency: string };
  number: string;
  state: RentalState;
  customer: { company: string; billingContact: string | null };
  startsOn: string;
  endsOn: string;
  items: RenterItem[];
  quote: Quote;
  currency: string;
  depositMinor: number;
  terms: string[];
  agreement: { sha256: string; accepted: { fullName: string; acceptedAt: string } | null };
  deposit: { state: DepositState; request: DepositRequestView | null; card: string | null };
  linkExpiresAt: string;
};

export type RentalSummary = {
  id: string;
  number: string;
  state: RentalState;
  customerId: string;
  customerCompany: string;
  kitName: string | null;
  itemCount: number;
  startsOn: string;
  endsOn: string;
  currency: string;
  totalMinor: number;
  depositMinor: number;
  depositState: DepositState;
  authorizationCaptureBefore: string | null;
  invoiceNumber: string | null;
};

export type RevenueRow = { kitId: string | null; kitName: string; month: string; revenueMinor: number };
export type UtilisationRow = { kitId: string; kitName: string; bookedDays: number; availableDays: number; ratio: number };

/** The local payment fake's test cards the clerk may pick (the provider's published test payment methods). */
export const testCards = [
  { paymentMethod: 'pm_card_visa', label: 'Visa ending 4242 — approves' },
  { paymentMethod: 'pm_card_mastercard', label: 'Mastercard ending 4444 — approves' },
  { paymentMethod: 'pm_card_chargeDeclined', label: 'Visa ending 0002 — declined' },
  { paymentMethod: 'pm_card_chargeDeclinedInsufficientFunds', label: 'Visa ending 9995 — insufficient funds' },
] as const;
