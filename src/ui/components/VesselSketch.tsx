// A sketch of the vessel with the liquid level and its ± band. Proportions only; not to scale
// for the heads.
import { useId } from 'preact/hooks';

export interface SketchData {
  orientation: 'vertical' | 'horizontal';
  /** Liquid level as a fraction of the inside height, 0–1, and its band. */
  level: number;
  low: number;
  high: number;
  caption: string;
  /** What the percentage is of: 'of inside height' or 'of the volume'. */
  note: string;
}

export function VesselSketch({ data }: { data: SketchData }) {
  const clip = `shell-${useId()}`;
  const vertical = data.orientation === 'vertical';
  const w = vertical ? 110 : 200, h = vertical ? 200 : 110;
  const x0 = vertical ? 45 : 20, y0 = 10, r = vertical ? 55 : 55;
  const W = vertical ? 200 : 240, H = vertical ? 240 : 150;
  const yAt = (f: number) => y0 + h * (1 - Math.min(1, Math.max(0, f)));
  return (
    <svg class="picture" viewBox={`0 0 ${W} ${H}`} role="img" aria-label={data.caption}>
      <defs>
        <clipPath id={clip}><rect x={x0} y={y0} width={w} height={h} rx={r} ry={vertical ? 40 : r} /></clipPath>
      </defs>
      <rect class="svg-shell" x={x0} y={y0} width={w} height={h} rx={r} ry={vertical ? 40 : r} />
      <g clip-path={`url(#${clip})`}>
        <rect class="svg-water" x={x0} y={yAt(data.level)} width={w} height={y0 + h - yAt(data.level)} />
        <rect class="svg-band" x={x0} y={yAt(data.high)} width={w} height={Math.max(1, yAt(data.low) - yAt(data.high))} />
      </g>
      <line class="svg-level" x1={x0 - 8} x2={x0 + w + 8} y1={yAt(data.level)} y2={yAt(data.level)} />
      <rect class="svg-shell" x={x0} y={y0} width={w} height={h} rx={r} ry={vertical ? 40 : r} fill-opacity="0" />
      <text class="svg-text svg-caption" x={W / 2} y={H - 8} text-anchor="middle">{Math.round(data.level * 100)} % {data.note}</text>
    </svg>
  );
}
