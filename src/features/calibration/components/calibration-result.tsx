import { Link } from 'react-router-dom';
import { buttonClasses } from '../../../components/button';
import { Notice } from '../../../components/notice';
import { FactList, Panel } from '../../../components/panel';
import { formatCalendarDate } from '../../../lib/format';
import type { CalibrationEventView } from '../../../../shared/calibration/views';
import { effectiveDueOn, months, ResultChip } from './calibration-words';
import { IntervalSuggestion } from './interval-decision';

/** What a saved calibration changed: the new due date, the interval suggestion, and the impact review when found out of tolerance. */
export function CalibrationResult({
  event,
  assetTag,
  canDecide,
  onDecided,
}: {
  event: CalibrationEventView;
  assetTag: string;
  canDecide: boolean;
  onDecided: (event: CalibrationEventView) => void;
}) {
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="success" title="Calibration saved">
        {assetTag} is now calibrated until {formatCalendarDate(effectiveDueOn(event))} (valid through that day).
      </Notice>
      {event.asFound === 'out_of_tolerance' ? (
        <Notice tone="caution" title="Found out of tolerance: an impact review is open">
          Every job that used {assetTag} since its last passing evidence needs a look.{' '}
          <Link to={`/calibration/impact/${event.assetId}`} className="font-semibold underline">
            Open the impact review
          </Link>
        </Notice>
      ) : null}
      <Panel title="The calibration">
        <FactList
          items={[
            { term: 'New due date', value: <strong>{formatCalendarDate(effectiveDueOn(event))}</strong> },
            { term: 'Performed on', value: formatCalendarDate(event.performedOn) },
            { term: 'Provider', value: event.provider },
            {
              term: 'Certificate',
              value: (
                <a href={event.certificateUrl} target="_blank" rel="noopener" className="font-mono font-semibold text-brass-deep underline">
                  {event.certificateNumber} (PDF)
                </a>
              ),
            },
            {
              term: 'Results',
              value: (
                <span className="flex flex-wrap gap-2">
                  <ResultChip stage="As found" result={event.asFound} />
                  <ResultChip stage="As left" result={event.asLeft} />
                </span>
              ),
            },
            { term: 'Interval', value: months(event.intervalDecision === 'accepted' ? event.suggestedIntervalMonths : event.intervalMonths) },
          ]}
        />
      </Panel>
      <Panel title="Interval review">
        <IntervalSuggestion event={event} canDecide={canDecide} onDecided={onDecided} />
      </Panel>
      <div className="flex flex-wrap gap-2">
        <Link to={`/fleet/${event.assetId}`} className={buttonClasses('primary')}>
          Back to {assetTag}
        </Link>
      </div>
    </div>
  );
}
