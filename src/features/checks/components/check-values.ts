import * as Yup from 'yup';
import type { TipPosition } from '../../../lib/assets';
import {
  decide,
  expandedUncertainty,
  lengthCheck,
  MIN_TIP_READINGS,
  tipValidation,
  toleranceUm,
  twoFaceErrorUm,
  type CheckKind,
  type Decision,
  type DecisionRule,
  type Point,
  type Tolerance,
} from '../../../lib/checks';
import type { CheckPayload } from '../../../../shared/schemas/checks';
import { parseDecimal, parseNumberList, toPoint, type PointText } from './parse-readings';

export const MAX_TIP_READINGS = 20;

export interface CheckFormValues {
  kind: CheckKind;
  position: string;
  probeId: string;
  reference: PointText;
  readings: PointText[];
  paste: string;
  front: PointText;
  back: PointText;
  scaleBarId: string;
  endA: PointText;
  endB: PointText;
  temperatureC: string;
  distanceM: string;
  uncertaintyComponents: string;
  uncertaintyU: string;
  note: string;
}

export const emptyPoint = (): PointText => ({ x: '', y: '', z: '' });

/** The scale bar facts a length check needs (from the bar's specs). */
export interface ScaleBarFacts {
  id: string;
  assetTag: string;
  certifiedLengthMm: number;
  expansionPpmPerK: number;
}

/** Everything the server will use to decide, as the form knows it. */
export interface CheckRules {
  decisionRule: DecisionRule | null;
  /** The tolerance per kind: the asset's override, else the firm's setting (null when unknown). */
  tolerances: Partial<Record<CheckKind, Tolerance>>;
}

const coordinate = (axis: string) =>
  Yup.string()
    .required(`Enter ${axis} in mm.`)
    .test('number', `${axis} must be a number in mm.`, (v) => parseDecimal(v) !== null)
    .test('range', `${axis} is beyond a kilometre from the tracker.`, (v) => Math.abs(parseDecimal(v) ?? 0) < 1e6);
const pointSchema = Yup.object({ x: coordinate('X'), y: coordinate('Y'), z: coordinate('Z') });
const optionalNumber = (message: string, min = 0, max = 100_000) =>
  Yup.string().test('number', message, (v) => {
    if (!v || !v.trim()) return true;
    const n = parseDecimal(v);
    return n !== null && n >= min && n <= max;
  });

/** Yup schema for the chosen kind; the distance is required when that kind's tolerance depends on it. */
export function checkSchema(values: CheckFormValues, rules: CheckRules, positions: readonly TipPosition[]) {
  const needsDistance = rules.tolerances[values.kind]?.kind === 'range';
  const common = {
    distanceM: needsDistance
      ? Yup.string()
          .required('Enter the distance from the tracker: the tolerance for this check depends on it.')
          .test('number', 'Distance must be a number of metres from 0 to 200.', (v) => {
            const n = parseDecimal(v);
            return n !== null && n >= 0 && n <= 200;
          })
      : optionalNumber('Distance must be a number of metres from 0 to 200.', 0, 200),
    uncertaintyComponents: Yup.string().test('list', 'List standard uncertainties in µm, e.g. 3, 4.5, 2.', (v) => {
      const list = parseNumberList(v ?? '');
      return list !== null && list.every((n) => n >= 0) && list.length <= 20;
    }),
    uncertaintyU: optionalNumber('U must be a number of µm, 0 or more.').test(
      'not-both',
      'Give either the expanded uncertainty U or its components, not both.',
      function (v) {
        return !(v?.trim() && (this.parent as CheckFormValues).uncertaintyComponents.trim());
      },
    ),
    note: Yup.string().max(2000, 'Keep the note under 2,000 characters.'),
  };
  switch (values.kind) {
    case 'tip_validation':
      return Yup.object({
        ...common,
        position: Yup.string()
          .required('Choose the position the tip was mounted in.')
          .oneOf([...positions], 'This tip is not used in that position.'),
        reference: pointSchema,
        readings: Yup.array(pointSchema)
          .min(MIN_TIP_READINGS, `A tip validation needs at least ${MIN_TIP_READINGS} readings.`)
          .max(MAX_TIP_READINGS, `Take at most ${MAX_TIP_READINGS} readings.`),
      });
    case 'two_face':
      return Yup.object({ ...common, front: pointSchema, back: pointSchema });
    case 'length_check':
      return Yup.object({
        ...common,
        scaleBarId: Yup.string().required('Choose the scale bar you measured.'),
        endA: pointSchema,
        endB: pointSchema,
        temperatureC: Yup.string()
          .required('Enter the bar temperature in °C.')
          .test('number', 'Temperature must be a number from −30 to 60 °C.', (v) => {
            const n = parseDecimal(v);
            return n !== null && n >= -30 && n <= 60;
          }),
      });
  }
}

export function uncertaintyFrom(values: CheckFormValues): { components?: number[]; expandedUm: number | null } {
  const u = parseDecimal(values.uncertaintyU);
  if (u !== null) return { expandedUm: u };
  const list = parseNumberList(values.uncertaintyComponents);
  if (list && list.length) return { components: list, expandedUm: expandedUncertainty(list) };
  return { expandedUm: null };
}

export type PreviewNumbers =
  | { kind: 'tip_validation'; deviationsUm: (number | null)[]; meanOffsetUm: number; spreadUm: number; maxDeviationUm: number }
  | { kind: 'two_face'; errorUm: number }
  | { kind: 'length_check'; measuredMm: number; expectedMm: number; errorUm: number };

export interface Preview {
  numbers: PreviewNumbers | null;
  /** What the decision judges, µm. */
  judgedUm: number | null;
  toleranceUm: number | null;
  expandedUncertaintyUm: number;
  guardBandUm: number | null;
  acceptanceLimitUm: number | null;
  decision: Decision | null;
  /** Why something is not shown yet, in plain words. */
  waiting: string[];
}

/** The same computation the server runs, on whatever the form holds so far. */
export function previewCheck(values: CheckFormValues, rules: CheckRules, bar: ScaleBarFacts | undefined): Preview {
  const waiting: string[] = [];
  let numbers: PreviewNumbers | null = null;
  let judgedUm: number | null = null;
  if (values.kind === 'tip_validation') {
    const reference = toPoint(values.reference);
    const readings = values.readings.map(toPoint);
    const complete = readings.filter((p): p is Point => p !== null);
    if (!reference) waiting.push('Enter the reference point.');
    if (complete.length < MIN_TIP_READINGS) waiting.push(`Enter at least ${MIN_TIP_READINGS} complete readings (${complete.length} so far).`);
    else if (complete.length < readings.length) waiting.push(`${readings.length - complete.length} reading row(s) are incomplete and left out of the preview.`);
    if (reference && complete.length >= MIN_TIP_READINGS) {
      const r = tipValidation(reference, complete);
      let i = 0;
      numbers = { kind: 'tip_validation', ...r, deviationsUm: readings.map((p) => (p ? r.deviationsUm[i++] : null)) };
      judgedUm = r.maxDeviationUm;
    }
  } else if (values.kind === 'two_face') {
    const front = toPoint(values.front);
    const back = toPoint(values.back);
    if (!front || !back) waiting.push('Enter both the front-face and the back-face reading.');
    else {
      const errorUm = twoFaceErrorUm(front, back);
      numbers = { kind: 'two_face', errorUm };
      judgedUm = errorUm;
    }
  } else {
    const a = toPoint(values.endA);
    const b = toPoint(values.endB);
    const t = parseDecimal(values.temperatureC);
    if (!bar) waiting.push('Choose the scale bar.');
    if (!a || !b) waiting.push('Enter both end readings.');
    if (t === null) waiting.push('Enter the bar temperature.');
    if (bar && a && b && t !== null) {
      const r = lengthCheck(a, b, bar.certifiedLengthMm, bar.expansionPpmPerK, t);
      numbers = { kind: 'length_check', ...r };
      judgedUm = r.errorUm;
    }
  }

  const tolerance = rules.tolerances[values.kind];
  let limit: number | null = null;
  if (!tolerance) waiting.push('The tolerance for this check is not known here; the server will apply the firm’s setting.');
  else if (tolerance.kind === 'fixed') limit = toleranceUm(tolerance);
  else {
    const d = parseDecimal(values.distanceM);
    if (d === null || d < 0) waiting.push('Enter the distance from the tracker: the tolerance depends on it.');
    else limit = toleranceUm(tolerance, d);
  }
  let expandedUncertaintyUm = uncertaintyFrom(values).expandedUm ?? 0;
  let decision: Decision | null = null;
  let guardBandUm: number | null = null;
  let acceptanceLimitUm: number | null = null;
  if (limit !== null && rules.decisionRule) {
    const d = decide(judgedUm ?? 0, limit, rules.decisionRule, expandedUncertaintyUm);
    // The numbers the decision compares, rounded as the server stores them.
    expandedUncertaintyUm = d.expandedUncertaintyUm;
    guardBandUm = d.guardBandUm;
    acceptanceLimitUm = d.acceptanceLimitUm;
    if (judgedUm !== null) decision = d.decision;
  } else if (!rules.decisionRule) waiting.push('The firm’s decision rule is not known here.');
  return { numbers, judgedUm, toleranceUm: limit, expandedUncertaintyUm, guardBandUm, acceptanceLimitUm, decision, waiting };
}

/** The form as the API's payload (numbers parsed; empty optionals left out). */
export function checkPayloadFrom(values: CheckFormValues, assetId: string): CheckPayload {
  const point = (p: PointText) => toPoint(p) as Point;
  const distance = parseDecimal(values.distanceM);
  const u = uncertaintyFrom(values);
  const common = {
    assetId,
    ...(distance !== null ? { distanceM: distance } : {}),
    ...(parseDecimal(values.uncertaintyU) !== null ? { uncertaintyUm: parseDecimal(values.uncertaintyU) } : {}),
    ...(u.components ? { uncertaintyComponentsUm: u.components } : {}),
    ...(values.note.trim() ? { note: values.note.trim() } : {}),
  };
  switch (values.kind) {
    case 'tip_validation':
      return {
        kind: 'tip_validation',
        ...common,
        position: values.position as TipPosition,
        ...(values.probeId ? { probeId: values.probeId } : {}),
        reference: point(values.reference),
        readings: values.readings.map(point),
      };
    case 'two_face':
      return { kind: 'two_face', ...common, front: point(values.front), back: point(values.back) };
    case 'length_check':
      return {
        kind: 'length_check',
        ...common,
        scaleBarId: values.scaleBarId,
        endA: point(values.endA),
        endB: point(values.endB),
        temperatureC: parseDecimal(values.temperatureC) as number,
      };
  }
}

/** Every form field a server message can land on (readings by index). */
export const checkFormFields: readonly string[] = [
  'position',
  'probeId',
  'scaleBarId',
  'temperatureC',
  'distanceM',
  'uncertaintyComponents',
  'uncertaintyU',
  'note',
  'readings',
  ...['reference', 'front', 'back', 'endA', 'endB'].flatMap((p) => ['x', 'y', 'z'].map((a) => `${p}.${a}`)),
  ...Array.from({ length: MAX_TIP_READINGS }, (_, i) => ['x', 'y', 'z'].map((a) => `readings.${i}.${a}`)).flat(),
];
