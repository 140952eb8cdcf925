import { z } from 'zod';
import { MIN_TIP_READINGS } from '../checks/tip-validation';
import { tipPositions } from './assets';
import { checkKinds, type CheckKind } from './check-kinds';
import { instant, text } from './common';

export { checkKinds, defaultTolerances, tolerancePayload, type CheckKind } from './check-kinds';
export * from '../checks/vocabulary';

const coordinate = z
  .number({ message: 'must be a number (mm)' })
  .refine(Number.isFinite, 'must be a finite number')
  .refine((v) => Math.abs(v) < 1e6, 'is beyond a kilometre from the tracker');
export const pointPayload = z.object({ x: coordinate, y: coordinate, z: coordinate });

const common = {
  /** Made on the phone when the check is recorded: the record's id and its idempotency key (a resend returns the stored check). */
  id: z.uuid('is not a record id (UUID)').optional(),
  assetId: z.uuid('is not an asset id'),
  distanceM: z.number().min(0, 'cannot be negative').max(200, 'is beyond 200 m').nullable().optional(),
  /** Overrides the tolerance that settings and the asset give, for this check only. */
  toleranceUm: z.number().positive('must be more than 0').max(100_000).nullable().optional(),
  /** Expanded uncertainty U (k = 2), when already known. */
  uncertaintyUm: z.number().min(0, 'cannot be negative').max(100_000).nullable().optional(),
  /** Standard uncertainties to combine by root sum of squares (then U = 2·u). */
  uncertaintyComponentsUm: z.array(z.number().min(0, 'cannot be negative').max(100_000)).max(20).optional(),
  performedAt: instant.optional(),
  note: text(2000).nullable().optional(),
};

export const checkPayload = z
  .discriminatedUnion(
    'kind',
    [
      z.object({
        kind: z.literal('tip_validation'),
        ...common,
        probeId: z.uuid('is not an asset id').nullable().optional(),
        position: z.enum(tipPositions, { message: `must be ${tipPositions.join(' or ')}` }),
        reference: pointPayload,
        readings: z.array(pointPayload).min(MIN_TIP_READINGS, `needs at least ${MIN_TIP_READINGS} readings`).max(20, 'takes at most 20 readings'),
      }),
      z.object({ kind: z.literal('two_face'), ...common, front: pointPayload, back: pointPayload }),
      z.object({
        kind: z.literal('length_check'),
        ...common,
        scaleBarId: z.uuid('is not an asset id'),
        endA: pointPayload,
        endB: pointPayload,
        temperatureC: z.number({ message: 'must be a number (°C)' }).min(-30, 'is below −30 °C').max(60, 'is above 60 °C'),
      }),
    ],
    { message: `kind must be one of ${checkKinds.join(', ')}` },
  )
  .refine((c) => !(c.uncertaintyUm != null && c.uncertaintyComponentsUm?.length), {
    message: 'give either the expanded uncertainty or its components, not both',
    path: ['uncertaintyUm'],
  });
export type CheckPayload = z.infer<typeof checkPayload>;

export const checkListQuery = z.object({
  assetId: z.uuid().optional(),
  kind: z.enum(checkKinds).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});
