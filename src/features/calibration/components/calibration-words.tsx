import { StatusChip, type StatusTone } from '../../../components/status-chip';
import { dueDate } from '../../../lib/calibration';
import { formatCalendarDate } from '../../../lib/format';
import type { AsFound } from '../../../../shared/calibration/interval-review';
import type { TriageSuggestion } from '../../../../shared/calibration/triage';
import type { CalibrationEventView, ImpactAssessment, LabTripState, NoticeGroup } from '../../../../shared/calibration/views';

/** As-found and as-left results in plain words, the order of the choices. */
export const resultWords: Record<AsFound, string> = {
  in_tolerance: 'In tolerance',
  out_of_tolerance: 'Out of tolerance',
  not_reported: 'Not reported by the lab',
};
export const resultChoices = Object.keys(resultWords) as AsFound[];
const resultTones: Record<AsFound, StatusTone> = { in_tolerance: 'ok', out_of_tolerance: 'bad', not_reported: 'none' };

/** "As found: In tolerance" — the stage is part of the words, so two chips side by side read apart. */
export function ResultChip({ stage, result }: { stage: 'As found' | 'As left'; result: AsFound }) {
  return <StatusChip tone={resultTones[result]} label={`${stage}: ${resultWords[result]}`} />;
}

export const assessmentWords: Record<ImpactAssessment, string> = {
  no_effect: 'No effect',
  customer_notified: 'Customer notified',
  remeasure_offered: 'Re-measure offered',
};
export const assessmentChoices = Object.keys(assessmentWords) as ImpactAssessment[];

export const tripStateWords: Record<LabTripState, string> = { planned: 'Planned', at_lab: 'At the lab', back: 'Back' };
const tripTones: Record<LabTripState, StatusTone> = { planned: 'info', at_lab: 'paused', back: 'ok' };

export function TripStateChip({ state }: { state: LabTripState }) {
  return <StatusChip tone={tripTones[state]} label={tripStateWords[state]} />;
}

export function LateChip() {
  return <StatusChip tone="bad" label="Late" title="Past the day it was expected back" />;
}

export const months = (n: number) => `${n} ${n === 1 ? 'month' : 'months'}`;
export const days = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`;

/** The suggestion in words, from the way it moves (never inferred from the numbers alone). */
export function suggestionHeadline(event: CalibrationEventView): string {
  switch (event.suggestedChange) {
    case 'lengthen':
      return `Lengthen the interval from ${months(event.intervalMonths)} to ${months(event.suggestedIntervalMonths)}`;
    case 'shorten':
      return `Shorten the interval from ${months(event.intervalMonths)} to ${months(event.suggestedIntervalMonths)}`;
    case 'keep':
      return `Keep the interval at ${months(event.intervalMonths)}`;
    case 'outside_policy':
      return `No suggestion: ${months(event.intervalMonths)} is outside the interval policy`;
  }
}

/** The due date a calibration leaves the item with: an accepted interval suggestion moves it from the same calibration day. */
export function effectiveDueOn(event: CalibrationEventView): string {
  return event.intervalDecision === 'accepted' && event.suggestedIntervalMonths !== event.intervalMonths
    ? dueDate(event.performedOn, event.suggestedIntervalMonths)
    : event.dueOn;
}

export const suggestionWords: Record<TriageSuggestion, string> = {
  no_effect_likely: 'No effect likely',
  remeasure_advised: 'Re-measure advised',
  cannot_judge: 'Cannot judge',
};
const suggestionTones: Record<TriageSuggestion, StatusTone> = { no_effect_likely: 'ok', remeasure_advised: 'bad', cannot_judge: 'none' };

/** "Suggested: Re-measure advised" — advice, worded apart from the assessment a person records. */
export function SuggestionChip({ suggestion, prefix = 'Suggested' }: { suggestion: TriageSuggestion; prefix?: string }) {
  return <StatusChip tone={suggestionTones[suggestion]} label={`${prefix}: ${suggestionWords[suggestion]}`} />;
}

/** Which notice a customer gets, by the booking's assessment. */
export const noticeGroupWords: Record<NoticeGroup, string> = {
  no_effect: 'No effect likely: results stand',
  remeasure_offered: 'Re-measure proposed',
  customer_notified: 'Cannot judge: tolerance asked for',
  pending: 'Not assessed yet: review under way',
};
