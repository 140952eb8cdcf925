import { formatCount } from '../../../lib/format';
import type { UtilisationRow } from '../../../../shared/billing/views';

/** Booked days over available days per kit: a bar and the same share in words. */
export function UtilisationBars({ rows }: { rows: UtilisationRow[] }) {
  const sorted = [...rows].sort((a, b) => b.ratio - a.ratio || a.kitName.localeCompare(b.kitName));
  return (
    <ul className="flex flex-col gap-2">
      {sorted.map((row) => {
        const percent = Math.round(row.ratio * 100);
        return (
          <li key={row.kitId} className="grid gap-x-3 gap-y-1 sm:grid-cols-[minmax(10rem,14rem)_1fr_minmax(12rem,auto)] sm:items-center">
            <span className="font-semibold text-ink-900">{row.kitName}</span>
            <span aria-hidden="true" className="h-4 overflow-hidden rounded-sm border border-ink-700 bg-card">
              <span className="block h-full bg-ink-800" style={{ width: `${Math.min(100, percent)}%` }} />
            </span>
            <span className="text-sm text-ink-800 tabular-nums">
              {percent} % — {formatCount(row.bookedDays)} of {formatCount(row.availableDays)} days booked
            </span>
          </li>
        );
      })}
    </ul>
  );
}
