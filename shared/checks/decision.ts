import { roundUm, tenthsOfUm, TENTHS_PER_UM } from './rounding';

/**
 * Decision rules (ILAC-G8:09/2019). Simple acceptance: pass when the result is
 * within the tolerance limit, a result equal to the limit included. Guarded
 * acceptance: the acceptance limit is the tolerance limit less a guard band
 * w = U (expanded uncertainty, k = 2, JCGM 100:2008); a result inside the guard
 * band does not pass, one equal to the acceptance limit does.
 *
 * Compared in whole tenths of a micrometre (./rounding.ts), so floating point
 * never moves a result across its limit. The numbers returned are the ones
 * compared: store and show them.
 */
export type DecisionRule = 'simple' | 'guarded';
export type Decision = 'pass' | 'fail';

export function decide(resultUm: number, toleranceUm: number, rule: DecisionRule, expandedUncertaintyUm = 0) {
  const limit = tenthsOfUm(toleranceUm);
  const guardBand = rule === 'guarded' ? tenthsOfUm(expandedUncertaintyUm) : 0;
  const acceptanceLimit = limit - guardBand;
  const decision: Decision = Math.abs(tenthsOfUm(resultUm)) <= acceptanceLimit ? 'pass' : 'fail';
  return {
    decision,
    resultUm: roundUm(resultUm),
    toleranceUm: roundUm(toleranceUm),
    expandedUncertaintyUm: roundUm(expandedUncertaintyUm),
    guardBandUm: guardBand / TENTHS_PER_UM,
    acceptanceLimitUm: acceptanceLimit / TENTHS_PER_UM,
  };
}
