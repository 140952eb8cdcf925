import type { CheckKind } from '../schemas/check-kinds';

/** Check words without zod, for the browser too. */
export const checkKindTitles: Record<CheckKind, string> = {
  tip_validation: 'Tip validation',
  two_face: 'Two-face check',
  length_check: 'Length check',
};

/** Which asset type each check is about. */
export const checkSubjectType = { tip_validation: 'tip', two_face: 'tracker', length_check: 'tracker' } as const;
