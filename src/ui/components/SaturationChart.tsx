// The saturation line p(T) around the reading, with the measured point and its tolerance box.
// Drawn in the display units handed in; this component only maps values to pixels.
import { formatNumber } from '../state/format.ts';

export interface ChartData {
  /** Points on the saturation line, display units, T rising. */
  curve: readonly { T: number; p: number }[];
  point: { T: number; p: number };
  box: { Tmin: number; Tmax: number; pmin: number; pmax: number };
  tLabel: string;
  pLabel: string;
}

const W = 320, H = 220, L = 52, R = 10, TOP = 12, B = 36;

export function SaturationChart({ data }: { data: ChartData }) {
  const Ts = [...data.curve.map((c) => c.T), data.box.Tmin, data.box.Tmax];
  const ps = [...data.curve.map((c) => c.p), data.box.pmin, data.box.pmax];
  const t0 = Math.min(...Ts), t1 = Math.max(...Ts);
  const p0 = Math.min(...ps), p1 = Math.max(...ps);
  const x = (T: number) => L + ((T - t0) / (t1 - t0 || 1)) * (W - L - R);
  const y = (p: number) => H - B - ((p - p0) / (p1 - p0 || 1)) * (H - TOP - B);
  const path = data.curve.map((c, i) => `${i ? 'L' : 'M'}${x(c.T).toFixed(1)} ${y(c.p).toFixed(1)}`).join(' ');
  const summary = `Saturation line from ${formatNumber(t0)} to ${formatNumber(t1)} ${data.tLabel}; the reading ` +
    `${formatNumber(data.point.T)} ${data.tLabel}, ${formatNumber(data.point.p)} ${data.pLabel} is marked with its tolerance box.`;
  return (
    <svg class="picture" viewBox={`0 0 ${W} ${H}`} role="img" aria-label={summary}>
      <path class="svg-axis" d={`M${L} ${TOP} V${H - B} H${W - R}`} />
      <text class="svg-text" x={L} y={H - B + 14} text-anchor="middle">{formatNumber(t0)}</text>
      <text class="svg-text" x={W - R} y={H - B + 14} text-anchor="end">{formatNumber(t1)}</text>
      <text class="svg-text" x={(L + W - R) / 2} y={H - 4} text-anchor="middle">T, {data.tLabel}</text>
      <text class="svg-text" x={L - 4} y={H - B} text-anchor="end">{formatNumber(p0)}</text>
      <text class="svg-text" x={L - 4} y={TOP + 10} text-anchor="end">{formatNumber(p1)}</text>
      <text class="svg-text" x={4} y={(TOP + H - B) / 2} >p</text>
      <text class="svg-text" x={4} y={(TOP + H - B) / 2 + 13}>{data.pLabel}</text>
      <text class="svg-text" x={4} y={(TOP + H - B) / 2 + 26}>abs</text>
      <rect class="svg-box" x={x(data.box.Tmin)} y={y(data.box.pmax)}
        width={Math.max(2, x(data.box.Tmax) - x(data.box.Tmin))} height={Math.max(2, y(data.box.pmin) - y(data.box.pmax))} />
      <path class="svg-curve" d={path} />
      <circle class="svg-point" cx={x(data.point.T)} cy={y(data.point.p)} r={5} />
    </svg>
  );
}
