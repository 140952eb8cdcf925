import { addDays } from '../../../lib/calibration';
import { formatCalendarDate, formatCount, useFirmFormat } from '../../../lib/format';

const W = 760;
const H = 190;
const L = 30;
const R = 8;
const T = 14;
const B = 36;

const utc = (d: string) => new Date(`${d}T00:00:00Z`);

/**
 * How many items fall due each week for the next 52 weeks, as bars labelled by
 * month, so the busy weeks for the lab show at a glance. The dashed line is the
 * end of the firm's due-soon window. The same numbers sit in a table below.
 */
export function DueTimeline({ weeks, today, dueSoonDays }: { weeks: { weekStart: string; count: number }[]; today: string; dueSoonDays: number }) {
  const { month } = useFirmFormat();
  if (!weeks.length) return null;
  const max = Math.max(1, ...weeks.map((w) => w.count));
  const top = max <= 4 ? max : Math.ceil(max / 2) * 2;
  const slot = (W - L - R) / weeks.length;
  const barW = Math.max(2, slot - 3);
  const x = (i: number) => L + i * slot;
  const y = (n: number) => T + (1 - n / top) * (H - T - B);
  const ticks = top <= 4 ? Array.from({ length: top + 1 }, (_, i) => i) : [0, top / 2, top];
  const total = weeks.reduce((s, w) => s + w.count, 0);
  const busiest = weeks.reduce((a, b) => (b.count > a.count ? b : a), weeks[0]);
  const windowEnd = addDays(today, dueSoonDays);
  const windowIndex = weeks.findIndex((w) => w.weekStart > windowEnd);
  const windowX =
    windowIndex < 0 ? null : x(windowIndex - 1) + ((utc(windowEnd).getTime() - utc(weeks[windowIndex - 1].weekStart).getTime()) / (7 * 864e5)) * slot;
  // A month's label sits under the week holding its 1st day; the first week is labelled too when no label follows closely.
  const monthStarts = weeks
    .map((w, i) => ({ i, d: utc(w.weekStart) }))
    .filter(({ d }) => d.getUTCDate() === 1 || new Date(d.getTime() + 6 * 864e5).getUTCMonth() !== d.getUTCMonth())
    .map(({ i, d }) => ({ i, d: d.getUTCDate() === 1 ? d : new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1)) }));
  if (!monthStarts.length || monthStarts[0].i >= 3) monthStarts.unshift({ i: 0, d: utc(weeks[0].weekStart) });
  const summary =
    total === 0
      ? 'Nothing falls due in the next 52 weeks.'
      : `${formatCount(total)} ${total === 1 ? 'item falls' : 'items fall'} due in the next 52 weeks; the busiest week starts ${formatCalendarDate(busiest.weekStart)} with ${busiest.count}.`;

  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={`Due-date timeline. ${summary}`}>
        {ticks.map((v) => (
          <g key={v}>
            <line x1={L} x2={W - R} y1={y(v)} y2={y(v)} stroke="#ebe3d3" />
            <text x={L - 6} y={y(v) + 4} textAnchor="end" fontSize={11} fill="#3a4660">
              {v}
            </text>
          </g>
        ))}
        {weeks.map((w, i) =>
          w.count > 0 ? (
            <rect key={w.weekStart} x={x(i) + 1.5} y={y(w.count)} width={barW} height={H - B - y(w.count)} fill="#28334a" rx={1.5}>
              <title>{`Week of ${formatCalendarDate(w.weekStart)}: ${w.count} due`}</title>
            </rect>
          ) : null,
        )}
        {/* The first week holds today: a brass tick under it. */}
        <rect x={x(0) + 1.5} y={H - B + 2} width={barW} height={3} fill="#b08d3c" />
        {windowX !== null ? (
          <g>
            <line x1={windowX} x2={windowX} y1={T - 4} y2={H - B} stroke="#7a5f22" strokeWidth={1.4} strokeDasharray="4 3" />
            <text x={windowX + 4} y={T + 4} fontSize={11} fill="#7a5f22">
              due-soon window ends
            </text>
          </g>
        ) : null}
        <line x1={L} x2={W - R} y1={H - B} y2={H - B} stroke="#a7afbd" />
        {monthStarts.map(({ i, d }) => (
          <g key={i}>
            <line x1={x(i)} x2={x(i)} y1={H - B} y2={H - B + 6} stroke="#a7afbd" />
            <text x={x(i) + 2} y={H - B + 18} fontSize={11} fill="#3a4660">
              {month(d.toISOString().slice(0, 7))}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="flex flex-wrap gap-x-4 text-sm text-ink-700">
        <span>{summary}</span>
        <span>Bars: items due that week (weeks start Monday). Brass tick: this week. Dashed line: end of the {dueSoonDays}-day due-soon window.</span>
      </figcaption>
      <details className="text-sm">
        <summary className="cursor-pointer font-semibold text-brass-deep">Show the timeline as a table</summary>
        <table className="mt-2 w-full max-w-md border-collapse text-left">
          <caption className="sr-only">Items falling due per week</caption>
          <thead>
            <tr className="border-b border-paper-line">
              <th scope="col" className="py-1 pr-4">
                Week starting
              </th>
              <th scope="col" className="py-1 text-right">
                Items due
              </th>
            </tr>
          </thead>
          <tbody>
            {weeks.map((w) => (
              <tr key={w.weekStart} className="border-b border-paper-line/60">
                <td className="py-0.5 pr-4">{formatCalendarDate(w.weekStart)}</td>
                <td className="py-0.5 text-right font-mono">{w.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
