import { describe, expect, it } from 'vitest';
import { checkInputLines, checkResultLines, type MeasureWords } from './check-lines';

const inputs = {
  reference: { x: 1250, y: -340.5, z: 87.25 },
  readings: [{ x: 1250.004, y: -340.5, z: 87.25 }],
  distanceM: 4.5,
  uncertaintyComponentsUm: [3, 4],
};

describe('check lines', () => {
  it('write numbers as stored unless told otherwise (the form the record hash reads)', () => {
    expect(checkInputLines('tip_validation', inputs)).toEqual([
      'Reference R (1250, -340.5, 87.25) mm',
      'P1 (1250.004, -340.5, 87.25) mm',
      'Distance from the tracker L = 4.5 m',
      'Uncertainty components 3, 4 µm (standard)',
    ]);
  });

  it('send every number, list and point through the words they are given', () => {
    const marked: MeasureWords = {
      number: (v) => `<${String(v)}>`,
      list: (vs) => vs.map((v) => `<${String(v)}>`).join('; '),
      point: (x, y, z) => `[${x}|${y}|${z}]`,
    };
    const lines = [
      ...checkInputLines('tip_validation', inputs, marked),
      ...checkResultLines('length_check', { measuredMm: 1200.01, expectedMm: 1200, errorUm: -10 }, marked),
    ];
    expect(lines).toEqual([
      'Reference R [1250|-340.5|87.25]',
      'P1 [1250.004|-340.5|87.25]',
      'Distance from the tracker L = <4.5> m',
      'Uncertainty components <3>; <4> µm (standard)',
      'Measured <1200.01> mm',
      'Expected at temperature <1200> mm',
      'Length error <-10> µm',
    ]);
  });
});
