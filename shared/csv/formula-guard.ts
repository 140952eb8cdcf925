/**
 * CSV formula injection (OWASP "CSV Injection"): a spreadsheet opening a CSV
 * runs a cell that starts with = + - @ as a formula, and tab, carriage return
 * or line feed in front of one of those does not stop it. Every CSV Nestkeeper
 * writes, on the server and from a grid in the browser, passes each cell
 * through `neutraliseFormula`; the writers also enclose such a cell in double
 * quotes (RFC 4180 §2.6–2.7), so the leading quote mark and the text stay one field.
 */
const FORMULA_START = /^[=+\-@\t\r\n]/;

/** A number written as text ("-12.50") is data a spreadsheet should keep numeric, not a formula. */
const PLAIN_DECIMAL = /^-?\d+(\.\d+)?$/;

/** True when a spreadsheet could read this text as a formula. */
export const startsLikeFormula = (text: string) => FORMULA_START.test(text) && !PLAIN_DECIMAL.test(text);

/**
 * The cell to write: text that could run as a formula gets a leading single
 * quote, which spreadsheets show as text; numbers, booleans, empty cells and
 * plain decimal strings stay as they are.
 */
export function neutraliseFormula<T>(value: T): T | string {
  return typeof value === 'string' && startsLikeFormula(value) ? `'${value}` : value;
}

/** Reading a file Nestkeeper wrote: drop the quote mark `neutraliseFormula` (or an older export) put in front. */
export const restoreNeutralisedCell = (text: string) => (text.startsWith("'") && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text);
