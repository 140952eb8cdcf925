/**
 * Decision rules (ILAC-G8:09/2019). Simple acceptance: pass when the result is
 * within the tolerance limit. Guarded acceptance: the acceptance limit is the
 * tolerance limit less a guard band w = U (expanded uncertainty, k = 2); a
 * result inside the guard band does not pass.
 */
export type DecisionRule = 'simple' | 'guarded';
export type Decision = 'pass' | 'fail';

export function decide(resultUm: number, toleranceUm: number, rule: DecisionRule, expandedUncertaintyUm = 0) {
  const guardBandUm = rule === 'guarded' ? expandedUncertaintyUm : 0;
  const acceptanceLimitUm = toleranceUm - guardBandUm;
  const decision: Decision = Math.abs(resultUm) <= acceptanceLimitUm ? 'pass' : 'fail';
  return { decision, guardBandUm, acceptanceLimitUm };
}
