import { z } from 'zod';
import { calibrationStates } from '../calibration/due-date';
import { calendarDate, emailAddress, text } from './common';
import { firmLocales, isTimeZoneName } from '../formatting/firm-format';
import { checkKinds, tolerancePayload } from './check-kinds';
import { assetSortFields, assetStatuses, assetTypes, tipPositions, typesWithFirmware, type AssetType } from '../assets/vocabulary';

export * from '../assets/vocabulary';

const positiveMm = z.number({ message: 'must be a number' }).positive('must be more than 0').max(100_000, 'is implausibly large');

/** Type-specific facts, validated per type. Unknown keys are refused so typos do not pass silently. */
export const specsByType = {
  tip: z
    .object({
      lengthMm: positiveMm,
      positions: z
        .array(z.enum(tipPositions))
        .min(1, 'needs at least one mounting position')
        .refine((p) => new Set(p).size === p.length, 'lists a position twice'),
    })
    .strict(),
  battery: z
    .object({
      nominalVoltageV: z.number({ message: 'must be a number' }).positive('must be more than 0').max(1000, 'is implausibly high'),
      ratedCapacityAh: z.number({ message: 'must be a number' }).positive('must be more than 0').max(1000, 'is implausibly high'),
      chargeCycles: z.number({ message: 'must be a number' }).int('must be a whole number').min(0, 'cannot be negative').optional(),
      damaged: z.boolean().optional(),
    })
    .strict(),
  smr: z.object({ diameterMm: positiveMm }).strict(),
  reference_sphere: z.object({ diameterMm: positiveMm }).strict(),
  scale_bar: z
    .object({
      certifiedLengthMm: positiveMm,
      expansionPpmPerK: z.number({ message: 'must be a number' }).min(-50, 'is outside −50…100 µm/(m·K)').max(100, 'is outside −50…100 µm/(m·K)'),
    })
    .strict(),
  tracker: z.object({ laserClass: text(20).optional(), maxRangeM: z.number().positive().optional() }).strict(),
  controller: z.object({}).strict(),
  probe: z.object({}).strict(),
  nest: z.object({ sizeMm: positiveMm.optional() }).strict(),
  weather_station: z.object({}).strict(),
  case: z.object({ massKg: z.number().positive().max(500).optional() }).strict(),
  accessory: z.object({}).strict(),
} satisfies Record<AssetType, z.ZodType>;

export type AssetSpecs = { [T in AssetType]: z.infer<(typeof specsByType)[T]> };

const optionalText = (max: number) => text(max).nullable().optional();

export const calibrationPlanPayload = z
  .object({
    required: z.boolean(),
    intervalMonths: z
      .number()
      .int('must be a whole number of months')
      .min(1, 'must be at least 1 month')
      .max(120, 'must be at most 120 months')
      .nullable()
      .optional(),
    provider: optionalText(120),
    lastCalibratedOn: calendarDate.nullable().optional(),
  })
  .refine((p) => !p.required || !!p.intervalMonths, { message: 'is needed when calibration is required', path: ['intervalMonths'] });

const assetFields = {
  assetTag: text(40)
    .min(1, 'is required')
    .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]*$/, 'may use letters, digits and . _ - / only'),
  serialNumber: text(80).min(1, 'is required'),
  manufacturer: optionalText(80),
  model: optionalText(80),
  firmwareVersion: optionalText(40),
  rfidTag: text(64)
    .regex(/^[A-Za-z0-9:\-]*$/, 'may use letters, digits, : and - only')
    .nullable()
    .optional(),
  location: optionalText(120),
  replacementValueMinor: z.number().int('must be whole minor units').min(0, 'cannot be negative').max(1e12).nullable().optional(),
  notes: optionalText(4000),
  calibration: calibrationPlanPayload.optional(),
  specs: z.record(z.string(), z.unknown()).optional(),
  /** Tolerances for this item's checks, replacing the firm's defaults. */
  toleranceOverrides: z.partialRecord(z.enum(checkKinds), tolerancePayload).nullable().optional(),
};

/** Checks across fields: specs per type, RFID only on tips, firmware only where it exists. */
function checkTypeRules(
  value: { type: AssetType; specs?: Record<string, unknown>; rfidTag?: string | null; firmwareVersion?: string | null },
  ctx: z.RefinementCtx,
) {
  const specs = specsByType[value.type].safeParse(value.specs ?? {});
  if (!specs.success) for (const issue of specs.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: ['specs', ...issue.path] });
  if (value.rfidTag && value.type !== 'tip') ctx.addIssue({ code: 'custom', message: 'is only for probe tips', path: ['rfidTag'] });
  if (value.firmwareVersion && !typesWithFirmware.includes(value.type))
    ctx.addIssue({ code: 'custom', message: 'is only for trackers, controllers and probes', path: ['firmwareVersion'] });
}

export const createAssetPayload = z
  .object({ type: z.enum(assetTypes, { message: `must be one of ${assetTypes.join(', ')}` }), ...assetFields })
  .superRefine(checkTypeRules);
export type CreateAssetPayload = z.infer<typeof createAssetPayload>;

/** Every field optional; the type of an asset does not change once registered. */
export const updateAssetPayload = z
  .object({ ...assetFields, assetTag: assetFields.assetTag.optional(), serialNumber: assetFields.serialNumber.optional() })
  .strict();
export type UpdateAssetPayload = z.infer<typeof updateAssetPayload>;

export const retireAssetPayload = z.object({ reason: text(500).min(3, 'say briefly why') });

const listOf = <T extends z.ZodType>(item: T) => z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(item)).optional();

export const assetListQuery = z.object({
  q: text(100).optional(),
  type: listOf(z.enum(assetTypes)),
  status: listOf(z.enum(assetStatuses)),
  calibration: listOf(z.enum(calibrationStates as [string, ...string[]])),
  kitId: z.union([z.uuid('is not a kit id'), z.literal('none')]).optional(),
  sort: z
    .string()
    .regex(new RegExp(`^-?(${assetSortFields.join('|')})$`), `must be one of ${assetSortFields.join(', ')} (prefix - for descending)`)
    .optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
export type AssetListQuery = z.infer<typeof assetListQuery>;

export const kitPayload = z.object({
  name: text(80).min(1, 'is required'),
  notes: optionalText(2000),
  memberIds: z.array(z.uuid('is not an asset id')).max(200).optional(),
});
export const updateKitPayload = kitPayload.partial().strict();

export const organizationSettingsPayload = z
  .object({
    decisionRule: z.enum(['simple', 'guarded'], { message: 'must be simple or guarded' }),
    taxRateBasisPoints: z.number().int('must be whole basis points').min(0).max(10_000),
    providers: z.array(z.object({ name: text(120).min(1, 'is required'), turnaroundDays: z.number().int('must be whole days').min(1).max(180) })).max(50),
    intervalPolicy: z
      .object({
        lengthenAfter: z.number().int().min(1).max(10),
        lengthenFactor: z.number().min(1, 'lengthening needs a factor of at least 1').max(3),
        shortenFactor: z.number().gt(0).max(1, 'shortening needs a factor of at most 1'),
        minMonths: z.number().int().min(1).max(120),
        maxMonths: z.number().int().min(1).max(120),
      })
      .refine((p) => p.minMonths <= p.maxMonths, { message: 'the shortest interval must not exceed the longest', path: ['maxMonths'] }),
    depositPolicy: z
      .object({ percent: z.number().min(0).max(100), minMinor: z.number().int().min(0), maxMinor: z.number().int().min(0) })
      .refine((p) => p.minMinor <= p.maxMinor, { message: 'the minimum must not exceed the maximum', path: ['maxMinor'] }),
    tolerances: z.partialRecord(z.enum(checkKinds), tolerancePayload),
    issuer: z.object({
      address: text(400),
      taxNumber: text(40),
      paymentTerms: text(600),
      paymentDays: z.number().int('must be whole days').min(0, 'must be 0 or more days').max(365, 'must be at most 365 days').optional(),
      bankDetails: text(600).optional(),
    }),
    locale: z.enum(firmLocales, { message: `must be one of ${firmLocales.join(', ')}` }),
    mailReplyTo: z.union([z.literal(''), emailAddress]),
    triageRatio: z.number({ message: 'must be a number' }).min(1, 'must be at least 1 (1:1)').max(20, 'must be at most 20 (20:1)'),
    dueSoonDays: z.number().int().min(1, 'must be at least 1 day').max(365, 'must be at most 365 days'),
    /** Owners and billing clerks must sign in with a second step (TOTP). */
    secondStepRequired: z.boolean(),
    checkoutOpensDaysBefore: z.number().int('must be whole days').min(0, 'must be 0 or more days').max(365, 'must be at most 365 days'),
    timeZone: text(64).refine(isTimeZoneName, 'is not a time zone from the IANA list, like Europe/Berlin or America/Chicago'),
  })
  .partial()
  .strict();
