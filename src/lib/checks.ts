/**
 * The field-check computations, the same pure functions the server decides
 * with (shared/checks/*), so a form can preview exactly what will be stored.
 * Only zod-free modules here: the browser bundle must not pull in the schemas.
 */
export { tipValidation, MIN_TIP_READINGS, DEFAULT_TIP_READINGS } from '../../shared/checks/tip-validation';
export { twoFaceErrorUm } from '../../shared/checks/two-face';
export { lengthCheck, expectedLengthMm, REFERENCE_TEMPERATURE_C } from '../../shared/checks/length-check';
export { toleranceUm } from '../../shared/checks/tolerance';
export type { Tolerance } from '../../shared/checks/tolerance';
export { expandedUncertainty, COVERAGE_FACTOR } from '../../shared/checks/uncertainty';
export { decide } from '../../shared/checks/decision';
export type { Decision, DecisionRule } from '../../shared/checks/decision';
export type { Point } from '../../shared/checks/geometry';
import type { CheckKind } from '../../shared/schemas/check-kinds';

export type { CheckKind };

/** The check kinds in words (settings and the checks screens both use them); the keys are the kinds, in order. */
export const checkKindWords: Record<CheckKind, string> = {
  tip_validation: 'Tip validation',
  two_face: 'Two-face check',
  length_check: 'Length check',
};
