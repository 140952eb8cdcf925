import type { TipPosition } from '../../../lib/assets';
import { formatDate, formatNumber } from '../../../lib/format';
import type { CheckView, TipForecastView } from '../../../../shared/checks/views';
import { positionWords } from './check-words';

type TipCheck = Extract<CheckView, { kind: 'tip_validation' }>;

const W = 560;
const H = 200;
const L = 44;
const R = 12;
const T = 12;
const B = 30;

/** Shape per position, so the two series read apart without colour. */
function Marker({ x, y, position, fail }: { x: number; y: number; position: TipPosition; fail: boolean }) {
  if (fail) return <path d={`M${x - 5} ${y - 5} L${x + 5} ${y + 5} M${x - 5} ${y + 5} L${x + 5} ${y - 5}`} stroke="#a23b2c" strokeWidth={2.4} />;
  return position === 'vertical' ? (
    <circle cx={x} cy={y} r={3.2} fill="#1c2536" />
  ) : (
    <rect x={x - 4.5} y={y - 4.5} width={9} height={9} fill="#fffdf8" stroke="#1c2536" strokeWidth={2} />
  );
}

/**
 * The largest deviation of each tip validation over time, against the dashed
 * tolerance line, so drift shows before it fails. Vertical: filled dots;
 * horizontal: open squares; a failed check: ✕. With forecasts, each position's
 * fitted trend runs on (dotted) to the day it meets its limit (◆), with the
 * likely window drawn as a bar on the limit.
 */
export function ValidationHistoryChart({ checks, forecasts = [] }: { checks: TipCheck[]; forecasts?: TipForecastView[] }) {
  const points = [...checks].sort((a, b) => a.performedAt.localeCompare(b.performedAt));
  if (points.length < 2) {
    return <p className="text-sm text-ink-700">The trend appears once the tip has two validations or more.</p>;
  }
  const times = points.map((c) => new Date(c.performedAt).getTime());
  const t0 = times[0];
  const noonOf = (day: string) => Date.parse(`${day}T12:00:00Z`);
  const reaches = forecasts.flatMap((f) => (f.forecast.state === 'forecast' ? [noonOf(f.forecast.reachesOn)] : []));
  const t1 = Math.max(times[times.length - 1], t0 + 1, ...reaches);
  const top = Math.max(...points.map((c) => Math.max(c.result.maxDeviationUm, c.result.toleranceUm))) * 1.15;
  const x = (t: number) => L + ((t - t0) / (t1 - t0)) * (W - L - R);
  const y = (v: number) => T + (1 - v / top) * (H - T - B);
  const ticks = [0, top / 3, (2 * top) / 3].map((v) => Math.round(v));
  // Horizontal (open squares) first, so a vertical dot at the same moment stays visible on top.
  const positions = [...new Set(points.map((c) => c.position))].sort((a, b) => (a === 'horizontal' ? -1 : b === 'horizontal' ? 1 : 0));
  // The last tolerance runs on to the chart's end, where a forecast may reach it.
  const tolerancePath = `${points.map((c, i) => `${i === 0 ? 'M' : 'L'}${x(times[i])} ${y(c.result.toleranceUm)}`).join(' ')} L${W - R} ${y(points[points.length - 1].result.toleranceUm)}`;
  const summary = `Largest deviation per tip validation: ${points
    .map(
      (c) =>
        `${formatDate(c.performedAt)} ${c.position} ${formatNumber(c.result.maxDeviationUm)} µm of ${formatNumber(c.result.toleranceUm)} µm (${c.result.decision})`,
    )
    .join('; ')}.`;

  return (
    <figure className="flex flex-col gap-1">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={summary}>
        {ticks.map((v) => (
          <g key={v}>
            <line x1={L} x2={W - R} y1={y(v)} y2={y(v)} stroke="#ebe3d3" />
            <text x={L - 6} y={y(v) + 4} textAnchor="end" fontSize={11} fill="#3a4660">
              {v}
            </text>
          </g>
        ))}
        <text x={4} y={T + 4} fontSize={11} fill="#3a4660">
          µm
        </text>
        <line x1={L} x2={L} y1={T} y2={H - B} stroke="#a7afbd" />
        <line x1={L} x2={W - R} y1={H - B} y2={H - B} stroke="#a7afbd" />
        <path d={tolerancePath} fill="none" stroke="#7a5f22" strokeWidth={1.6} strokeDasharray="6 4" />
        <text x={L + 4} y={y(points[points.length - 1].result.toleranceUm) - 5} fontSize={11} fill="#7a5f22">
          tolerance
        </text>
        {positions.map((p) => {
          const series = points.map((c, i) => ({ c, t: times[i] })).filter((s) => s.c.position === p);
          return (
            <g key={p}>
              <path
                d={series.map((s, i) => `${i === 0 ? 'M' : 'L'}${x(s.t)} ${y(s.c.result.maxDeviationUm)}`).join(' ')}
                fill="none"
                stroke="#28334a"
                strokeWidth={1.2}
                strokeDasharray={p === 'horizontal' ? '2 2' : undefined}
              />
              {series.map((s) => (
                <Marker key={s.c.id} x={x(s.t)} y={y(s.c.result.maxDeviationUm)} position={p} fail={s.c.result.decision === 'fail'} />
              ))}
            </g>
          );
        })}
        {forecasts.map((f) => {
          if (f.forecast.state === 'not_enough_history') return null;
          const { fit } = f.forecast;
          const start = Date.parse(fit.firstAt);
          const end = f.forecast.state === 'forecast' ? noonOf(f.forecast.reachesOn) : times[times.length - 1];
          const level = (t: number) => Math.min(top, Math.max(0, fit.interceptUm + (fit.slopeUmPerDay * (t - start)) / 86_400_000));
          return (
            <g key={`forecast-${f.position}`}>
              <line x1={x(start)} y1={y(level(start))} x2={x(end)} y2={y(level(end))} stroke="#7a5f22" strokeWidth={1.4} strokeDasharray="1.5 3" />
              {f.forecast.state === 'forecast' ? (
                <>
                  <rect
                    x={x(noonOf(f.forecast.earliestOn))}
                    y={y(f.forecast.limitUm) - 5}
                    width={Math.max(2, (f.forecast.latestOn ? x(Math.min(t1, noonOf(f.forecast.latestOn))) : W - R) - x(noonOf(f.forecast.earliestOn)))}
                    height={10}
                    fill="#c9a24a"
                    fillOpacity={0.5}
                    stroke="#7a5f22"
                    strokeWidth={1}
                  />
                  <path d={`M${x(end)} ${y(f.forecast.limitUm) - 6} l6 6 l-6 6 l-6 -6 z`} fill="#fffdf8" stroke="#7a5f22" strokeWidth={1.8} />
                </>
              ) : null}
            </g>
          );
        })}
        <text x={L} y={H - 10} fontSize={11} fill="#3a4660">
          {formatDate(points[0].performedAt)}
        </text>
        <text x={W - R} y={H - 10} textAnchor="end" fontSize={11} fill="#3a4660">
          {formatDate(t1)}
        </text>
      </svg>
      <figcaption className="flex flex-wrap gap-x-4 text-sm text-ink-700">
        {positions.map((p) => (
          <span key={p} className="inline-flex items-center gap-1">
            <svg width="12" height="12" aria-hidden="true">
              {p === 'vertical' ? (
                <circle cx="6" cy="6" r="4.5" fill="#1c2536" />
              ) : (
                <rect x="1.5" y="1.5" width="9" height="9" fill="#fffdf8" stroke="#1c2536" strokeWidth="2" />
              )}
            </svg>
            {positionWords[p]}
          </span>
        ))}
        <span>✕ failed</span>
        <span>– – – tolerance</span>
        {forecasts.some((f) => f.forecast.state !== 'not_enough_history') ? <span>· · · trend (Theil–Sen)</span> : null}
        {forecasts.some((f) => f.forecast.state === 'forecast') ? <span>◆ forecast limit day, bar: likely window</span> : null}
      </figcaption>
    </figure>
  );
}
