import { tenthsOfUm, TENTHS_PER_UM } from '../checks/rounding';
import { toleranceUm, type Tolerance } from '../checks/tolerance';

/**
 * Triage of one booking in an impact review: how much of the job's tightest
 * tolerance the instrument's as-found error would have used. It advises; a
 * person accepts or changes it.
 *
 * The firm's ratio (default 4, the 4:1 ratio of instrument error to part
 * tolerance is common practice) gives the error allowance tolerance ÷ ratio.
 * Both numbers are stated in whole tenths of a micrometre by the checks'
 * rounding rule (../checks/rounding.ts, half to even) and compared as
 * integers, as `decide()` does: an error equal to the allowance is "no effect likely".
 */
export const DEFAULT_TRIAGE_RATIO = 4;

export const triageSuggestions = ['no_effect_likely', 'remeasure_advised', 'cannot_judge'] as const;
export type TriageSuggestion = (typeof triageSuggestions)[number];

/** Where the as-found error came from: the certificate's recorded value, or the failing check's result. */
export type AsFoundErrorSource = 'certificate' | 'check';

/** The job's tightest feature tolerance: ± value in µm, or A + B·L at the job's stated distance (m). */
export type JobTolerance = { tolerance: Tolerance; distanceM: number | null; note: string | null };

export type TriageInput = {
  asFoundErrorUm: number | null;
  errorSource: AsFoundErrorSource | null;
  job: JobTolerance | null;
  ratio: number;
};

/** What was compared and by which rule, kept with the review for the auditor. */
export type TriageFacts = {
  suggestion: TriageSuggestion;
  /** Why, in plain words. */
  reason: string;
  ratio: number;
  asFoundErrorUm: number | null;
  errorSource: AsFoundErrorSource | null;
  /** The job's tolerance as recorded and, for A + B·L, the distance it is evaluated at. */
  tolerance: Tolerance | null;
  distanceM: number | null;
  toleranceNote: string | null;
  /** The tolerance at that distance, and the allowance tolerance ÷ ratio, both to 0.1 µm. */
  toleranceUm: number | null;
  allowanceUm: number | null;
  /** The share of the tolerance the error uses (0.25 = a quarter), for showing; the decision uses the tenths. */
  share: number | null;
};

const fmt = (um: number) => `${um.toFixed(1)} µm`;

export function triage(input: TriageInput): TriageFacts {
  const { asFoundErrorUm, errorSource, job, ratio } = input;
  if (!(ratio >= 1)) throw new Error(`A triage ratio must be at least 1: ${ratio}`);
  const base = {
    ratio,
    asFoundErrorUm: asFoundErrorUm === null ? null : tenthsOfUm(Math.abs(asFoundErrorUm)) / TENTHS_PER_UM,
    errorSource: asFoundErrorUm === null ? null : errorSource,
    tolerance: job?.tolerance ?? null,
    distanceM: job?.distanceM ?? null,
    toleranceNote: job?.note ?? null,
  };
  const cannot = (reason: string): TriageFacts => ({ ...base, suggestion: 'cannot_judge', reason, toleranceUm: null, allowanceUm: null, share: null });
  if (!job) return cannot('No tolerance is recorded for this job.');
  if (job.tolerance.kind === 'range' && job.distanceM === null) return cannot('The job has an A + B·L tolerance but no measuring distance.');
  if (asFoundErrorUm === null) return cannot('No as-found error value is recorded for the instrument.');

  const limitTenths = tenthsOfUm(toleranceUm(job.tolerance, job.distanceM));
  const allowanceTenths = tenthsOfUm(limitTenths / TENTHS_PER_UM / ratio);
  const errorTenths = tenthsOfUm(Math.abs(asFoundErrorUm));
  const numbers = {
    toleranceUm: limitTenths / TENTHS_PER_UM,
    allowanceUm: allowanceTenths / TENTHS_PER_UM,
    share: limitTenths > 0 ? errorTenths / limitTenths : null,
  };
  const compared = `as-found error ${fmt(errorTenths / TENTHS_PER_UM)} against ${fmt(numbers.allowanceUm)} (tolerance ${fmt(numbers.toleranceUm)} ÷ ${ratio})`;
  return errorTenths <= allowanceTenths
    ? { ...base, ...numbers, suggestion: 'no_effect_likely', reason: `Within the allowance: ${compared}.` }
    : { ...base, ...numbers, suggestion: 'remeasure_advised', reason: `More than the allowance: ${compared}.` };
}

/** What accepting a suggestion records as the booking's assessment ("cannot judge": the customer is told and asked). */
export const assessmentForSuggestion = {
  no_effect_likely: 'no_effect',
  remeasure_advised: 'remeasure_offered',
  cannot_judge: 'customer_notified',
} as const satisfies Record<TriageSuggestion, string>;

/** "a quarter" for 4:1, "1/5" otherwise: the share of the tolerance the error may use. */
export const allowanceWords = (ratio: number) => (ratio === 4 ? 'a quarter' : ratio === 2 ? 'half' : `1/${ratio}`);
