import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { useDecideInterval } from '../api/decide-interval';
import type { CalibrationEventView } from '../../../../shared/calibration/views';
import { suggestionHeadline } from './calibration-words';

const decisionWords = { accepted: 'Accepted', declined: 'Declined' } as const;

/** The interval review's suggestion after a calibration, and the owner's answer (OIML D 10 / ILAC-G24 staircase method). */
export function IntervalSuggestion({
  event,
  canDecide,
  onDecided,
}: {
  event: CalibrationEventView;
  canDecide: boolean;
  onDecided?: (event: CalibrationEventView) => void;
}) {
  const decide = useDecideInterval();
  const moves = event.suggestedChange === 'lengthen' || event.suggestedChange === 'shorten';
  const outside = event.suggestedChange === 'outside_policy';
  return (
    <div className="flex flex-col gap-2">
      <p>
        <span className="font-semibold">
          {outside ? '' : 'Suggested: '}
          {suggestionHeadline(event)}.
        </span>{' '}
        <span className="text-ink-700">{event.suggestionReason}</span>
      </p>
      {outside ? (
        <p className="text-sm text-ink-700">Change the asset’s calibration interval by hand, or widen the policy’s range in the settings.</p>
      ) : event.intervalDecision ? (
        <p className="text-sm">
          <span className="font-semibold">{decisionWords[event.intervalDecision]}</span>
          {event.intervalDecision === 'accepted' && moves ? ' — the due date now follows the new interval.' : '.'}
        </p>
      ) : canDecide ? (
        <div className="flex flex-wrap items-center gap-2">
          <Button
            variant="primary"
            size="sm"
            busy={decide.isPending && decide.variables?.decision === 'accept'}
            disabled={decide.isPending}
            onClick={() => decide.mutate({ eventId: event.id, decision: 'accept' }, { onSuccess: onDecided })}
          >
            Accept
          </Button>
          <Button
            size="sm"
            busy={decide.isPending && decide.variables?.decision === 'decline'}
            disabled={decide.isPending}
            onClick={() => decide.mutate({ eventId: event.id, decision: 'decline' }, { onSuccess: onDecided })}
          >
            Decline
          </Button>
          <span className="text-sm text-ink-700">{moves ? 'Accepting moves the due date.' : ''}</span>
        </div>
      ) : (
        <p className="text-sm text-ink-700">Waiting for the owner to accept or decline.</p>
      )}
      {decide.isError ? <Notice tone="error">{decide.error.message}</Notice> : null}
    </div>
  );
}
