import { currencyDigits, formatMoney, useFirmFormat } from '../../../lib/format';
import type { RevenueRow } from '../../../../shared/billing/views';
import { monthsBetween } from './months';
import { ScrollBox } from '../../../components/scroll-box';

const W = 760;
const H = 260;
const L = 64;
const R = 12;
const T = 14;
const B = 34;

/** Fills that read apart without colour: solids, hatches, dots and rules in ink and brass (the legend's swatches use the chart's patterns). */
const fills = ['#28334a', '#b08d3c', 'url(#rev-hatch)', 'url(#rev-dots)', 'url(#rev-rules)', 'url(#rev-cross)'];

function Patterns() {
  return (
    <defs>
      <pattern id="rev-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill="#fffdf8" />
        <line x1="0" y1="0" x2="0" y2="6" stroke="#28334a" strokeWidth="2.4" />
      </pattern>
      <pattern id="rev-dots" width="6" height="6" patternUnits="userSpaceOnUse">
        <rect width="6" height="6" fill="#f1e6c9" />
        <circle cx="3" cy="3" r="1.4" fill="#7a5f22" />
      </pattern>
      <pattern id="rev-rules" width="6" height="5" patternUnits="userSpaceOnUse">
        <rect width="6" height="5" fill="#fffdf8" />
        <line x1="0" y1="2.5" x2="6" y2="2.5" stroke="#5b6474" strokeWidth="1.6" />
      </pattern>
      <pattern id="rev-cross" width="7" height="7" patternUnits="userSpaceOnUse">
        <rect width="7" height="7" fill="#fffdf8" />
        <path d="M0 0L7 7M7 0L0 7" stroke="#7a5f22" strokeWidth="1.2" />
      </pattern>
    </defs>
  );
}

/** A round step for about four grid lines over `span`. */
function tickStep(span: number): number {
  const rough = span / 4;
  const pow = 10 ** Math.floor(Math.log10(rough));
  return [1, 2, 2.5, 5, 10].map((f) => f * pow).find((s) => s >= rough) ?? rough;
}

/**
 * The value axis for stacked bars that may go below zero (a month whose credit notes outweigh its invoices): each month
 * stacks its positive parts up from zero and its negative parts down from it, and the axis spans the lowest and highest
 * stack on round steps, zero included.
 */
export function valueAxis(stacks: number[][]): { bottom: number; top: number; ticks: number[] } {
  const highest = Math.max(0, ...stacks.map((parts) => parts.filter((v) => v > 0).reduce((a, b) => a + b, 0)));
  const lowest = Math.min(0, ...stacks.map((parts) => parts.filter((v) => v < 0).reduce((a, b) => a + b, 0)));
  const step = tickStep(Math.max(1, highest - lowest));
  const top = step * Math.max(1, Math.ceil(highest / step));
  const bottom = step * Math.floor(lowest / step);
  return { bottom, top, ticks: Array.from({ length: Math.round((top - bottom) / step) + 1 }, (_, i) => bottom + i * step) };
}

/** Each part's span on the axis: positives stacked up from zero, negatives down from it, in the order given. */
export function stackSpans(parts: number[]): { from: number; to: number }[] {
  let up = 0;
  let down = 0;
  return parts.map((v) => {
    const from = v >= 0 ? up : down;
    if (v >= 0) up += v;
    else down += v;
    return { from, to: from + v };
  });
}

interface Series {
  key: string;
  name: string;
  byMonth: Map<string, number>;
  total: number;
}

function seriesOf(rows: RevenueRow[]): Series[] {
  const series = new Map<string, Series>();
  for (const row of rows) {
    const key = row.kitId ?? 'none';
    const s = series.get(key) ?? { key, name: row.kitName, byMonth: new Map(), total: 0 };
    s.byMonth.set(row.month, (s.byMonth.get(row.month) ?? 0) + row.revenueMinor);
    s.total += row.revenueMinor;
    series.set(key, s);
  }
  return [...series.values()].sort((a, b) => b.total - a.total);
}

/** Invoiced revenue per kit per month as stacked bars with a legend, and the same numbers as a table. */
export function RevenueChart({ rows, from, to, currency }: { rows: RevenueRow[]; from: string; to: string; currency: string }) {
  const months = monthsBetween(from, to);
  const series = seriesOf(rows);
  const f = useFirmFormat();
  const monthTotal = (m: string) => series.reduce((sum, s) => sum + (s.byMonth.get(m) ?? 0), 0);
  const { bottom, top, ticks } = valueAxis(months.map((m) => series.map((s) => s.byMonth.get(m) ?? 0)));
  const band = (W - L - R) / Math.max(1, months.length);
  const y = (v: number) => T + ((top - v) / (top - bottom)) * (H - T - B);
  const money = (minor: number) => formatMoney(minor, currency);
  const axisFormat = new Intl.NumberFormat(f.locale, { style: 'currency', currency, maximumFractionDigits: 0 });
  const axisMoney = (minor: number) => axisFormat.format(minor / 10 ** currencyDigits(currency));
  const fillOf = (i: number) => fills[i % fills.length];
  const summary = `Revenue per kit per month, ${f.month(from)} to ${f.month(to)}: ${months.map((m) => `${f.month(m)} ${money(monthTotal(m))}`).join('; ')}.`;

  return (
    <figure className="flex flex-col gap-3">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={summary}>
        <Patterns />
        {ticks.map((v) => (
          <g key={v}>
            <line x1={L} x2={W - R} y1={y(v)} y2={y(v)} stroke="#ebe3d3" />
            <text x={L - 6} y={y(v) + 4} textAnchor="end" fontSize={11} fill="#3a4660">
              {axisMoney(v)}
            </text>
          </g>
        ))}
        <line x1={L} x2={L} y1={T} y2={H - B} stroke="#a7afbd" />
        {months.map((m, i) => {
          const x = L + i * band + band * 0.18;
          const spans = stackSpans(series.map((s) => s.byMonth.get(m) ?? 0));
          return (
            <g key={m}>
              {series.map((s, si) => {
                const v = s.byMonth.get(m) ?? 0;
                if (!v) return null;
                const { from: a, to: b } = spans[si];
                return (
                  <rect
                    key={s.key}
                    x={x}
                    width={band * 0.64}
                    y={y(Math.max(a, b))}
                    height={Math.abs(y(a) - y(b))}
                    fill={fillOf(si)}
                    stroke="#1c2536"
                    strokeWidth={0.8}
                  >
                    <title>{`${s.name}, ${f.month(m)}: ${money(v)}`}</title>
                  </rect>
                );
              })}
              <text x={L + i * band + band / 2} y={H - B + 16} textAnchor="middle" fontSize={11} fill="#3a4660">
                {f.month(m)}
              </text>
            </g>
          );
        })}
        {/* The zero line over the bars: credits hang below it. */}
        <line x1={L} x2={W - R} y1={y(0)} y2={y(0)} stroke="#1c2536" strokeWidth={1.2} />
      </svg>
      <figcaption>
        <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-800" aria-label="Legend">
          {series.map((s, i) => (
            <li key={s.key} className="inline-flex items-center gap-1.5">
              <svg width="14" height="14" aria-hidden="true">
                <rect x="0.5" y="0.5" width="13" height="13" fill={fillOf(i)} stroke="#1c2536" />
              </svg>
              {s.name}
            </li>
          ))}
        </ul>
      </figcaption>
      <RevenueTable series={series} months={months} money={money} monthTotal={monthTotal} month={f.month} />
    </figure>
  );
}

function RevenueTable({
  series,
  months,
  money,
  monthTotal,
  month,
}: {
  series: Series[];
  months: string[];
  money: (minor: number) => string;
  monthTotal: (m: string) => number;
  month: (isoMonth: string) => string;
}) {
  const cell = 'px-2 py-1 text-right tabular-nums whitespace-nowrap';
  return (
    <ScrollBox label="Revenue per kit per month">
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-semibold text-ink-900">Revenue per kit per month</caption>
        <thead className="bg-paper-deep">
          <tr>
            <th scope="col" className="px-2 py-1">
              Kit
            </th>
            {months.map((m) => (
              <th key={m} scope="col" className={cell}>
                {month(m)}
              </th>
            ))}
            <th scope="col" className={cell}>
              Total
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-line">
          {series.map((s) => (
            <tr key={s.key}>
              <th scope="row" className="px-2 py-1 font-semibold whitespace-nowrap">
                {s.name}
              </th>
              {months.map((m) => (
                <td key={m} className={cell}>
                  {s.byMonth.get(m) ? money(s.byMonth.get(m)!) : '—'}
                </td>
              ))}
              <td className={`${cell} font-semibold`}>{money(s.total)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot className="border-t-2 border-paper-line font-semibold">
          <tr>
            <th scope="row" className="px-2 py-1">
              All kits
            </th>
            {months.map((m) => (
              <td key={m} className={cell}>
                {money(monthTotal(m))}
              </td>
            ))}
            <td className={cell}>{money(series.reduce((sum, s) => sum + s.total, 0))}</td>
          </tr>
        </tfoot>
      </table>
    </ScrollBox>
  );
}
