import { StatusChip, type StatusTone } from '../../../components/status-chip';
import type { TipValidationState, TipValidationStatus } from '../../../../shared/checks/views';
import { positionWords, tipStateWords } from './check-words';

const tones: Record<TipValidationState, StatusTone> = { validated: 'ok', not_validated: 'warn', failed: 'bad' };

export function TipValidationChip({ state }: { state: TipValidationState }) {
  return <StatusChip tone={tones[state]} label={tipStateWords[state]} />;
}

/** Each mounting position with its validation state. */
export function TipValidationStates({ status, dateTime }: { status: TipValidationStatus; dateTime: (v: string | null) => string }) {
  if (!status.positions.length) return <p className="text-sm text-ink-700">No mounting positions are recorded for this tip.</p>;
  return (
    <ul className="flex flex-col gap-1">
      {status.positions.map((p) => (
        <li key={p.position} className="flex flex-wrap items-center gap-2">
          <span className="w-24 font-semibold">{positionWords[p.position]}</span>
          <TipValidationChip state={p.state} />
          <span className="text-sm text-ink-700">{p.lastPerformedAt ? `last ${dateTime(p.lastPerformedAt)}` : 'never validated'}</span>
        </li>
      ))}
    </ul>
  );
}
