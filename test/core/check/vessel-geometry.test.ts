import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  headDepthM,
  headVolumeM3,
  horizontalHeadVolumeM3,
  liquidLevelFromVolume,
  liquidVolumeFromLevel,
  vesselLevelSpanM,
  vesselVolume,
  type CylinderGeometry,
  type HeadSpec,
} from '../../../src/core/check/vessel-geometry.ts';
import { InputError } from '../../../src/core/errors.ts';

const HEADS: HeadSpec[] = [
  { kind: 'flat' },
  { kind: 'semi-ellipsoidal-2-1' },
  { kind: 'hemispherical' },
  { kind: 'torispherical' },
  { kind: 'torispherical', crownRadiusM: 0.8, knuckleRadiusM: 0.1 },
];

/** Independent check: integrate the head slice areas πρ(z)² written out from the head's definition. */
function integratedVerticalHead(D: number, L: number, r: number, h: number): number {
  const R = D / 2;
  const hd = L - Math.sqrt((L - r) ** 2 - (R - r) ** 2);
  const n = 20000;
  let sum = 0;
  const top = Math.min(h, hd);
  for (let i = 0; i < n; i++) {
    const z = ((i + 0.5) * top) / n;
    // The crown meets the knuckle where the line from the crown centre (axis, z = L) through the
    // knuckle centre (radius R − r, z = h_d) pierces both circles, at distance L from the crown centre.
    const zTangent = L + ((hd - L) * L) / (L - r);
    const rho = z <= zTangent
      ? Math.sqrt(L * L - (L - z) ** 2)
      : R - r + Math.sqrt(r * r - (hd - z) ** 2);
    sum += Math.PI * rho * rho;
  }
  return (sum * top) / n;
}

describe('head volumes (solid geometry)', () => {
  it('2:1 semi-ellipsoidal head holds π·D³/24 and is D/4 deep (half an ellipsoid of revolution, (2/3)·π·R²·a with a = D/4)', () => {
    for (const D of [0.3, 1, 1.2, 2.5]) {
      expect(headVolumeM3({ kind: 'semi-ellipsoidal-2-1' }, D)).toBeCloseTo((Math.PI * D ** 3) / 24, 12);
      expect(headDepthM({ kind: 'semi-ellipsoidal-2-1' }, D)).toBeCloseTo(D / 4, 14);
    }
  });
  it('hemispherical head holds π·D³/12 (half a sphere, (2/3)·π·R³)', () => {
    for (const D of [0.3, 1, 1.2, 2.5]) {
      expect(headVolumeM3({ kind: 'hemispherical' }, D)).toBeCloseTo((Math.PI * D ** 3) / 12, 12);
    }
  });
  it('standard ASME F&D head (L = D, r = 0.06 D) holds about 0.0810·D³ and is 0.169 D deep (computed by numerical integration of the crown and knuckle profile in /usr/bin/python3: 0.08100, 0.16934; handbook charts give about 0.0809·D³, from memory)', () => {
    const D = 1;
    expect(headVolumeM3({ kind: 'torispherical' }, D)).toBeCloseTo(0.081, 3);
    expect(headDepthM({ kind: 'torispherical' }, D)).toBeCloseTo(0.169, 3);
    expect(headVolumeM3({ kind: 'torispherical' }, 2) / 8).toBeCloseTo(0.081, 3);
  });
  it('10 % knuckle and 80-10 heads: 0.0990·D³ and 0.1099·D³ (computed by numerical integration of the head profile in /usr/bin/python3: 0.09897, 0.10988)', () => {
    expect(headVolumeM3({ kind: 'torispherical', crownRadiusM: 1, knuckleRadiusM: 0.1 }, 1)).toBeCloseTo(0.099, 3);
    expect(headVolumeM3({ kind: 'torispherical', crownRadiusM: 0.8, knuckleRadiusM: 0.1 }, 1)).toBeCloseTo(0.1099, 4);
  });
  it('torispherical closed form matches slice integration at every depth (independent integral in this test)', () => {
    for (const [L, r] of [[1, 0.06], [0.8, 0.1], [0.9, 0.17]] as const) {
      const head: HeadSpec = { kind: 'torispherical', crownRadiusM: L, knuckleRadiusM: r };
      const hd = headDepthM(head, 1);
      for (const f of [0.05, 0.3, 0.6, 0.9, 1]) {
        const g: CylinderGeometry = { shape: 'vertical-cylinder', innerDiameterM: 1, straightLengthM: 0, head };
        expect(liquidVolumeFromLevel(g, f * hd)).toBeCloseTo(integratedVerticalHead(1, L, r, f * hd), 6);
      }
    }
  });
  it('a torispherical head with r = L = D/2 is a hemisphere (geometry identity)', () => {
    expect(headVolumeM3({ kind: 'torispherical', crownRadiusM: 0.5, knuckleRadiusM: 0.5 }, 1)).toBeCloseTo(Math.PI / 12, 10);
  });
});

describe('horizontal torispherical heads', () => {
  const heads: Extract<HeadSpec, { kind: 'torispherical' }>[] = [
    { kind: 'torispherical' },
    { kind: 'torispherical', crownRadiusM: 0.8, knuckleRadiusM: 0.1 },
    { kind: 'torispherical', crownRadiusM: 1.0, knuckleRadiusM: 0.15 },
  ];
  it('empty at the bottom, half at the axis, full at the top, and V(R + d) + V(R − d) = the whole head (symmetry about the axis, to 1e-13)', () => {
    for (const head of heads) {
      const D = 1.2;
      const full = headVolumeM3(head, D);
      expect(horizontalHeadVolumeM3(head, D, 0)).toBe(0);
      expect(horizontalHeadVolumeM3(head, D, D)).toBe(full);
      expect(horizontalHeadVolumeM3(head, D, D / 2) / (full / 2)).toBeCloseTo(1, 13);
      for (const d of [0.001, 0.05, 0.2, 0.45, 0.599]) {
        const pair = horizontalHeadVolumeM3(head, D, D / 2 + d) + horizontalHeadVolumeM3(head, D, D / 2 - d);
        expect(pair / full).toBeCloseTo(1, 13);
      }
    }
  });
  it('agrees with an independent integration over the head\'s cross-section (axial depth of the head at each point of the disk, midpoint sums in polar form, to 1e-8 of the head)', () => {
    for (const head of heads) {
      const D = 1.2;
      const full = headVolumeM3(head, D);
      for (const f of [0.03, 0.2, 0.5, 0.77, 0.98]) {
        const h = f * D;
        expect(Math.abs(horizontalHeadVolumeM3(head, D, h) - crossSectionIntegral(head, D, h)) / full).toBeLessThan(1e-8);
      }
    }
  });
  it('the level solve inverts the volume to 1e-12 of it, and volume rises with level', () => {
    for (const head of heads) {
      const g: CylinderGeometry = { shape: 'horizontal-cylinder', innerDiameterM: 1.2, straightLengthM: 2.5, head };
      const V = vesselVolume(g);
      let last = -1;
      for (const f of [1e-9, 0.001, 0.1, 0.33, 0.5, 0.71, 0.999, 1 - 1e-9]) {
        const h = liquidLevelFromVolume(g, f * V);
        expect(liquidVolumeFromLevel(g, h) / (f * V)).toBeCloseTo(1, 9);
        expect(h).toBeGreaterThan(last);
        last = h;
      }
      expect(liquidLevelFromVolume(g, 0)).toBe(0);
      expect(liquidLevelFromVolume(g, V)).toBe(1.2);
    }
  });
});

/**
 * Liquid volume of one horizontal torispherical head below level h, by a formulation of its own: over
 * the head's circular cross-section (radius R), the head's axial depth at distance s from the axis is
 * h_d − z(s), with z(s) the profile solved for z; summed over the part of the disk below the liquid
 * surface, in polar form (s, θ) with midpoint sums.
 */
function crossSectionIntegral(head: Extract<HeadSpec, { kind: 'torispherical' }>, D: number, h: number): number {
  const R = D / 2;
  const L = head.crownRadiusM ?? D;
  const r = head.knuckleRadiusM ?? 0.06 * D;
  const hd = L - Math.sqrt((L - r) ** 2 - (R - r) ** 2);
  // Crown and knuckle meet where the crown sphere's radius through the knuckle centre crosses it.
  const sJoin = (L * (R - r)) / (L - r);
  const zOf = (s: number) => (s <= sJoin ? L - Math.sqrt(L * L - s * s) : hd - Math.sqrt(Math.max(0, r * r - (s - (R - r)) ** 2)));
  const y = h - R;
  const ay = Math.abs(y);
  // Inside s < |y| every circle is wholly below (y > 0) or wholly above (y < 0) the surface.
  // From |y| to R the arc below the surface and the depth both behave like square roots at the
  // ends, so s = |y| + (R − |y|)·(1 − cos πu)/2 grades the midpoint grid towards both.
  const N = 20000;
  let sum = 0;
  const pieces: [number, number, (s: number) => number][] = [
    [0, ay, (s) => (y > 0 ? 2 * Math.PI * s : 0)],
    [ay, R, (s) => 2 * Math.acos(Math.max(-1, Math.min(1, -y / s))) * s],
  ];
  for (const [a, b, arc] of pieces) {
    for (let i = 0; i < N; i++) {
      const s0 = a + ((b - a) * (1 - Math.cos((Math.PI * i) / N))) / 2;
      const s1 = a + ((b - a) * (1 - Math.cos((Math.PI * (i + 1)) / N))) / 2;
      const s = 0.5 * (s0 + s1);
      sum += (hd - zOf(s)) * arc(s) * (s1 - s0);
    }
  }
  return sum;
}

describe('vessel volume and partial volumes', () => {
  const example: CylinderGeometry = {
    shape: 'horizontal-cylinder',
    innerDiameterM: 1.2,
    straightLengthM: 3,
    head: { kind: 'semi-ellipsoidal-2-1' },
  };
  it('horizontal D = 1.2 m, L_c = 3.0 m, 2:1 heads holds 3.845 m³ (π·R²·L_c + 2·π·D³/24 = 3.8453)', () => {
    expect(vesselVolume(example)).toBeCloseTo(3.845, 3);
  });
  it('its level at 10/50/80/90/95 % of volume is 16.1/50.0/74.2/83.9/89.9 % of D (bisection on the closed forms, computed in /usr/bin/python3: 16.09 / 50.00 / 74.18 / 83.91 / 89.89)', () => {
    const V = vesselVolume(example);
    const cases = [[0.1, 16.1], [0.5, 50.0], [0.8, 74.2], [0.9, 83.9], [0.95, 89.9]] as const;
    for (const [fraction, levelPercent] of cases) {
      const h = liquidLevelFromVolume(example, fraction * V);
      expect((100 * h) / 1.2).toBeCloseTo(levelPercent, 1);
    }
  });
  it('horizontal shell segment area R²·acos((R−h)/R) − (R−h)·√(2Rh−h²) (circular segment, plane geometry), flat heads', () => {
    const g: CylinderGeometry = { shape: 'horizontal-cylinder', innerDiameterM: 2, straightLengthM: 5, head: { kind: 'flat' } };
    const R = 1;
    for (const h of [0.1, 0.5, 1, 1.7]) {
      const area = R * R * Math.acos((R - h) / R) - (R - h) * Math.sqrt(2 * R * h - h * h);
      expect(liquidVolumeFromLevel(g, h)).toBeCloseTo(area * 5, 10);
    }
    expect(liquidVolumeFromLevel(g, 1)).toBeCloseTo(vesselVolume(g) / 2, 12);
  });
  it('vertical cylinder: level inside the straight part adds π·R²·(h − h_d) (a cylinder of height h − h_d)', () => {
    const g: CylinderGeometry = { shape: 'vertical-cylinder', innerDiameterM: 1, straightLengthM: 2, head: { kind: 'hemispherical' } };
    expect(liquidVolumeFromLevel(g, 1.5)).toBeCloseTo(Math.PI / 12 + Math.PI * 0.25 * 1, 12);
  });
  it('every shape: empty at 0, full at the top, half by symmetry at mid-span, level ↔ volume round trip (geometry identity)', () => {
    for (const shape of ['vertical-cylinder', 'horizontal-cylinder'] as const) {
      for (const head of HEADS) {
        const g: CylinderGeometry = { shape, innerDiameterM: 1.6, straightLengthM: 2.2, head };
        const V = vesselVolume(g);
        const span = vesselLevelSpanM(g);
        expect(liquidVolumeFromLevel(g, 0)).toBe(0);
        expect(liquidVolumeFromLevel(g, span)).toBeCloseTo(V, 5);
        expect(liquidVolumeFromLevel(g, span / 2)).toBeCloseTo(V / 2, 5);
        for (const f of [0.01, 0.2, 0.5, 0.77, 0.999]) {
          const h = liquidLevelFromVolume(g, f * V);
          expect(liquidVolumeFromLevel(g, h) / V).toBeCloseTo(f, 9);
        }
      }
    }
  });
  it('volume rises monotonically with level (fast-check, geometry identity)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...HEADS.slice(0, 4), { kind: 'torispherical-80-10' } as const),
        fc.constantFrom('vertical-cylinder' as const, 'horizontal-cylinder' as const),
        fc.double({ min: 0.5, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (pick, shape, D, Lc, a, b) => {
          const head: HeadSpec = pick.kind === 'torispherical-80-10'
            ? { kind: 'torispherical', crownRadiusM: 0.8 * D, knuckleRadiusM: 0.1 * D }
            : pick;
          const g: CylinderGeometry = { shape, innerDiameterM: D, straightLengthM: head.kind === 'flat' ? Lc + 0.1 : Lc, head };
          const span = vesselLevelSpanM(g);
          const [lo, hi] = a < b ? [a, b] : [b, a];
          const vLo = liquidVolumeFromLevel(g, lo * span);
          const vHi = liquidVolumeFromLevel(g, hi * span);
          return vLo >= 0 && vLo <= vHi + 1e-14 * vesselVolume(g);
        },
      ),
      { numRuns: 1000 },
    );
  });
});

describe('geometry that does not close (issue 3, bad input)', () => {
  const base = { shape: 'vertical-cylinder' as const, innerDiameterM: 1, straightLengthM: 1 };
  const cases: [string, Parameters<typeof vesselVolume>[0]][] = [
    ['internal volume', { shape: 'stated-volume', volumeM3: 0 }],
    ['internal volume', { shape: 'stated-volume', volumeM3: -1 }],
    ['internal volume', { shape: 'stated-volume', volumeM3: Number.NaN }],
    ['inner diameter', { ...base, innerDiameterM: 0, head: { kind: 'flat' } }],
    ['straight length', { ...base, straightLengthM: -0.1, head: { kind: 'flat' } }],
    ['straight length', { ...base, straightLengthM: 0, head: { kind: 'flat' } }],
    ['knuckle radius', { ...base, head: { kind: 'torispherical', knuckleRadiusM: 0.6 } }],
    ['knuckle radius', { ...base, head: { kind: 'torispherical', knuckleRadiusM: 0 } }],
    ['crown radius', { ...base, head: { kind: 'torispherical', crownRadiusM: 0.4 } }],
  ];
  for (const [field, g] of cases) {
    it(`refuses ${JSON.stringify(g)} naming "${field}" and its range`, () => {
      try {
        vesselVolume(g);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).field).toBe(field);
        expect((e as InputError).message).toMatch(/range|must/);
      }
    });
  }
  it('refuses a level outside the vessel and a volume above the vessel', () => {
    const g: CylinderGeometry = { ...base, head: { kind: 'flat' } };
    expect(() => liquidVolumeFromLevel(g, 1.01)).toThrow(InputError);
    expect(() => liquidLevelFromVolume(g, 1)).toThrow(/liquid volume/);
  });
});
