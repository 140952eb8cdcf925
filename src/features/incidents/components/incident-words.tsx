import { StatusChip, type StatusTone } from '../../../components/status-chip';
import { incidentStateTitles, type IncidentKind, type IncidentState } from '../../../../shared/incidents/vocabulary';

/** What people pick when they report; the order is the order of the choices. */
export const incidentKindWords: Record<IncidentKind, string> = {
  dropped: 'Dropped',
  impact: 'Knocked or hit',
  missing: 'Missing',
  malfunction: 'Not working right',
  other: 'Something else',
};
export const incidentKindChoices = Object.keys(incidentKindWords) as IncidentKind[];

export const incidentStateWords: Record<IncidentState, string> = incidentStateTitles;
const tones: Record<IncidentState, StatusTone> = { reported: 'warn', reviewing: 'info', resolved: 'ok' };
export const incidentStateChoices = Object.keys(incidentStateWords) as IncidentState[];

export function IncidentStateChip({ state }: { state: IncidentState }) {
  return <StatusChip tone={tones[state]} label={incidentStateWords[state]} />;
}
