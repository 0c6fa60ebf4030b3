// A cycle as a picture: the measured temperature and T_sat(p) of the measured pressure over time,
// the cycle type's band shaded across, the hold shaded along. Inline SVG in the display unit
// handed in; the data is the core's cycleChart, this component only maps it to pixels.
import type { CycleChart as ChartData } from '../../core/cycle/index.ts';
import { temperatureFromK, type TemperatureUnit } from '../../core/units/index.ts';
import { formatNumber } from '../state/format.ts';
import { unitLabel } from '../state/unit-labels.ts';

const W = 340, H = 220, L = 44, R = 10, TOP = 12, B = 34;

export function CycleChart({ chart, unit }: { chart: ChartData; unit: TemperatureUnit }) {
  const t = (k: number) => temperatureFromK(k, unit);
  const values = [...chart.points.flatMap((p) => [t(p.temperatureK), t(p.saturationTemperatureK)]), t(chart.band.lowerK), t(chart.band.upperK)];
  const lo = Math.min(...values), hi = Math.max(...values);
  const span = hi - lo || 1;
  const y0 = lo - span * 0.05, y1 = hi + span * 0.05;
  const end = chart.durationS || 1;
  const x = (s: number) => L + (s / end) * (W - L - R);
  const y = (v: number) => H - B - ((v - y0) / (y1 - y0)) * (H - TOP - B);
  const line = (pick: (p: ChartData['points'][number]) => number) =>
    chart.points.map((p, i) => `${i ? 'L' : 'M'}${x(p.elapsedS).toFixed(1)} ${y(t(pick(p))).toFixed(1)}`).join(' ');
  const minutes = (s: number) => formatNumber(s / 60, 3);
  const u = unitLabel(unit);
  const hold = chart.hold;
  const summary = `Temperature and saturation temperature of the pressure over ${minutes(end)} min, in ${u}; ` +
    `band ${formatNumber(t(chart.band.lowerK))} to ${formatNumber(t(chart.band.upperK))} ${u} shaded` +
    (hold ? `; hold (${hold.status}) from ${minutes(hold.startS)} to ${minutes(hold.endS)} min shaded.` : '; the hold was not reached.');
  return (
    <figure class="cycle-chart" data-cycle-chart={chart.points.length}>
      <svg class="picture" viewBox={`0 0 ${W} ${H}`} role="img" aria-label={summary}>
        <rect class="svg-band" x={L} y={y(t(chart.band.upperK))} width={W - L - R} height={Math.max(1, y(t(chart.band.lowerK)) - y(t(chart.band.upperK)))} />
        {hold ? <rect class="cycle-hold" x={x(hold.startS)} y={TOP} width={Math.max(1, x(hold.endS) - x(hold.startS))} height={H - TOP - B} /> : null}
        <path class="svg-axis" d={`M${L} ${TOP} V${H - B} H${W - R}`} />
        <path class="cycle-saturation" d={line((p) => p.saturationTemperatureK)} />
        <path class="svg-curve" d={line((p) => p.temperatureK)} />
        <text class="svg-text" x={L} y={H - B + 14} text-anchor="middle">0</text>
        <text class="svg-text" x={W - R} y={H - B + 14} text-anchor="end">{minutes(end)}</text>
        <text class="svg-text" x={(L + W - R) / 2} y={H - 4} text-anchor="middle">time, min</text>
        <text class="svg-text" x={L - 4} y={y(y0) } text-anchor="end">{formatNumber(y0, 4)}</text>
        <text class="svg-text" x={L - 4} y={TOP + 10} text-anchor="end">{formatNumber(y1, 4)}</text>
        <text class="svg-text" x={4} y={(TOP + H - B) / 2}>{u}</text>
      </svg>
      <figcaption class="cycle-legend">
        <span class="legend-measured">measured T</span> · <span class="legend-saturation">T_sat(p), dashed</span> ·
        band shaded across · hold shaded along
      </figcaption>
    </figure>
  );
}
