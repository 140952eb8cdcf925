/** A field check's stored inputs and result in words, as the equipment record prints them (µm, mm, °C, m). */
type Loose = Record<string, unknown>;

/**
 * How the lines write a stored number, a list of them and a point. `storedWords` writes them as JavaScript prints
 * them (the record's content hash reads that form); the server passes the firm's format for the reader.
 */
export type MeasureWords = { number: (value: unknown) => string; list: (values: unknown[]) => string; point: (x: number, y: number, z: number) => string };
export const storedWords: MeasureWords = { number: String, list: (values) => values.join(', '), point: (x, y, z) => `(${x}, ${y}, ${z}) mm` };

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const present = (lines: (string | null)[]) => lines.filter((l): l is string => l !== null);

export function checkInputLines(kind: string, inputs: Loose, say: MeasureWords = storedWords): string[] {
  const point = (v: unknown) => {
    const p = v as Loose | null | undefined;
    return p && num(p.x) !== null ? say.point(p.x as number, p.y as number, p.z as number) : null;
  };
  const toleranceText = (t: unknown): string | null => {
    const tol = t as Loose | null | undefined;
    if (!tol) return null;
    if (tol.kind === 'fixed') return `tolerance fixed at ${say.number(tol.um)} µm`;
    if (tol.kind === 'range') return `tolerance ${say.number(tol.aUm)} µm + ${say.number(tol.bUmPerM)} µm/m × L`;
    return null;
  };
  const common = present([
    num(inputs.distanceM) !== null ? `Distance from the tracker L = ${say.number(inputs.distanceM)} m` : null,
    toleranceText(inputs.tolerance),
    Array.isArray(inputs.uncertaintyComponentsUm) ? `Uncertainty components ${say.list(inputs.uncertaintyComponentsUm)} µm (standard)` : null,
  ]);
  if (kind === 'tip_validation') {
    const readings = Array.isArray(inputs.readings) ? inputs.readings : [];
    return [
      ...present([point(inputs.reference) ? `Reference R ${point(inputs.reference)}` : null]),
      ...readings.map((r, i) => `P${i + 1} ${point(r) ?? '?'}`),
      ...common,
    ];
  }
  if (kind === 'two_face')
    return [...present([point(inputs.front) && `Front face ${point(inputs.front)}`, point(inputs.back) && `Back face ${point(inputs.back)}`]), ...common];
  const bar = inputs.scaleBar as Loose | undefined;
  return [
    ...present([
      bar ? `Scale bar ${bar.assetTag}: L20 = ${say.number(bar.certifiedLengthMm)} mm, α = ${say.number(bar.expansionPpmPerK)} µm/(m·K)` : null,
      point(inputs.endA) && `End A ${point(inputs.endA)}`,
      point(inputs.endB) && `End B ${point(inputs.endB)}`,
      num(inputs.temperatureC) !== null ? `Bar temperature ${say.number(inputs.temperatureC)} °C` : null,
    ]),
    ...common,
  ];
}

export function checkResultLines(kind: string, result: Loose, say: MeasureWords = storedWords): string[] {
  if (kind === 'tip_validation')
    return present([
      Array.isArray(result.deviationsUm) ? `|Pi − R| = ${say.list(result.deviationsUm)} µm` : null,
      num(result.meanOffsetUm) !== null ? `Mean offset |P̄ − R| = ${say.number(result.meanOffsetUm)} µm` : null,
      num(result.spreadUm) !== null ? `Spread max |Pi − P̄| = ${say.number(result.spreadUm)} µm` : null,
      num(result.maxDeviationUm) !== null ? `Largest |Pi − R| = ${say.number(result.maxDeviationUm)} µm (decides)` : null,
    ]);
  if (kind === 'two_face') return present([num(result.errorUm) !== null ? `Two-face error ${say.number(result.errorUm)} µm` : null]);
  return present([
    num(result.measuredMm) !== null ? `Measured ${say.number(result.measuredMm)} mm` : null,
    num(result.expectedMm) !== null ? `Expected at temperature ${say.number(result.expectedMm)} mm` : null,
    num(result.errorUm) !== null ? `Length error ${say.number(result.errorUm)} µm` : null,
  ]);
}
