// The error chart: as-found (filled) and as-left (open) errors at each calibration, the log's
// offset for each check (small, grey), the class as a band around zero.
import type { InstrumentHistory } from '../../store/index.ts';
import type { PairDrift } from '../state/pair-drift.ts';
import { CHART, errorChartGeometry } from './error-chart-data.ts';

export function ErrorChart({ history, pairs }: { history: InstrumentHistory; pairs: readonly PairDrift[] }) {
  const g = errorChartGeometry(history, pairs);
  if (g.empty) return null;
  return (
    <svg class="picture error-chart" viewBox={`0 0 ${CHART.width} ${CHART.height}`} role="img" aria-labelledby="ec-title ec-desc" data-offsets={g.offsets.length} data-calibrations={g.found.length}>
      <title id="ec-title">Errors of {history.instrument.tag} over time ({g.unit})</title>
      <desc id="ec-desc">
        {g.found.length} as-found errors (filled), {g.left.length} as-left errors (open), {g.offsets.length} offsets from logged saturated checks (small grey dots){g.band ? '; the shaded band is the class' : ''}.
      </desc>
      {g.band ? <rect class="chart-band" x={CHART.left} y={g.band.y} width={CHART.right - CHART.left} height={g.band.height} /> : null}
      <path class="svg-axis" d={`M${CHART.left} ${CHART.top}V${CHART.bottom}H${CHART.right}`} />
      <path class="chart-zero" d={`M${CHART.left} ${g.zeroY}H${CHART.right}`} />
      {g.yTicks.map((t) => <text key={t.label + t.at} class="svg-text" x={CHART.left - 4} y={t.at + 4} text-anchor="end">{t.label}</text>)}
      {g.xTicks.map((t, i) => <text key={t.label + i} class="svg-text" x={t.at} y={CHART.bottom + 16} text-anchor={i === 0 ? 'start' : 'end'}>{t.label}</text>)}
      <text class="svg-text" x={CHART.left} y={12}>error, {g.unit}</text>
      {g.offsets.map((o, i) => <circle key={`o${i}`} class="chart-offset" cx={o.x} cy={o.y} r={1.8} />)}
      {g.found.map((p) => <circle key={`f${p.id}`} class="chart-found" cx={p.x} cy={p.y} r={4} />)}
      {g.left.map((p) => <circle key={`l${p.id}`} class="chart-left" cx={p.x} cy={p.y} r={5.5} />)}
    </svg>
  );
}
