import { assetTypeTitles, tipPositions, type AssetType, type TipPosition } from '../assets/vocabulary';
import type { HoldReason } from './views';

/** Why an item is on hold, in words (the hold panel, the equipment record and its PDF). */
export const holdReasonWords: Record<HoldReason, string> = {
  incident: 'Damage or loss reported',
  failed_check: 'Failed a field check',
  manual: 'Taken out of service by hand',
};

/** "a battery", "an SMR", "a 6DoF probe": the type inside a sentence ("SMR" and "6DoF" keep their capitals). */
export function aType(type: AssetType): string {
  const title = assetTypeTitles[type].replace(/^[A-Z](?=[a-z ])/, (c) => c.toLowerCase());
  return `${/^[aeiou]|^SMR/.test(title) ? 'an' : 'a'} ${title}`;
}

/**
 * What ends a hold, as the holds service decides it (holds.service.ts `evidenceSince`): for a tip, a passing validation
 * in every position it is used in; for a tracker, a passing two-face or length check; for every item, a calibration with
 * the result as left in tolerance, dated on or after the day the hold began. No field check applies to the other types
 * (SMRs, nests, batteries, cases…), so only that certificate does. A shop manager or the owner then releases it.
 */
export function releaseRule(type: AssetType, positions: readonly TipPosition[] = ['vertical']): string {
  const certificate = 'a calibration certificate recorded for it with the result as left in tolerance, dated on or after the day the hold began';
  if (type === 'tip') {
    const where = positions.length > 1 ? `each position it is used in (${positions.join(' and ')})` : `the ${positions[0]} position`;
    return `Released by a shop manager or the owner once there is a passing tip validation in ${where}, or ${certificate}.`;
  }
  if (type === 'tracker') return `Released by a shop manager or the owner once there is a passing two-face or length check, or ${certificate}.`;
  return `Released by a shop manager or the owner once there is ${certificate}. No field check applies to ${aType(type)}: send it for inspection or calibration.`;
}

/** The mounting positions a tip's specs name (its validations must pass in each); none for other items. */
export const tipPositionsOf = (specs: { positions?: unknown }): TipPosition[] | undefined =>
  Array.isArray(specs.positions) ? specs.positions.filter((p): p is TipPosition => (tipPositions as readonly unknown[]).includes(p)) : undefined;
