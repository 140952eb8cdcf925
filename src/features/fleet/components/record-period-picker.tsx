import { useId } from 'react';
import { Button } from '../../../components/button';
import { DateInput } from '../../../components/date-field';
import { isCalendarDate } from '../../../../shared/dates/calendar-date';
import type { RecordPeriodChoice } from '../api/keys';

/** The record's period: first and last day (both included), each optional; "All time" clears both. */
export function RecordPeriodPicker({ period, onChange }: { period: RecordPeriodChoice; onChange: (period: RecordPeriodChoice) => void }) {
  const fromId = useId();
  const toId = useId();
  const backwards = !!period.from && !!period.to && period.to < period.from;
  // Text that is not a date yet keeps the period as it was until it is one.
  const set = (end: 'from' | 'to', value: string) => (value === '' || isCalendarDate(value) ? onChange({ ...period, [end]: value || undefined }) : undefined);
  return (
    <fieldset className="mb-4 flex flex-wrap items-end gap-3 rounded-md border border-paper-line bg-card p-3">
      <legend className="px-1 text-sm font-semibold text-ink-800">Period</legend>
      <div className="flex flex-col gap-1">
        <label htmlFor={fromId} className="text-sm font-semibold text-ink-800">
          First day
        </label>
        <DateInput id={fromId} value={period.from ?? ''} max={period.to} onValueChange={(value) => set('from', value)} />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={toId} className="text-sm font-semibold text-ink-800">
          Last day
        </label>
        <DateInput id={toId} value={period.to ?? ''} min={period.from} onValueChange={(value) => set('to', value)} invalid={backwards} />
      </div>
      <Button onClick={() => onChange({})} disabled={!period.from && !period.to}>
        All time
      </Button>
      <p className="basis-full text-sm text-ink-700" role={backwards ? 'alert' : undefined}>
        {backwards
          ? 'The last day must be on or after the first.'
          : !period.from && !period.to
            ? 'Showing everything on record for this item. The PDF covers the same period.'
            : 'Both days are included; the certificate that covered the first day is listed too. The PDF covers the same period.'}
      </p>
    </fieldset>
  );
}
