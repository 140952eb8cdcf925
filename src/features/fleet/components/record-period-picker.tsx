import { useId } from 'react';
import { Button } from '../../../components/button';
import type { RecordPeriodChoice } from '../api/keys';

const inputClasses = 'min-h-10 rounded-md border border-paper-line bg-card px-2';

/** The record's period: first and last day (both included), each optional; "All time" clears both. */
export function RecordPeriodPicker({ period, onChange }: { period: RecordPeriodChoice; onChange: (period: RecordPeriodChoice) => void }) {
  const fromId = useId();
  const toId = useId();
  const backwards = !!period.from && !!period.to && period.to < period.from;
  const set = (end: 'from' | 'to', value: string) => onChange({ ...period, [end]: value || undefined });
  return (
    <fieldset className="mb-4 flex flex-wrap items-end gap-3 rounded-md border border-paper-line bg-card p-3">
      <legend className="px-1 text-sm font-semibold text-ink-800">Period</legend>
      <div className="flex flex-col gap-1">
        <label htmlFor={fromId} className="text-sm font-semibold text-ink-800">
          First day
        </label>
        <input id={fromId} type="date" value={period.from ?? ''} max={period.to} onChange={(e) => set('from', e.target.value)} className={inputClasses} />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={toId} className="text-sm font-semibold text-ink-800">
          Last day
        </label>
        <input
          id={toId}
          type="date"
          value={period.to ?? ''}
          min={period.from}
          onChange={(e) => set('to', e.target.value)}
          className={inputClasses}
          aria-invalid={backwards || undefined}
        />
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
