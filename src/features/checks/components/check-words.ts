import type { AssetType, TipPosition } from '../../../lib/assets';
import type { CheckKind, DecisionRule, Tolerance } from '../../../lib/checks';
import { formatNumber } from '../../../lib/format';
import type { TipValidationState } from '../../../../shared/checks/views';

export { checkKindWords } from '../../../lib/checks';

export const positionWords: Record<TipPosition, string> = { vertical: 'Vertical', horizontal: 'Horizontal' };

export const tipStateWords: Record<TipValidationState, string> = {
  validated: 'Validated',
  not_validated: 'Not validated',
  failed: 'Failed',
};

export const decisionRuleWords: Record<DecisionRule, string> = {
  simple: 'simple acceptance',
  guarded: 'guarded acceptance (guard band = U)',
};

/** The checks that fit an item: tips are validated; trackers get two-face and length checks. */
export function checkKindsFor(type: AssetType): CheckKind[] {
  if (type === 'tip') return ['tip_validation'];
  if (type === 'tracker') return ['two_face', 'length_check'];
  return [];
}

export function toleranceText(tolerance: Tolerance): string {
  return tolerance.kind === 'fixed'
    ? `${formatNumber(tolerance.um)} µm`
    : `${formatNumber(tolerance.aUm)} µm + ${formatNumber(tolerance.bUmPerM)} µm/m × distance`;
}

/** µm with one decimal, as the server reports them. */
export const um = (value: number) => `${formatNumber(value, 1)} µm`;
