import { describe, expect, it } from 'vitest';
import { itemInWords, typeInSentence } from './item-words';

// Expected wording is the project's own style (common practice for English prose: common nouns in lower case, initialisms kept).
describe('items in words', () => {
  it('names type, tag and serial', () => {
    expect(itemInWords({ type: 'tracker', assetTag: 'TRK-004', serialNumber: 'LT-88213' })).toBe('the laser tracker TRK-004, serial LT-88213');
  });
  it('keeps initialisms and leaves out a missing serial', () => {
    expect(typeInSentence('smr')).toBe('SMR');
    expect(typeInSentence('probe')).toBe('6DoF probe');
    expect(itemInWords({ type: 'smr', assetTag: 'SMR-001', serialNumber: null })).toBe('the SMR SMR-001');
  });
  it('calls an unknown type an item', () => {
    expect(itemInWords({ type: 'teapot', assetTag: 'X-1' })).toBe('the item X-1');
  });
});
