import { z } from 'zod';

/** Check kinds and tolerances: the part of the checks vocabulary the asset schemas need too. */
export const checkKinds = ['tip_validation', 'two_face', 'length_check'] as const;
export type CheckKind = (typeof checkKinds)[number];

export const tolerancePayload = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('fixed'), um: z.number().positive('must be more than 0').max(100_000) }),
  z.object({
    kind: z.literal('range'),
    aUm: z.number().min(0, 'cannot be negative').max(100_000),
    bUmPerM: z.number().min(0, 'cannot be negative').max(10_000),
  }),
]);

/** Starting tolerances, to be replaced with the instrument maker's figures (common practice placeholders). */
export const defaultTolerances: Record<CheckKind, z.infer<typeof tolerancePayload>> = {
  tip_validation: { kind: 'fixed', um: 60 },
  two_face: { kind: 'range', aUm: 20, bUmPerM: 8 },
  length_check: { kind: 'range', aUm: 20, bUmPerM: 8 },
};
