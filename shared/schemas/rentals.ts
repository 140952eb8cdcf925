import { z } from 'zod';
import { assetTypes } from '../assets/vocabulary';
import { calendarDate, calendarMonth, emailAddress, text } from './common';

const minor = z.number().int('must be whole minor units').min(0, 'cannot be negative').max(1e9);

export const customerPayload = z.object({
  company: text(160).min(1, 'is required'),
  billingContact: text(120).nullable().optional(),
  billingEmail: emailAddress,
  address: text(400).nullable().optional(),
  taxNumber: text(40).nullable().optional(),
  notes: text(4000).nullable().optional(),
});

export const rateCardPayload = z
  .object({
    assetType: z.enum(assetTypes).nullable().optional(),
    kitId: z.uuid('is not a kit id').nullable().optional(),
    dayMinor: minor,
    weekMinor: minor,
    monthMinor: minor,
    lateFeePerDayMinor: minor,
  })
  .refine((r) => !!r.assetType !== !!r.kitId, { message: 'give either an asset type or a kit', path: ['assetType'] });

export const quoteQuery = z
  .object({
    assetIds: z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(z.uuid('is not an asset id')).max(200)).optional(),
    kitId: z.uuid('is not a kit id').optional(),
    startsOn: calendarDate,
    endsOn: calendarDate,
    customerId: z.uuid('is not a customer id').optional(),
  })
  .refine((q) => q.startsOn <= q.endsOn, { message: 'must be on or after the start', path: ['endsOn'] })
  .refine((q) => (q.assetIds?.length ?? 0) > 0 || !!q.kitId, { message: 'pick a kit or at least one asset', path: ['assetIds'] });

export const rentalPayload = z
  .object({
    customerId: z.uuid('pick a customer'),
    kitId: z.uuid('is not a kit id').optional(),
    assetIds: z.array(z.uuid('is not an asset id')).max(200).optional(),
    startsOn: calendarDate,
    endsOn: calendarDate,
    note: text(2000).optional(),
  })
  .refine((q) => q.startsOn <= q.endsOn, { message: 'must be on or after the start', path: ['endsOn'] })
  .refine((q) => (q.assetIds?.length ?? 0) > 0 || !!q.kitId, { message: 'pick a kit or at least one asset', path: ['assetIds'] });

export const rentalListQuery = z.object({
  view: z.enum(['open', 'to_settle', 'all']).default('open'),
  customerId: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

/** A payment method made by the provider's card form (locally: one of its published test cards). Never a card number. */
export const depositPayload = z.object({
  paymentMethod: text(255).regex(/^pm_[A-Za-z0-9_]+$/, 'pick a card (a payment method id from the card form)'),
});

export const capturePayload = z.object({
  amountMinor: z.number().int('must be whole minor units').min(1, 'must be more than nothing; release the authorization instead').max(1e9),
  reason: text(500).min(3, 'say what the money is for'),
});

export const chargePayload = z.object({ amountMinor: minor });

export const creditNotePayload = z.object({
  reason: text(500).min(3, 'say why the invoice is corrected'),
  amountMinor: z.number().int('must be whole minor units').min(1, 'must be more than nothing').max(1e9).optional(),
});

export const invoicePaymentPayload = z.object({
  amountMinor: z.number().int('must be whole minor units').min(1, 'must be more than nothing').max(1e9),
  receivedOn: calendarDate,
  reference: text(200).min(2, 'say where it came from (a bank reference, say)'),
});

export const invoiceListQuery = z.object({
  kind: z.enum(['invoice', 'credit_note']).optional(),
  customerId: z.uuid().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

export const revenueQuery = z
  .object({ from: calendarMonth, to: calendarMonth })
  .refine((q) => q.from <= q.to, { message: 'must be on or after the start', path: ['to'] });
export const utilisationQuery = z
  .object({ from: calendarDate, to: calendarDate })
  .refine((q) => q.from <= q.to, { message: 'must be on or after the start', path: ['to'] });

/** The renter accepts the agreement on their page: their full name typed, the tick, and the SHA-256 of the agreement PDF they were shown. */
export const agreementAcceptancePayload = z.object({
  fullName: text(200)
    .trim()
    .min(3, 'type your full name')
    .regex(/\p{L}.*\s+.*\p{L}/u, 'type your first and last name'),
  agreed: z.literal(true, { message: 'tick the box to accept the agreement' }),
  agreementSha256: z.string().regex(/^[0-9a-f]{64}$/, 'is not the fingerprint of an agreement'),
});

/** The owner lets a rental's kit go without the accepted agreement or the card authorization, saying why. */
export const handoverOverridePayload = z.object({
  reason: text(500).trim().min(10, 'say why the kit may go out without them (at least a few words)'),
});
