import type { Point } from '../../../lib/checks';
import { formatNumber } from '../../../lib/format';

const SIZE = 220;
const PAD = 18;
const HALF = (SIZE - 2 * PAD) / 2;
const C = SIZE / 2;

/** A round number of µm for the scale bar: 1, 2, 5 × 10^n, near a quarter of the half-width. */
function niceStep(extentUm: number): number {
  const raw = extentUm / 2;
  const pow = 10 ** Math.floor(Math.log10(raw));
  const m = raw / pow;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * pow;
}

interface Dev {
  n: number;
  a: number;
  b: number;
  outside: boolean;
}

function View({
  title,
  axes,
  devs,
  extentUm,
  toleranceUm,
}: {
  title: string;
  axes: [string, string];
  devs: Dev[];
  extentUm: number;
  toleranceUm: number | null;
}) {
  const k = HALF / extentUm; // px per µm
  const step = niceStep(extentUm);
  const summary = `${title}: ${devs
    .map((d) => `reading ${d.n} at ${axes[0]} ${formatNumber(d.a)} µm, ${axes[1]} ${formatNumber(d.b)} µm${d.outside ? ' (beyond tolerance)' : ''}`)
    .join('; ')}.`;
  return (
    <figure className="flex flex-col items-center gap-1">
      <svg viewBox={`0 0 ${SIZE} ${SIZE + 22}`} className="w-full max-w-[15rem]" role="img" aria-label={summary}>
        <rect x={PAD} y={PAD} width={SIZE - 2 * PAD} height={SIZE - 2 * PAD} fill="#fffdf8" stroke="#d9cfbb" />
        <line x1={PAD} x2={SIZE - PAD} y1={C} y2={C} stroke="#a7afbd" strokeWidth={0.8} />
        <line y1={PAD} y2={SIZE - PAD} x1={C} x2={C} stroke="#a7afbd" strokeWidth={0.8} />
        <text x={SIZE - PAD} y={C - 4} textAnchor="end" fontSize={10} fill="#3a4660">
          +{axes[0]}
        </text>
        <text x={C + 4} y={PAD + 10} fontSize={10} fill="#3a4660">
          +{axes[1]}
        </text>
        {toleranceUm ? <circle cx={C} cy={C} r={toleranceUm * k} fill="none" stroke="#7a5f22" strokeWidth={1.4} strokeDasharray="5 3" /> : null}
        {/* The reference point R: a ring with a cross. */}
        <circle cx={C} cy={C} r={4} fill="none" stroke="#1c2536" strokeWidth={1.4} />
        {devs.map((d) => {
          const x = C + d.a * k;
          const y = C - d.b * k;
          return (
            <g key={d.n}>
              {d.outside ? (
                <path d={`M${x - 4} ${y - 4} L${x + 4} ${y + 4} M${x - 4} ${y + 4} L${x + 4} ${y - 4}`} stroke="#a23b2c" strokeWidth={2.2} />
              ) : (
                <circle cx={x} cy={y} r={3.6} fill="#1c2536" />
              )}
              <text x={x + 5} y={y - 5} fontSize={10} fontWeight={600} fill="#1c2536">
                {d.n}
              </text>
            </g>
          );
        })}
        {/* Scale bar along the bottom. */}
        <line x1={PAD} x2={PAD + step * k} y1={SIZE + 4} y2={SIZE + 4} stroke="#1c2536" strokeWidth={2} />
        <line x1={PAD} x2={PAD} y1={SIZE} y2={SIZE + 8} stroke="#1c2536" />
        <line x1={PAD + step * k} x2={PAD + step * k} y1={SIZE} y2={SIZE + 8} stroke="#1c2536" />
        <text x={PAD + step * k + 6} y={SIZE + 8} fontSize={10} fill="#1c2536">
          {formatNumber(step, 1)} µm
        </text>
      </svg>
      <figcaption className="text-sm font-semibold text-ink-800">{title}</figcaption>
    </figure>
  );
}

/**
 * Where the readings sit around the reference point R, in µm: a top view (X–Y)
 * and a side view (X–Z), centred on R, with the tolerance as a dashed circle.
 * The circle is the limit on the 3-D distance; a reading beyond it in 3-D is
 * drawn as ✕ whatever its projection, so the shape tells it, not the colour.
 */
export function ReadingsSketch({ reference, readings, toleranceUm }: { reference: Point; readings: (Point | null)[]; toleranceUm: number | null }) {
  const devs = readings
    .map((p, i) => (p ? { n: i + 1, dx: (p.x - reference.x) * 1000, dy: (p.y - reference.y) * 1000, dz: (p.z - reference.z) * 1000 } : null))
    .filter((d): d is { n: number; dx: number; dy: number; dz: number } => d !== null);
  if (!devs.length) return null;
  const outside = (d: { dx: number; dy: number; dz: number }) => toleranceUm !== null && Math.hypot(d.dx, d.dy, d.dz) > toleranceUm;
  const largest = Math.max(...devs.flatMap((d) => [Math.abs(d.dx), Math.abs(d.dy), Math.abs(d.dz)]), toleranceUm ?? 0, 5);
  const extentUm = largest * 1.15;
  return (
    <div className="rounded-md border border-paper-line bg-paper/40 p-3">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <View
          title="Top view (X–Y)"
          axes={['X', 'Y']}
          extentUm={extentUm}
          toleranceUm={toleranceUm}
          devs={devs.map((d) => ({ n: d.n, a: d.dx, b: d.dy, outside: outside(d) }))}
        />
        <View
          title="Side view (X–Z)"
          axes={['X', 'Z']}
          extentUm={extentUm}
          toleranceUm={toleranceUm}
          devs={devs.map((d) => ({ n: d.n, a: d.dx, b: d.dz, outside: outside(d) }))}
        />
      </div>
      <p className="mt-2 text-sm text-ink-700">
        Centred on the reference point (ring). {toleranceUm ? `Dashed circle: tolerance ${formatNumber(toleranceUm)} µm. ` : ''}
        Dots are readings within it{toleranceUm ? '; ✕ marks a reading beyond it in 3-D' : ''}.
      </p>
    </div>
  );
}
