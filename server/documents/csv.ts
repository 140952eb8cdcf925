import Papa from 'papaparse';
import { neutraliseFormula } from '../../shared/csv/formula-guard';

const options = { newline: '\r\n', quotes: (cell: unknown) => typeof cell === 'string' && cell.startsWith("'") };

/**
 * A CSV download (RFC 4180 by papaparse, CRLF line ends). Programs read it, so cells stay machine-readable in any
 * locale (ISO 8601 dates, plain decimals, codes) and headings name units and currency (shared/formatting/csv-columns.ts). Each cell passes
 * through the shared formula guard, and a guarded cell is always enclosed in
 * double quotes, as OWASP's CSV Injection page writes it.
 * (papaparse's own `escapeFormulae: true` is not used: in 5.7 its pattern
 * `^[=+\-@\t\r].*$` misses a cell with a line break after the trigger, and it
 * also marks text such as "-12.50" that is only a negative number.)
 */
export function toCsv(fields: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return Papa.unparse({ fields: [...fields], data: rows.map((row) => row.map(neutraliseFormula)) }, options);
}

/** Rows without the header line, for a CSV written a part at a time after a `toCsv(fields, [])` header. */
export const csvRows = (rows: readonly (readonly unknown[])[]): string =>
  rows.length
    ? Papa.unparse(
        rows.map((row) => row.map(neutraliseFormula)),
        options,
      )
    : '';
