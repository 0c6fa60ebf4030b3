// Trend of one vessel: quality, liquid mass and pressure deviation from saturation over time, one
// panel each, a mark at every check with findings (coloured by its outcome, the worst signal word among them).
import type { TrendGeometry } from './trend-data.ts';

export function TrendChart({ geometry, title }: { geometry: TrendGeometry; title: string }) {
  const { width, height, plot, xTicks, xCaption, panels } = geometry;
  return (
    <svg class="picture trend-chart" viewBox={`0 0 ${width} ${height}`} role="img" aria-labelledby="trend-title trend-desc">
      <title id="trend-title">{title}</title>
      <desc id="trend-desc">
        {panels.map((p) => `${p.spec.title}: ${p.count} checks with a value`).join('; ')}. Marks show checks with findings, by outcome.
      </desc>
      {panels.map((p, index) => (
        <g key={p.spec.key} transform={`translate(0 ${p.offsetY})`}>
          <text class="svg-text trend-heading" x={plot.left} y={13}>{p.spec.title} ({p.spec.unit}){index === 0 && xCaption ? ` · ${xCaption}` : ''}</text>
          <path class="svg-axis" d={`M${plot.left} ${plot.top}V${plot.bottom}H${plot.right}`} />
          {p.yTicks.map((t) => (
            <g key={t.label}>
              <path class="trend-grid" d={`M${plot.left} ${t.at}H${plot.right}`} />
              <text class="svg-text trend-ylabel" x={plot.left - 4} y={t.at + 4}>{t.label}</text>
            </g>
          ))}
          {xTicks.map((t) => (
            <text key={t.label + t.at} class={`svg-text trend-xlabel trend-xlabel-${t.anchor ?? 'middle'}`} x={t.at} y={plot.bottom + 14}>{t.label}</text>
          ))}
          {p.path ? <path class="trend-line" d={p.path} /> : <text class="svg-text" x={plot.left + 8} y={plot.top + 24}>no values in this period</text>}
          {p.marks.map((m) => <circle key={m.id} class={`trend-mark trend-mark-${m.signal}`} cx={m.x} cy={m.y} r={3.5} />)}
        </g>
      ))}
    </svg>
  );
}
