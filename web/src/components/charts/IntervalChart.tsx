import { niceTicks, paddedRange } from "./niceTicks";

/** A value with an optional interval; `flagged` points are drawn as open diamonds, not by colour alone. */
export interface IntervalPoint {
  id: string;
  name: string;
  x: number;
  y: number;
  low?: number | null;
  high?: number | null;
  flagged?: boolean;
}

export interface IntervalChartProps {
  /** What the drawing shows, read out by screen readers (give the numbers in a table beside it). */
  label: string;
  xLabel: string;
  yLabel: string;
  points: IntervalPoint[];
  /** A horizontal band drawn behind the points, e.g. a tolerance. */
  band?: { low: number; high: number; label: string };
  /** Straight or broken lines through (x, y) pairs, e.g. a fitted line. */
  lines?: { label: string; points: [number, number][]; dashed?: boolean; colour?: string }[];
  /** Labelled stretches of the x axis, shaded in turn (e.g. batches on one vessel). */
  segments?: { from: number; to: number; label: string }[];
  /** Named x ticks; round numbers are used when absent. */
  xTicks?: { value: number; label: string }[];
  xDomain?: [number, number];
  formatX?: (v: number) => string;
  formatY?: (v: number) => string;
  /** Said in the legend for a flagged point. */
  flaggedWord?: string;
}

const W = 760;
const H = 380;
const M = { left: 86, right: 18, top: 34, bottom: 66 };
const INK = "#23343d";
const GRID = "#d3dcdf";
const ALARM = "#9e1c1c";
const LINE = "#7a4600";
const BAND = "#0e5c63";

const plain = (v: number) => Number(v.toPrecision(4)).toString();

/** A point chart with interval bars, a band and lines, drawn as SVG so a few dozen points read exactly. */
export function IntervalChart({ label, xLabel, yLabel, points, band, lines = [], segments = [], xTicks, xDomain, formatX = plain, formatY = plain, flaggedWord = "flagged" }: IntervalChartProps) {
  const ys = points.flatMap((p) => [p.y, p.low ?? Number.NaN, p.high ?? Number.NaN]).concat(band ? [band.low, band.high] : [], lines.flatMap((l) => l.points.map((q) => q[1])));
  const [y0, y1] = paddedRange(ys);
  const [x0, x1] = xDomain ?? paddedRange(points.map((p) => p.x).concat(lines.flatMap((l) => l.points.map((q) => q[0]))), 0.06);
  const sx = (x: number) => M.left + ((x - x0) / (x1 - x0)) * (W - M.left - M.right);
  const sy = (y: number) => H - M.bottom - ((y - y0) / (y1 - y0)) * (H - M.top - M.bottom);
  const yTicks = niceTicks(y0, y1, 5).filter((t) => t >= y0 && t <= y1);
  const ticksX = xTicks ?? niceTicks(x0, x1, 6).filter((t) => t >= x0 && t <= x1).map((value) => ({ value, label: formatX(value) }));
  const clip = (y: number) => Math.min(H - M.bottom, Math.max(M.top, sy(y)));
  const hasFlagged = points.some((p) => p.flagged);
  const hasBars = points.some((p) => p.low != null && p.high != null);

  return (
    <div className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="h-auto w-full" style={{ fontFamily: "Public Sans, sans-serif" }}>
        {segments.map((s, i) => (
          <g key={`${s.label}-${s.from}`}>
            {i % 2 === 1 && <rect x={sx(s.from)} y={M.top} width={Math.max(0, sx(s.to) - sx(s.from))} height={H - M.top - M.bottom} fill="#f3f6f7" />}
            {i > 0 && <line x1={sx(s.from)} x2={sx(s.from)} y1={M.top - 4} y2={H - M.bottom} stroke="#76858d" strokeWidth={1.5} />}
            <text x={(sx(s.from) + sx(s.to)) / 2} y={M.top - 10} textAnchor="middle" fontSize="14" fontWeight="600" fill={INK}>
              {s.label}
            </text>
          </g>
        ))}
        {yTicks.map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={sy(t)} y2={sy(t)} stroke={GRID} />
            <text x={M.left - 8} y={sy(t) + 5} textAnchor="end" fontSize="14" fill={INK}>
              {formatY(t)}
            </text>
          </g>
        ))}
        {band && (
          <g>
            <rect x={M.left} width={W - M.left - M.right} y={sy(band.high)} height={Math.max(0, sy(band.low) - sy(band.high))} fill={BAND} fillOpacity={0.1} />
            <line x1={M.left} x2={W - M.right} y1={sy(band.high)} y2={sy(band.high)} stroke={BAND} strokeWidth={2} strokeDasharray="8 5" />
            <line x1={M.left} x2={W - M.right} y1={sy(band.low)} y2={sy(band.low)} stroke={BAND} strokeWidth={2} strokeDasharray="8 5" />
          </g>
        )}
        {ticksX.map((t) => (
          <g key={`x${t.value}`}>
            <line x1={sx(t.value)} x2={sx(t.value)} y1={H - M.bottom} y2={H - M.bottom + 6} stroke={INK} />
            <text x={sx(t.value)} y={H - M.bottom + 22} textAnchor="middle" fontSize="13" fill={INK}>
              {t.label}
            </text>
          </g>
        ))}
        <line x1={M.left} x2={W - M.right} y1={H - M.bottom} y2={H - M.bottom} stroke={INK} />
        <line x1={M.left} x2={M.left} y1={M.top} y2={H - M.bottom} stroke={INK} />
        <text x={(M.left + W - M.right) / 2} y={H - 12} textAnchor="middle" fontSize="15" fontWeight="600" fill={INK}>
          {xLabel}
        </text>
        <text transform={`translate(18 ${(M.top + H - M.bottom) / 2}) rotate(-90)`} textAnchor="middle" fontSize="15" fontWeight="600" fill={INK}>
          {yLabel}
        </text>
        {lines.map((l) => (
          <polyline key={l.label} points={l.points.map(([x, y]) => `${sx(x)},${clip(y)}`).join(" ")} fill="none" stroke={l.colour ?? LINE} strokeWidth={2.5} strokeDasharray={l.dashed ? "10 6" : undefined} />
        ))}
        {points.map((p) => {
          const cx = sx(p.x);
          const cy = sy(p.y);
          const colour = p.flagged ? ALARM : INK;
          return (
            <g key={p.id}>
              <title>{`${p.name}: ${formatY(p.y)}${p.low != null && p.high != null ? ` (${formatY(p.low)} to ${formatY(p.high)})` : ""}${p.flagged ? `, ${flaggedWord}` : ""}`}</title>
              {p.low != null && p.high != null && (
                <g stroke={colour} strokeWidth={2}>
                  <line x1={cx} x2={cx} y1={clip(p.low)} y2={clip(p.high)} />
                  <line x1={cx - 7} x2={cx + 7} y1={clip(p.low)} y2={clip(p.low)} />
                  <line x1={cx - 7} x2={cx + 7} y1={clip(p.high)} y2={clip(p.high)} />
                </g>
              )}
              {p.flagged ? (
                <polygon points={`${cx},${cy - 10} ${cx + 10},${cy} ${cx},${cy + 10} ${cx - 10},${cy}`} fill="white" stroke={ALARM} strokeWidth={3} />
              ) : (
                <circle cx={cx} cy={cy} r={6} fill={INK} />
              )}
            </g>
          );
        })}
      </svg>
      <ul className="flex flex-wrap gap-x-6 gap-y-1 text-[0.9rem]" aria-label="Key to the chart">
        <li className="inline-flex items-center gap-2">
          <svg width="18" height="18" aria-hidden="true">
            <circle cx="9" cy="9" r="6" fill={INK} />
          </svg>
          Value{hasBars ? ", with its 95 % interval as a bar" : ""}
        </li>
        {hasFlagged && (
          <li className="inline-flex items-center gap-2">
            <svg width="22" height="22" aria-hidden="true">
              <polygon points="11,1 21,11 11,21 1,11" fill="white" stroke={ALARM} strokeWidth="3" />
            </svg>
            Open diamond: {flaggedWord}
          </li>
        )}
        {band && (
          <li className="inline-flex items-center gap-2">
            <svg width="28" height="14" aria-hidden="true">
              <rect x="0" y="2" width="28" height="10" fill={BAND} fillOpacity="0.1" />
              <line x1="0" x2="28" y1="2" y2="2" stroke={BAND} strokeWidth="2" strokeDasharray="6 3" />
              <line x1="0" x2="28" y1="12" y2="12" stroke={BAND} strokeWidth="2" strokeDasharray="6 3" />
            </svg>
            {band.label}
          </li>
        )}
        {lines.map((l) => (
          <li key={l.label} className="inline-flex items-center gap-2">
            <svg width="28" height="10" aria-hidden="true">
              <line x1="0" x2="28" y1="5" y2="5" stroke={l.colour ?? LINE} strokeWidth="2.5" strokeDasharray={l.dashed ? "7 4" : undefined} />
            </svg>
            {l.label}
          </li>
        ))}
      </ul>
    </div>
  );
}
