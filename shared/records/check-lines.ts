/** A field check's stored inputs and result in words, as the equipment record prints them (µm, mm, °C, m). */
type Loose = Record<string, unknown>;

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const point = (v: unknown) => {
  const p = v as Loose | null | undefined;
  return p && num(p.x) !== null ? `(${p.x}, ${p.y}, ${p.z}) mm` : null;
};
const present = (lines: (string | null)[]) => lines.filter((l): l is string => l !== null);

function toleranceText(t: unknown): string | null {
  const tol = t as Loose | null | undefined;
  if (!tol) return null;
  if (tol.kind === 'fixed') return `tolerance fixed at ${tol.um} µm`;
  if (tol.kind === 'range') return `tolerance ${tol.aUm} µm + ${tol.bUmPerM} µm/m × L`;
  return null;
}

export function checkInputLines(kind: string, inputs: Loose): string[] {
  const common = present([
    num(inputs.distanceM) !== null ? `Distance from the tracker L = ${inputs.distanceM} m` : null,
    toleranceText(inputs.tolerance),
    Array.isArray(inputs.uncertaintyComponentsUm) ? `Uncertainty components ${inputs.uncertaintyComponentsUm.join(', ')} µm (standard)` : null,
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
      bar ? `Scale bar ${bar.assetTag}: L20 = ${bar.certifiedLengthMm} mm, α = ${bar.expansionPpmPerK} µm/(m·K)` : null,
      point(inputs.endA) && `End A ${point(inputs.endA)}`,
      point(inputs.endB) && `End B ${point(inputs.endB)}`,
      num(inputs.temperatureC) !== null ? `Bar temperature ${inputs.temperatureC} °C` : null,
    ]),
    ...common,
  ];
}

export function checkResultLines(kind: string, result: Loose): string[] {
  if (kind === 'tip_validation')
    return present([
      Array.isArray(result.deviationsUm) ? `|Pi − R| = ${result.deviationsUm.join(', ')} µm` : null,
      num(result.meanOffsetUm) !== null ? `Mean offset |P̄ − R| = ${result.meanOffsetUm} µm` : null,
      num(result.spreadUm) !== null ? `Spread max |Pi − P̄| = ${result.spreadUm} µm` : null,
      num(result.maxDeviationUm) !== null ? `Largest |Pi − R| = ${result.maxDeviationUm} µm (decides)` : null,
    ]);
  if (kind === 'two_face') return present([num(result.errorUm) !== null ? `Two-face error ${result.errorUm} µm` : null]);
  return present([
    num(result.measuredMm) !== null ? `Measured ${result.measuredMm} mm` : null,
    num(result.expectedMm) !== null ? `Expected at temperature ${result.expectedMm} mm` : null,
    num(result.errorUm) !== null ? `Length error ${result.errorUm} µm` : null,
  ]);
}
