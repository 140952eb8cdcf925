import type { Point } from '../../../lib/checks';

/** A number as people type it: decimal point or decimal comma, spaces around. */
export function parseDecimal(text: string | number | null | undefined): number | null {
  if (typeof text === 'number') return Number.isFinite(text) ? text : null;
  if (text === null || text === undefined) return null;
  const t = text
    .trim()
    .replace(/\u2212/g, '-')
    .replace(',', '.');
  if (!t || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

function splitLine(line: string): string[] {
  if (line.includes('\t')) return line.split('\t');
  if (line.includes(';')) return line.split(';');
  const bySpace = line.split(/\s+/).map((t) => t.replace(/,$/, ''));
  if (bySpace.length >= 3) return bySpace;
  return line.split(',');
}

export interface PastedReadings {
  points: Point[];
  /** Lines that could not be read, in plain words. */
  problems: string[];
}

/**
 * Rows copied from a spreadsheet or a tracker's export: one reading per line,
 * x y z separated by tabs, semicolons, commas or spaces; a decimal comma is
 * fine. A leading label column ("P1") and header lines are skipped.
 */
export function parseReadings(text: string): PastedReadings {
  const points: Point[] = [];
  const problems: string[] = [];
  text.split(/\r?\n/).forEach((raw, index) => {
    const line = raw.trim();
    if (!line) return;
    let cells = splitLine(line)
      .map((c) => c.trim())
      .filter((c) => c !== '');
    if (cells.length > 3 && parseDecimal(cells[0]) === null) cells = cells.slice(1);
    const numbers = cells.map(parseDecimal);
    if (numbers.every((n) => n === null)) {
      if (points.length === 0 && problems.length === 0) return; // a header line
      problems.push(`Line ${index + 1} has no numbers.`);
      return;
    }
    if (numbers.length !== 3 || numbers.some((n) => n === null)) {
      problems.push(`Line ${index + 1} should hold three numbers (x, y, z), found “${line}”.`);
      return;
    }
    const [x, y, z] = numbers as number[];
    points.push({ x, y, z });
  });
  return { points, problems };
}

/** Comma-, semicolon- or space-separated µm values ("3, 4.5, 2" or "3; 4,5; 2"). */
export function parseNumberList(text: string): number[] | null {
  const t = text.trim();
  if (!t) return [];
  const parts = t.includes(';') ? t.split(';') : t.split(/[,\s]+/);
  const values = parts
    .map((p) => p.trim())
    .filter(Boolean)
    .map(parseDecimal);
  return values.some((v) => v === null) ? null : (values as number[]);
}

export type PointText = { x: string; y: string; z: string };

export function toPoint(p: PointText): Point | null {
  const x = parseDecimal(p.x);
  const y = parseDecimal(p.y);
  const z = parseDecimal(p.z);
  return x === null || y === null || z === null ? null : { x, y, z };
}

/** A point back into the form's text fields (full precision, decimal point). */
export const pointText = (p: Point): PointText => ({ x: String(p.x), y: String(p.y), z: String(p.z) });
