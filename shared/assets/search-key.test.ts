import { describe, expect, it } from 'vitest';
import { searchKey } from './search-key';

// Examples are the ones the shop floor types (common practice, no published source); the database's spelling is checked against this one in tests/api.
describe('searchKey', () => {
  it.each([
    ['TIP-005', 'tip5'],
    ['tip 5', 'tip5'],
    ['TIP5', 'tip5'],
    ['tip-005', 'tip5'],
    ['E2:80:11:45:104', 'e2801145104'],
    ['e2801145104', 'e2801145104'],
    ['SMR-010', 'smr10'],
    ['NST-000', 'nst0'],
    ['  trk 04 ', 'trk4'],
  ])('%s → %s', (typed, key) => expect(searchKey(typed)).toBe(key));

  it('keeps zeros inside a number and tells TIP-050 from TIP-005', () => {
    expect(searchKey('TIP-050')).toBe('tip50');
    expect(searchKey('TIP-105')).toBe('tip105');
  });
});
