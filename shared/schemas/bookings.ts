import { z } from 'zod';
import { assetTypes } from '../assets/vocabulary';
import { tolerancePayload } from './check-kinds';
import { calendarDate, emailAddress, text } from './common';

/** `not_collected`: a reservation whose days passed without checkout; it no longer holds its items. */
export const bookingStates = ['reserved', 'out', 'returned', 'cancelled', 'not_collected'] as const;
export type BookingState = (typeof bookingStates)[number];
/** `internal`: the firm's own use without a job record (training, demos). */
export const bookingPurposes = ['job', 'rental', 'lab', 'internal'] as const;
export type BookingPurpose = (typeof bookingPurposes)[number];

const MAX_DAYS = 400;

type DateRange = { startsOn: string; endsOn: string };
const dates = <T extends z.ZodRawShape>(shape: T) =>
  z
    .object({ startsOn: calendarDate, endsOn: calendarDate, ...shape })
    .refine((b) => (b as DateRange).startsOn <= (b as DateRange).endsOn, { message: 'must be on or after the start', path: ['endsOn'] })
    .refine((b) => (Date.parse((b as DateRange).endsOn) - Date.parse((b as DateRange).startsOn)) / 86_400_000 < MAX_DAYS, {
      message: `a booking may span at most ${MAX_DAYS} days`,
      path: ['endsOn'],
    });

export const bookingPayload = dates({
  assetIds: z.array(z.uuid('is not an asset id')).max(200).optional(),
  kitId: z.uuid('is not a kit id').optional(),
  jobId: z.uuid('is not a job id').optional(),
  rentalId: z.uuid('is not a rental id').optional(),
  note: text(2000).optional(),
  /** The owner records past use (a firm starting with Nestkeeper): every day before today, kept as history. */
  history: z.boolean().optional(),
}).refine((b) => (b.assetIds?.length ?? 0) > 0 || !!b.kitId, { message: 'pick a kit or at least one asset', path: ['assetIds'] });
export type BookingPayload = z.infer<typeof bookingPayload>;

export const bookingDatesPayload = dates({ note: text(2000).optional() });

/** Add, remove or swap items of a reserved booking (a swap is one of each). */
export const bookingItemsPayload = z
  .object({
    add: z.array(z.uuid('is not an asset id')).max(200).default([]),
    remove: z.array(z.uuid('is not an asset id')).max(200).default([]),
  })
  .refine((b) => b.add.length + b.remove.length > 0, { message: 'add or remove at least one item', path: ['add'] });

export const checklistPayload = z.object({
  checklist: z
    .array(
      z.object({
        assetId: z.uuid('is not an asset id'),
        present: z.boolean({ message: 'tick present or not' }),
        condition: z.enum(['good', 'worn', 'damaged'], { message: 'must be good, worn or damaged' }),
        note: text(1000).optional(),
      }),
    )
    .min(1, 'walk the packing list'),
  /** Who takes the kit (checkout) or brings it back (return): a person's name or a user id. */
  counterpart: text(120).min(2, 'say who takes or brings the kit'),
  /** Checkout only: why the kit goes before the checkout window opens (recorded). */
  earlyReason: text(1000).min(3, 'say why the kit goes early').optional(),
  /** Checkout only, for a reservation not collected: why it goes late, and the new last day. */
  late: z.object({ note: text(1000).min(3, 'say why the kit goes late'), endsOn: calendarDate }).optional(),
});

/** Photos of damage one return may carry in all (each incident keeps at most MAX_INCIDENT_PHOTOS). */
export const MAX_RETURN_PHOTOS = 12;

/** A multipart form's fields are text: the checklist arrives as JSON there, the photos' items as a comma-separated list. */
const jsonIfText = (v: unknown) => {
  if (typeof v !== 'string') return v;
  try {
    return JSON.parse(v) as unknown;
  } catch {
    return v;
  }
};
const listIfText = (v: unknown) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v);

/** A return (JSON, or multipart with `photos`): `photoAssetIds` names, in order, the item each photo shows (a damaged or missing one). */
export const returnPayload = checklistPayload.omit({ earlyReason: true, late: true }).extend({
  checklist: z.preprocess(jsonIfText, checklistPayload.shape.checklist),
  photoAssetIds: z.preprocess(listIfText, z.array(z.uuid('is not an asset id')).max(MAX_RETURN_PHOTOS)).optional(),
});

export const bookingListQuery = z.object({
  from: calendarDate.optional(),
  to: calendarDate.optional(),
  assetId: z.uuid().optional(),
  kitId: z.uuid().optional(),
  jobId: z.uuid().optional(),
  state: z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(z.enum(bookingStates))).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(200),
  offset: z.coerce.number().int().min(0).default(0),
});

export const availabilityQuery = z
  .object({
    type: z.enum(assetTypes, { message: `must be one of ${assetTypes.join(', ')}` }).optional(),
    startsOn: calendarDate,
    endsOn: calendarDate,
    limit: z.coerce.number().int().min(1).max(500).default(100),
  })
  .refine((b) => b.startsOn <= b.endsOn, { message: 'must be on or after the start', path: ['endsOn'] });

/** A job's tightest feature tolerance: ± µm, or A + B·L with the distance the job measured at. */
export const jobTolerancePayload = z
  .object({
    tolerance: tolerancePayload,
    distanceM: z.number().min(0, 'cannot be negative').max(1000, 'is beyond a kilometre').nullable().optional(),
    note: text(200).nullable().optional(),
  })
  .refine((t) => t.tolerance.kind === 'fixed' || t.distanceM != null, { message: 'is needed for an A + B·L tolerance', path: ['distanceM'] });

export const jobPayload = z
  .object({
    reference: text(40).min(1, 'is required'),
    customerName: text(120).min(1, 'is required'),
    contactName: text(120).nullable().optional(),
    contactEmail: emailAddress
      .nullable()
      .optional()
      .or(z.literal('').transform(() => null)),
    siteAddress: text(400).nullable().optional(),
    startsOn: calendarDate,
    endsOn: calendarDate,
    leadTechnicianId: z.uuid('is not a user id').nullable().optional(),
    notes: text(4000).nullable().optional(),
    tightestTolerance: jobTolerancePayload.nullable().optional(),
  })
  .refine((b) => b.startsOn <= b.endsOn, { message: 'must be on or after the start', path: ['endsOn'] });
