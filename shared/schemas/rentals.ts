import { z } from 'zod';
import { assetTypes } from '../assets/vocabulary';

const minor = z.number().int('must be whole minor units').min(0, 'cannot be negative').max(1e9);
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD');

export const customerPayload = z.object({
  company: z.string().trim().min(1, 'is required').max(160),
  billingContact: z.string().trim().max(120).nullable().optional(),
  billingEmail: z.string().trim().toLowerCase().email('is not an e-mail address'),
  address: z.string().trim().max(400).nullable().optional(),
  taxNumber: z.string().trim().max(40).nullable().optional(),
  notes: z.string().trim().max(4000).nullable().optional(),
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
    startsOn: isoDate,
    endsOn: isoDate,
    customerId: z.uuid('is not a customer id').optional(),
  })
  .refine((q) => q.startsOn <= q.endsOn, { message: 'must be on or after the start', path: ['endsOn'] })
  .refine((q) => (q.assetIds?.length ?? 0) > 0 || !!q.kitId, { message: 'pick a kit or at least one asset', path: ['assetIds'] });
