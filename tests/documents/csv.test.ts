import { parse } from 'csv-parse/sync';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from '../../server/documents/csv';

describe('CSV downloads (RFC 4180, with the OWASP CSV Injection guard)', () => {
  // OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection), its two
  // examples of "Input → Escaped Output": quote the field, prepend ', double every ".
  it.each([
    ['=1+2";=1+2', `"'=1+2"";=1+2"`],
    [`=1+2'" ;,=1+2`, `"'=1+2'"" ;,=1+2"`],
  ])('writes OWASP’s example %j as %s', (input, escaped) => {
    expect(toCsv(['cell'], [[input]])).toBe(`cell\r\n${escaped}`);
  });

  it('writes CRLF records, quotes fields with commas, quotes or line breaks and doubles quotes (RFC 4180 §2 rules 1, 6, 7)', () => {
    expect(
      toCsv(
        ['a', 'b'],
        [
          ['x,y', 'say "hi"'],
          ['two\r\nlines', 'plain'],
        ],
      ),
    ).toBe('a,b\r\n"x,y","say ""hi"""\r\n"two\r\nlines",plain');
  });

  it('keeps negative amounts numeric and guards every text cell, read back by an independent parser (csv-parse)', () => {
    const text = toCsv(['amount', 'text', 'note'], [[-1250, '-12.50', '=HYPERLINK("http://attacker.test/","Open")\nsecond line']]);
    expect(text.split('\r\n')[1].startsWith('-1250,-12.50,"\'=HYPERLINK(')).toBe(true);
    const [row] = parse(text, { columns: true }) as Record<string, string>[];
    expect(row).toEqual({ amount: '-1250', text: '-12.50', note: `'=HYPERLINK("http://attacker.test/","Open")\nsecond line` });
  });

  // What papaparse 5.7's own option does, so the choice above stays checked if the package changes.
  it('papaparse escapeFormulae: true misses a formula followed by a line break and marks "-12.50" as a formula', () => {
    const own = Papa.unparse([['=1+2\nsecond', '\n=1+2', '-12.50', -12.5]], { escapeFormulae: true });
    expect(own).toBe(`"=1+2\nsecond","\n=1+2","'-12.50",-12.5`);
  });
});
