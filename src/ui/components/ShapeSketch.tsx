// The vessel's outline drawn to the proportions typed (diameter, straight length, head depth), so a
// slip of a unit shows as a wrong shape at once. Inline SVG, no level.
import type { ShapePreview } from '../state/vessel-preview.ts';

export function ShapeSketch({ outline, caption }: { outline: NonNullable<ShapePreview['outline']>; caption: string }) {
  const { orientation, diameterM: D, straightM: L, headM: h } = outline;
  const long = L + 2 * h;
  const scale = 180 / Math.max(long, D, 1e-9);
  const len = long * scale, dia = D * scale, head = h * scale;
  const W = orientation === 'horizontal' ? len + 20 : dia + 20;
  const H = orientation === 'horizontal' ? dia + 20 : len + 20;
  const path = orientation === 'horizontal'
    ? `M${10 + head} 10H${10 + len - head}${head > 0 ? `A${head} ${dia / 2} 0 0 1 ${10 + len - head} ${10 + dia}` : `V${10 + dia}`}H${10 + head}${head > 0 ? `A${head} ${dia / 2} 0 0 1 ${10 + head} 10` : 'V10'}Z`
    : `M10 ${10 + head}V${10 + len - head}${head > 0 ? `A${dia / 2} ${head} 0 0 0 ${10 + dia} ${10 + len - head}` : `H${10 + dia}`}V${10 + head}${head > 0 ? `A${dia / 2} ${head} 0 0 0 10 ${10 + head}` : 'H10'}Z`;
  return (
    <svg class="picture shape-sketch" viewBox={`0 0 ${Math.max(W, 60)} ${Math.max(H, 40)}`} role="img" aria-label={caption}>
      <path class="svg-shell" d={path} />
    </svg>
  );
}
