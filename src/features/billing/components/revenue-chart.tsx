import { currencyDigits, formatMoney } from '../../../lib/format';
import type { RevenueRow } from '../../../../shared/billing/views';
import { monthLong, monthShort, monthsBetween } from './months';
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

/** A round step for about four grid lines up to `max`. */
function tickStep(max: number): number {
  const rough = max / 4;
  const pow = 10 ** Math.floor(Math.log10(rough));
  return [1, 2, 2.5, 5, 10].map((f) => f * pow).find((s) => s >= rough) ?? rough;
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
  const monthTotal = (m: string) => series.reduce((sum, s) => sum + (s.byMonth.get(m) ?? 0), 0);
  const step = tickStep(Math.max(1, ...months.map(monthTotal)));
  const top = step * Math.ceil(Math.max(1, ...months.map(monthTotal)) / step);
  const ticks = Array.from({ length: Math.round(top / step) + 1 }, (_, i) => i * step);
  const band = (W - L - R) / Math.max(1, months.length);
  const y = (v: number) => T + (1 - v / top) * (H - T - B);
  const money = (minor: number) => formatMoney(minor, currency);
  const axisFormat = new Intl.NumberFormat(undefined, { style: 'currency', currency, maximumFractionDigits: 0 });
  const axisMoney = (minor: number) => axisFormat.format(minor / 10 ** currencyDigits(currency));
  const fillOf = (i: number) => fills[i % fills.length];
  const summary = `Revenue per kit per month, ${monthLong(from)} to ${monthLong(to)}: ${months.map((m) => `${monthShort(m)} ${money(monthTotal(m))}`).join('; ')}.`;

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
        <line x1={L} x2={W - R} y1={H - B} y2={H - B} stroke="#a7afbd" />
        {months.map((m, i) => {
          const x = L + i * band + band * 0.18;
          let base = 0;
          return (
            <g key={m}>
              {series.map((s, si) => {
                const v = s.byMonth.get(m) ?? 0;
                if (!v) return null;
                const rect = (
                  <rect
                    key={s.key}
                    x={x}
                    width={band * 0.64}
                    y={y(base + v)}
                    height={y(base) - y(base + v)}
                    fill={fillOf(si)}
                    stroke="#1c2536"
                    strokeWidth={0.8}
                  >
                    <title>{`${s.name}, ${monthLong(m)}: ${money(v)}`}</title>
                  </rect>
                );
                base += v;
                return rect;
              })}
              <text x={L + i * band + band / 2} y={H - B + 16} textAnchor="middle" fontSize={11} fill="#3a4660">
                {monthShort(m)}
              </text>
            </g>
          );
        })}
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
      <RevenueTable series={series} months={months} money={money} monthTotal={monthTotal} />
    </figure>
  );
}

function RevenueTable({
  series,
  months,
  money,
  monthTotal,
}: {
  series: Series[];
  months: string[];
  money: (minor: number) => string;
  monthTotal: (m: string) => number;
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
                <abbr title={monthLong(m)} className="no-underline">
                  {monthShort(m)}
                </abbr>
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
