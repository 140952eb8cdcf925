import { describe, expect, it } from 'vitest';
import { assetTypes } from '../assets/vocabulary';
import { aType, releaseRule, tipPositionsOf } from './release-rule';

// What the sentences must say is what holds.service.ts `evidenceSince` accepts (tests/api/checks.test.ts proves that side).
describe('what releases a held item, in words', () => {
  it('names the field checks that release a tip or a tracker', () => {
    expect(releaseRule('tip', ['vertical', 'horizontal'])).toMatch(/passing tip validation in each position it is used in \(vertical and horizontal\)/);
    expect(releaseRule('tip')).toMatch(/passing tip validation in the vertical position/);
    expect(releaseRule('tracker')).toMatch(/passing two-face or length check, or a calibration certificate/);
  });

  it('says that only a recorded certificate releases an item no field check applies to', () => {
    expect(releaseRule('smr')).toBe(
      'Released by a shop manager or the owner once there is a calibration certificate recorded for it with the result as left in tolerance, dated on or after the day the hold began. No field check applies to an SMR: send it for inspection or calibration.',
    );
    for (const type of assetTypes.filter((t) => t !== 'tip' && t !== 'tracker')) {
      expect(releaseRule(type)).not.toMatch(/field check or|passes a field check/);
      expect(releaseRule(type)).toMatch(/No field check applies to an? /);
    }
  });

  it('puts the type in a sentence as it is said', () => {
    expect([aType('battery'), aType('smr'), aType('nest'), aType('probe'), aType('accessory'), aType('reference_sphere')]).toEqual([
      'a battery',
      'an SMR',
      'a nest',
      'a 6DoF probe',
      'an accessory',
      'a reference sphere',
    ]);
  });

  it('reads the positions a tip is used in from its specs', () => {
    expect(tipPositionsOf({ positions: ['horizontal', 'sideways'] })).toEqual(['horizontal']);
    expect(tipPositionsOf({})).toBeUndefined();
  });
});
