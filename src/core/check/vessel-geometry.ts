// Internal volume of a closed vessel and the liquid volume ↔ liquid level relation, for vertical
// and horizontal cylinders with flat, 2:1 semi-ellipsoidal, hemispherical or torispherical
// (flanged and dished) heads. All dimensions are INSIDE dimensions in metres; the straight length
// runs between the head tangent lines and must include the heads' straight flanges.
// Formulas: closed forms of solid geometry (cylinder, spherical cap, ellipsoidal segment, circular
// segment), checked against numerical integration of the head profiles (agreement better than 10⁻⁶;
// test/core/check/vessel-geometry.test.ts integrates the torispherical head independently); the
// torispherical knuckle term is re-derived in the comments.

import { InputError } from '../errors.ts';
import { bisectionResult } from './bisection.ts';
import { gaussLegendre } from './quadrature.ts';

/** One head shape. A torispherical head without radii is the standard ASME F&D head. */
export type HeadSpec =
  | { kind: 'flat' }
  | { kind: 'semi-ellipsoidal-2-1' }
  | { kind: 'hemispherical' }
  | {
      kind: 'torispherical';
      /** Crown (dish) radius L, m; default the inner diameter D (standard ASME F&D). */
      crownRadiusM?: number;
      /** Knuckle radius r, m; default 0.06·D (standard ASME F&D). */
      knuckleRadiusM?: number;
    };

/** The vessel's shape: a stated internal volume (no level available), or a cylinder with heads. */
export type VesselGeometry =
  | { shape: 'stated-volume'; volumeM3: number }
  | {
      shape: 'vertical-cylinder' | 'horizontal-cylinder';
      /** Inner diameter D, m. */
      innerDiameterM: number;
      /** Straight length between tangent lines (straight flanges included), m; 0 allowed. */
      straightLengthM: number;
      /** Both ends carry this head. */
      head: HeadSpec;
    };

export type CylinderGeometry = Extract<VesselGeometry, { shape: 'vertical-cylinder' | 'horizontal-cylinder' }>;

/** Standard ASME flanged-and-dished proportions: crown radius = D, knuckle radius = 6 % of D (common practice; ASME BPVC Section VIII Div. 1 UG-32 bounds them: crown radius at most the skirt outside diameter, knuckle radius at least 6 % of it). */
export const STANDARD_FD_CROWN_FRACTION = 1;
export const STANDARD_FD_KNUCKLE_FRACTION = 0.06;

/** Resolved torispherical radii, m. */
interface Torus {
  R: number; // cylinder radius
  L: number; // crown radius
  r: number; // knuckle radius
  depth: number; // axial depth h_d
  z1: number; // crown–knuckle tangent, measured from the apex
  crownTop: number; // slice radius at the tangent, √(z1·(2L − z1)), m
  theta1: number; // the tangent's angle on the crown sphere, asin(crownTop / L), rad
  capAtTangent: number; // the crown's cap up to the tangent, crownCapOf(L, z1), m³
  fAtTangent: number; // knuckleF(r, h_d − z1), m²
}

// Hot paths below multiply instead of using `**`: in V8 `x ** 3` costs about 55 ns against 1 ns
// for x*x*x (measured in the check engine's level solve), and the level bisection evaluates these
// forms dozens of times per check. The products give the same doubles here (the engine fixture,
// test/core/check/engine-outputs.test.ts, holds every result byte-identical).
function torus(D: number, head: Extract<HeadSpec, { kind: 'torispherical' }>): Torus {
  const R = D / 2;
  const L = head.crownRadiusM ?? STANDARD_FD_CROWN_FRACTION * D;
  const r = head.knuckleRadiusM ?? STANDARD_FD_KNUCKLE_FRACTION * D;
  // (L − r)² = (R − r)² + (L − h_d)²: the knuckle centre circle lies on the crown sphere shrunk by r.
  const Lr = L - r;
  const Rr = R - r;
  const depth = L - Math.sqrt(Lr * Lr - Rr * Rr);
  // L = r = R is a hemisphere made entirely of knuckle: no crown, tangent at the apex.
  const z1 = L - r > 0 ? L - ((L - depth) * L) / (L - r) : 0;
  // Fixed per head: resolved here rather than in each of the level solve's head integrals.
  const crownTop = Math.sqrt(z1 * (2 * L - z1));
  return {
    R, L, r, depth, z1, crownTop,
    theta1: Math.asin(Math.min(1, crownTop / L)),
    capAtTangent: crownCapOf(L, z1),
    fAtTangent: knuckleF(r, depth - z1),
  };
}

/**
 * One head resolved for its diameter, once: the level solve evaluates the head's volume dozens of
 * times per check, and rebuilding the torispherical shape (square roots and all) inside each
 * evaluation cost more than the evaluation itself.
 */
interface HeadShape {
  head: HeadSpec;
  D: number;
  /** Cylinder radius, m. */
  R: number;
  /** Axial depth, m. */
  depth: number;
  /** Semi-axis along the vessel axis of an ellipsoidal or hemispherical head, m (0 otherwise). */
  a: number;
  /** Torispherical radii; null for the other kinds. */
  t: Torus | null;
}

function headShape(head: HeadSpec, D: number): HeadShape {
  const R = D / 2;
  switch (head.kind) {
    case 'flat':
      return { head, D, R, depth: 0, a: 0, t: null };
    case 'semi-ellipsoidal-2-1':
      return { head, D, R, depth: D / 4, a: R / 2, t: null };
    case 'hemispherical':
      return { head, D, R, depth: D / 2, a: R, t: null };
    case 'torispherical': {
      const t = torus(D, head);
      return { head, D, R, depth: t.depth, a: 0, t };
    }
  }
}

/** Axial depth of one head, m (0 for flat). D inner diameter, m. */
export function headDepthM(head: HeadSpec, D: number): number {
  return headShape(head, D).depth;
}

/**
 * Liquid volume in one head with its axis vertical, apex down, filled to depth h from the apex, m³.
 * Clamped: h ≤ 0 gives 0, h ≥ depth gives the full head.
 */
export function bottomHeadVolumeM3(head: HeadSpec, D: number, h: number): number {
  return bottomVolume(headShape(head, D), h);
}

function bottomVolume(shape: HeadShape, h: number): number {
  const R = shape.R;
  const t = shape.t;
  if (t === null) {
    if (shape.head.kind === 'flat') return 0;
    const a = shape.a;
    const y = clamp(h, 0, a);
    return (Math.PI * R * R * y * y * (3 * a - y)) / (3 * a * a);
  }
  const y = clamp(h, 0, t.depth);
  if (y <= t.z1) return crownCapOf(t.L, y);
  // Knuckle slice radius ρ(z) = c + √(r² − u²), u = h_d − z. ∫πρ² dz from z1 to y equals
  // π[(c² + r²)Δ + 2c(F(u1) − F(u2)) − (u1³ − u2³)/3] with F(u) = ∫√(r² − u²) du (knuckleF);
  // the parts fixed by the head (the cap to the tangent, F(u1)) are resolved with it.
  const c = t.R - t.r;
  const u1 = t.depth - t.z1;
  const u2 = t.depth - y;
  const knuckle = Math.PI * ((c * c + t.r * t.r) * (u1 - u2) + 2 * c * (t.fAtTangent - knuckleF(t.r, u2)) - (u1 * u1 * u1 - u2 * u2 * u2) / 3);
  return t.capAtTangent + knuckle;
}

/** F(u) = ∫√(r² − u²) du = ½(u·√(r² − u²) + r²·asin(u/r)), m²: r knuckle radius, m; |u| ≤ r (clamped). */
function knuckleF(r: number, u: number): number {
  return 0.5 * (u * Math.sqrt(Math.max(0, r * r - u * u)) + r * r * Math.asin(clamp(u / r, -1, 1)));
}

/** The crown's spherical cap of depth z on a sphere of radius L, m³. */
function crownCapOf(L: number, z: number): number {
  return (Math.PI * z * z * (3 * L - z)) / 3;
}

/** Full volume of one head, m³ (π·D³/24 for 2:1, π·D³/12 for hemispherical, ≈ 0.0810·D³ for standard F&D). */
export function headVolumeM3(head: HeadSpec, D: number): number {
  const shape = headShape(head, D);
  return bottomVolume(shape, shape.depth);
}

/** Area of a circle of radius ρ lying below the horizontal line at height y above its centre, m². */
function circleAreaBelow(rho: number, y: number): number {
  if (rho <= 0 || y <= -rho) return 0;
  if (y >= rho) return Math.PI * rho * rho;
  return segmentArea(rho, y + rho);
}

/**
 * Circular segment of depth h in a circle of radius R, m². Equal to R²·acos((R − h)/R) −
 * (R − h)·√(2Rh − h²) (the circular segment of plane geometry), written as ½R²(φ − sin φ) with the central angle
 * φ = 4·asin(√(h/2R)), a series for small φ, and the complement above mid-depth: the textbook
 * form cancels near the bottom and the top and can even go negative there.
 */
function segmentArea(R: number, h: number): number {
  if (h > R) return Math.PI * R * R - segmentArea(R, 2 * R - h);
  const phi = 4 * Math.asin(Math.sqrt(Math.max(0, h) / (2 * R)));
  const p2 = phi * phi;
  const phiMinusSin = phi < 0.1
    ? phi * p2 * (1 / 6 - p2 * (1 / 120 - p2 * (1 / 5040 - p2 / 362880)))
    : phi - Math.sin(phi);
  return 0.5 * R * R * phiMinusSin;
}

/** Slice radius of a head at axial distance z from its apex, m. */
function sliceRadius(shape: HeadShape, z: number): number {
  const R = shape.R;
  const t = shape.t;
  if (t === null) {
    if (shape.head.kind === 'flat') return R;
    const a = shape.a;
    const s = (a - z) / a;
    return R * Math.sqrt(Math.max(0, 1 - s * s));
  }
  if (z <= t.z1) {
    const Lz = t.L - z;
    return Math.sqrt(Math.max(0, t.L * t.L - Lz * Lz));
  }
  const u = t.depth - z;
  return t.R - t.r + Math.sqrt(Math.max(0, t.r * t.r - u * u));
}

/**
 * Liquid volume in one head of a horizontal vessel, filled to depth h from the bottom of the shell, m³.
 * Ellipsoids and spheres have the closed form π·a·h²·(3R − h)/(6R). The torispherical head has no
 * simple closed form; it is integrated over axial slices z from the apex (the slice of radius ρ(z)
 * is a disk, of which the part below the liquid surface, at height y = h − R above the axis,
 * counts): slices narrower than |y| are either whole (y > 0: the closed form of the vertical head
 * up to that z) or dry (y < 0); the rest, from z₀ where ρ(z₀) = |y| to the tangent line, are
 * circular segments, integrated by Gauss–Legendre quadrature in two pieces split at the
 * crown–knuckle tangent (a kink in the profile's curvature): the crown by the angle on its sphere,
 * the knuckle by z, each after a substitution (· = onset + width·s²) that makes the segment's
 * (ρ − |y|)^{3/2} onset smooth in s.
 * Checked against an independent two-dimensional integration over the head's cross-section
 * (test/core/check/vessel-geometry.test.ts).
 */
export function horizontalHeadVolumeM3(head: HeadSpec, D: number, h: number): number {
  return horizontalVolume(headShape(head, D), h);
}

function horizontalVolume(shape: HeadShape, h: number): number {
  const R = shape.R;
  const y = clamp(h, 0, shape.D);
  const t = shape.t;
  if (t === null) {
    if (shape.head.kind === 'flat') return 0;
    const a = shape.a;
    return (Math.PI * a * y * y * (3 * R - y)) / (6 * R);
  }
  torisphericalSegments(shape, t, y - R);
  return SEGMENTS[0] as number;
}

/** Scratch output of torisphericalSegments: [volume below the surface, m³; d(volume)/d(surface height), m²]. */
const SEGMENTS = new Float64Array(2);

/** Gauss–Legendre points per piece of the torispherical head integral: 16 agree with 64 to 1e-14 of the head volume at every depth tried, from near empty to near full and across the axis (12 only to 1e-12). */
const GAUSS_POINTS = 16;
const [GAUSS_X, GAUSS_W] = gaussLegendre(GAUSS_POINTS);

/** Axial distance from the apex of a torispherical head at which its slice radius is rho, m (0 ≤ rho ≤ R). */
function zAtRadius(t: Torus, rho: number): number {
  if (t.z1 > 0) {
    if (rho <= t.crownTop) return t.L - Math.sqrt(t.L * t.L - rho * rho);
  }
  const e = rho - (t.R - t.r);
  return t.depth - Math.sqrt(Math.max(0, t.r * t.r - e * e));
}

/**
 * Area of a slice (disk of radius rho, m) below the surface at height y, m², given the half chord
 * half = √(ρ² − y²): ρ²·acos(−y/ρ) + y·half (the circular segment of plane geometry), one inverse
 * cosine per node where segmentArea needs a sine as well. Its two terms cancel for a dry sliver
 * (y < 0, ρ − |y| ≪ ρ), which segmentArea's series handles instead, so a nearly empty vessel's
 * few litres stay exact to rounding.
 */
function slicePartBelow(rho: number, y: number, half: number): number {
  if (rho <= 0 || y <= -rho) return 0;
  if (y >= rho) return Math.PI * rho * rho;
  if (y < -0.5 * rho) return segmentArea(rho, y + rho);
  return rho * rho * Math.acos(-y / rho) + y * half;
}

/**
 * Fills SEGMENTS with the liquid volume of one torispherical head of a horizontal vessel whose
 * surface is y above the axis (−R ≤ y ≤ R), and its derivative in y (the integral of the chord
 * widths 2·√(ρ² − y²), what a Newton step on the level needs).
 */
function torisphericalSegments(shape: HeadShape, t: Torus, y: number): void {
  const R = t.R;
  if (y <= -R) {
    SEGMENTS[0] = 0;
    SEGMENTS[1] = 0;
    return;
  }
  const hd = t.depth;
  if (y >= R) {
    SEGMENTS[0] = bottomVolume(shape, hd);
    SEGMENTS[1] = 0;
    return;
  }
  const ay = Math.abs(y);
  const z0 = zAtRadius(t, ay);
  let volume = y > 0 ? bottomVolume(shape, z0) : 0;
  let slope = 0;
  const y2 = y * y;
  const L = t.L;
  if (z0 < t.z1) {
    // Crown slices from the onset to the tangent, by the angle θ on the crown sphere: ρ = L·sin θ,
    // z = L·(1 − cos θ), dz = L·sin θ dθ, smooth in θ from the apex to a hemisphere's rim (z has a
    // √ at the apex, ρ a √ at the rim), with θ = θ₀ + (θ₁ − θ₀)·s² for the onset.
    const theta0 = Math.asin(Math.min(1, ay / L));
    const theta1 = t.theta1;
    const width = theta1 - theta0;
    for (let i = 0; i < GAUSS_POINTS; i++) {
      const s = GAUSS_X[i] as number;
      const sinTheta = Math.sin(theta0 + width * s * s);
      const rho = L * sinTheta;
      const weight = (GAUSS_W[i] as number) * 2 * width * s * L * sinTheta;
      const half = Math.sqrt(Math.max(0, rho * rho - y2));
      volume += weight * slicePartBelow(rho, y, half);
      slope += weight * 2 * half;
    }
  }
  // Knuckle slices (all of them past the onset, or those from the onset): by z, smooth up to the
  // tangent, with z = z₀ + (h_d − z₀)·s² anchored at the onset even when it lies in the crown, so an
  // onset just short of the knuckle still reads smooth.
  const span = hd - z0;
  const s1 = t.z1 > z0 ? Math.sqrt((t.z1 - z0) / span) : 0;
  const width = 1 - s1;
  for (let i = 0; i < GAUSS_POINTS; i++) {
    const s = s1 + width * (GAUSS_X[i] as number);
    const z = z0 + span * s * s;
    const rho = sliceRadius(shape, z);
    const weight = (GAUSS_W[i] as number) * width * 2 * span * s;
    const half = Math.sqrt(Math.max(0, rho * rho - y2));
    volume += weight * slicePartBelow(rho, y, half);
    slope += weight * 2 * half;
  }
  SEGMENTS[0] = volume;
  SEGMENTS[1] = slope;
}

/** Internal volume of the vessel, m³. Throws InputError if the geometry is invalid (see validateGeometry). */
export function vesselVolume(geometry: VesselGeometry): number {
  validateGeometry(geometry);
  if (geometry.shape === 'stated-volume') return geometry.volumeM3;
  const D = geometry.innerDiameterM;
  return Math.PI * (D / 2) ** 2 * geometry.straightLengthM + 2 * headVolumeM3(geometry.head, D);
}

/** Inside height available to the liquid, m (vertical: 2 head depths + straight length; horizontal: D). */
export function vesselLevelSpanM(geometry: CylinderGeometry): number {
  const D = geometry.innerDiameterM;
  return geometry.shape === 'horizontal-cylinder'
    ? D
    : 2 * headDepthM(geometry.head, D) + geometry.straightLengthM;
}

/**
 * Liquid volume at level h above the lowest inside point, m³. h in m, 0 ≤ h ≤ vesselLevelSpanM.
 * Throws InputError ('liquid level') outside that range or if the geometry is invalid.
 */
export function liquidVolumeFromLevel(geometry: CylinderGeometry, levelM: number): number {
  validateGeometry(geometry);
  const span = vesselLevelSpanM(geometry);
  if (!Number.isFinite(levelM)) throw new InputError('liquid level', 'not-a-number', levelM, { min: 0, max: span, unit: 'm' });
  if (levelM < 0 || levelM > span) throw new InputError('liquid level', 'out-of-range', levelM, { min: 0, max: span, unit: 'm' });
  return volumeAtLevel(geometry, levelM);
}

/** A cylinder geometry resolved once for repeated volume-at-level evaluations. */
interface LevelShape {
  horizontal: boolean;
  R: number;
  straightLengthM: number;
  head: HeadShape;
  /** Volume of one full head, m³. */
  full: number;
}

function levelShape(g: CylinderGeometry): LevelShape {
  const head = headShape(g.head, g.innerDiameterM);
  return { horizontal: g.shape === 'horizontal-cylinder', R: g.innerDiameterM / 2, straightLengthM: g.straightLengthM, head, full: bottomVolume(head, head.depth) };
}

function volumeAtLevel(g: CylinderGeometry, h: number): number {
  return volumeOfShape(levelShape(g), h);
}

function volumeOfShape(g: LevelShape, h: number): number {
  const R = g.R;
  if (g.horizontal) {
    return circleAreaBelow(R, h - R) * g.straightLengthM + 2 * horizontalVolume(g.head, h);
  }
  const hd = g.head.depth;
  const full = g.full;
  const bottom = bottomVolume(g.head, h);
  const shell = Math.PI * R * R * clamp(h - hd, 0, g.straightLengthM);
  // The top head is the bottom head inverted: the empty part above the liquid is a bottom-head fill.
  const topDepth = clamp(h - hd - g.straightLengthM, 0, hd);
  const top = topDepth > 0 ? full - bottomVolume(g.head, hd - topDepth) : 0;
  return bottom + shell + top;
}

/**
 * Liquid level above the lowest inside point for a liquid volume, m. volumeM3 in m³,
 * 0 ≤ volumeM3 ≤ vesselVolume. V(h) rises monotonically, so bisection converges to the level
 * within 1e-12 of the span. Throws InputError ('liquid volume') outside that range.
 */
export function liquidLevelFromVolume(geometry: CylinderGeometry, volumeM3: number): number {
  return levelSolver(geometry)(volumeM3);
}

/**
 * liquidLevelFromVolume for one geometry, resolved once (validation, total volume, head shape):
 * the level band solves seven levels on the same vessel per check. The same doubles as
 * liquidLevelFromVolume. Throws InputError as it does (the geometry now, the volume per call).
 */
export function levelSolver(geometry: CylinderGeometry): (volumeM3: number) => number {
  const total = vesselVolume(geometry);
  const range = { min: 0, max: total, unit: 'm³' };
  const span = vesselLevelSpanM(geometry);
  const shape = levelShape(geometry);
  const t = shape.horizontal ? shape.head.t : null;
  // The first level this solver found (a check's own level), its volume and the surface's area
  // there; the second and third solves add the curvature of h(V) and its next term (divided
  // differences on the first volume taken twice, then the second and third). The level band's six
  // solves lie close to the first, so each starts from that cubic: the start decides only where
  // V(h) is evaluated, never the level returned (see bisectionResult; the torispherical solve's
  // own note says what it changes there).
  let anchorM3 = Number.NaN;
  let anchorM = Number.NaN;
  let anchorAreaM2 = 0;
  let curvature = 0;
  let cubic = 0;
  let secondM3 = Number.NaN;
  let secondM = Number.NaN;
  let solves = 0;
  return (volumeM3) => {
    if (!Number.isFinite(volumeM3)) throw new InputError('liquid volume', 'not-a-number', volumeM3, range);
    if (volumeM3 < 0 || volumeM3 > total * (1 + 1e-12)) throw new InputError('liquid volume', 'out-of-range', volumeM3, range);
    const d = volumeM3 - anchorM3;
    const near = anchorAreaM2 > 0 ? anchorM + d / anchorAreaM2 + d * d * (curvature + (cubic === 0 ? 0 : cubic * (volumeM3 - secondM3))) : Number.NaN;
    const guess = near >= 0 && near <= span ? near : firstGuessM(shape, volumeM3, total, span);
    let level: number;
    if (t !== null) {
      level = horizontalTorisphericalLevel(shape, t, volumeM3, span, guess);
    } else {
      // The result of plain bisection (80 steps or 1e-12 of the span), from fewer evaluations
      // (bisection.ts); V(h) is a sum of a few closed forms, within 1e-13 of the total volume (a
      // few hundred ulp).
      const start = guess > 0 && guess < span ? { x: guess, slope: surfaceAreaM2(shape, guess) } : undefined;
      level = bisectionResult((h) => volumeOfShape(shape, h) - volumeM3, 0, span, 80, 1e-12 * span, () => 1e-13 * total, 1e-14 * span, start);
    }
    if (solves === 0) {
      anchorM3 = volumeM3;
      anchorM = level;
      anchorAreaM2 = t !== null ? (TORISPHERICAL_LAST_SLOPE[0] as number) : surfaceAreaM2(shape, level);
    } else if (solves === 1 && d !== 0 && anchorAreaM2 > 0) {
      curvature = (level - anchorM - d / anchorAreaM2) / (d * d);
      if (!Number.isFinite(curvature)) curvature = 0;
      secondM3 = volumeM3;
      secondM = level;
    } else if (solves === 2 && d !== 0 && volumeM3 !== secondM3 && secondM3 !== anchorM3 && anchorAreaM2 > 0) {
      const through = ((level - secondM) / (volumeM3 - secondM3) - (secondM - anchorM) / (secondM3 - anchorM3)) / d;
      cubic = (through - curvature) / d;
      if (!Number.isFinite(cubic)) cubic = 0;
    }
    solves++;
    return level;
  };
}

/** Area of the liquid surface at level h, m² (dV/dh): where a level solve's Newton steps aim. */
function surfaceAreaM2(g: LevelShape, h: number): number {
  const R = g.R;
  const head = g.head;
  if (g.horizontal) {
    const y = h - R;
    const chord = 2 * Math.sqrt(Math.max(0, R * R - y * y));
    // d/dh of two heads' π·a·h²·(3R − h)/(6R), the closed form horizontalVolume uses (0 when
    // flat). Torispherical heads are not asked: their solve carries its own slope.
    const hh = clamp(h, 0, head.D);
    return chord * g.straightLengthM + (Math.PI * head.a * hh * (2 * R - hh)) / R;
  }
  const hd = head.depth;
  if (h <= hd) return hd > 0 ? Math.PI * square(sliceRadius(head, h)) : Math.PI * R * R;
  if (h < hd + g.straightLengthM) return Math.PI * R * R;
  const z = hd + g.straightLengthM + hd - h;
  return hd > 0 ? Math.PI * square(sliceRadius(head, Math.max(0, z))) : Math.PI * R * R;
}

/** A first estimate of the level for a volume, m, with no level solved yet on this vessel. */
function firstGuessM(g: LevelShape, volumeM3: number, total: number, span: number): number {
  const R = g.R;
  if (g.horizontal) return cylinderFractionLevelM(R, span, volumeM3 / total);
  const hd = g.head.depth;
  const full = g.full;
  // A head fills about as the square of its depth near its apex; the shell in between is linear.
  if (volumeM3 < full) return hd * Math.sqrt(volumeM3 / full);
  if (volumeM3 > total - full) return span - hd * Math.sqrt(Math.max(0, total - volumeM3) / full);
  return hd + (volumeM3 - full) / (Math.PI * R * R);
}

/** Level of a plain horizontal cylinder of radius R holding this fraction of its volume, m (a few Newton steps on the circular segment). */
function cylinderFractionLevelM(R: number, span: number, fraction: number): number {
  const disk = Math.PI * R * R;
  let h = span * fraction;
  for (let k = 0; k < 8; k++) {
    const y = h - R;
    const w = 2 * Math.sqrt(Math.max(0, R * R - y * y));
    if (!(w > 0)) break;
    h = clamp(h - (circleAreaBelow(R, y) - fraction * disk) / w, 0, span);
  }
  return h;
}

function square(x: number): number {
  return x * x;
}

/** Scratch output of horizontalTorisphericalLevel: [dV/dh at the last level evaluated, m²]. */
const TORISPHERICAL_LAST_SLOPE = new Float64Array(1);

/**
 * Level of a horizontal vessel with torispherical heads, m: Newton's method on V(h) with its
 * derivative (the liquid surface's area, from the same quadrature), kept inside a bracket that
 * bisection takes over whenever a step would leave it; to 1e-13 of the span. Each evaluation
 * integrates the heads, so the 40 evaluations of a plain bisection cost more than the rest of a
 * check (9.5 ms against 40 µs with Simpson's rule); Newton needs about five from a plain
 * cylinder's level for this fill, three from a neighbouring solve's level (`startM`). Where it
 * ends depends on where it starts, by at most the last step (1e-13 of the span).
 */
function horizontalTorisphericalLevel(g: LevelShape, t: Torus, volumeM3: number, span: number, startM: number): number {
  const total = volumeOfShape(g, span);
  TORISPHERICAL_LAST_SLOPE[0] = 0;
  if (volumeM3 <= 0) return 0;
  if (volumeM3 >= total) return span;
  const R = g.R;
  let lo = 0;
  let hi = span;
  // A start outside the vessel (or NaN) would stall the solve: then a plain cylinder's level.
  let h = startM >= 0 && startM <= span ? startM : cylinderFractionLevelM(R, span, volumeM3 / total);
  for (let k = 0; k < 100; k++) {
    const y = h - R;
    torisphericalSegments(g.head, t, y);
    const V = circleAreaBelow(R, y) * g.straightLengthM + 2 * (SEGMENTS[0] as number);
    const dV = 2 * Math.sqrt(Math.max(0, R * R - y * y)) * g.straightLengthM + 2 * (SEGMENTS[1] as number);
    TORISPHERICAL_LAST_SLOPE[0] = dV;
    const f = V - volumeM3;
    // An exact root ends the solve. Before, f = 0 moved the bracket's top onto h, so the Newton
    // step (h itself) was not strictly inside and bisection walked up from the bottom of the
    // bracket, 20 to 30 more head integrals, only to return a midpoint 1e-13 of the span below
    // the root (found by counting integrals per check: 28 to 178, now 28 to 81).
    if (f === 0) return h;
    if (f < 0) lo = h;
    else hi = h;
    let next = dV > 0 ? h - f / dV : Number.NaN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - h) <= 1e-13 * span || hi - lo <= 1e-12 * span) return next;
    h = next;
  }
  return h;
}

const MAX_DIMENSION_M = 100;
const MAX_VOLUME_M3 = 10_000;

/**
 * Throws InputError unless the geometry closes: positive finite dimensions, and for a torispherical
 * head a knuckle radius 0 < r ≤ D/2 and a crown radius L ≥ D/2 (else crown and knuckle cannot meet).
 * Limits: D, L_c ≤ 100 m, stated volume 0 < V ≤ 10 000 m³.
 */
export function validateGeometry(geometry: VesselGeometry): void {
  if (geometry.shape === 'stated-volume') {
    positive('internal volume', geometry.volumeM3, MAX_VOLUME_M3, 'm³');
    return;
  }
  if (geometry.shape !== 'vertical-cylinder' && geometry.shape !== 'horizontal-cylinder') {
    throw new InputError('vessel shape', 'out-of-range', String((geometry as { shape: unknown }).shape), undefined,
      'vessel shape: must be stated-volume, vertical-cylinder or horizontal-cylinder.');
  }
  const D = positive('inner diameter', geometry.innerDiameterM, MAX_DIMENSION_M, 'm');
  const Lc = geometry.straightLengthM;
  if (!Number.isFinite(Lc)) throw new InputError('straight length', 'not-a-number', Lc, { min: 0, max: MAX_DIMENSION_M, unit: 'm' });
  if (Lc < 0 || Lc > MAX_DIMENSION_M) throw new InputError('straight length', 'out-of-range', Lc, { min: 0, max: MAX_DIMENSION_M, unit: 'm' });
  const head = geometry.head;
  if (head.kind === 'torispherical') {
    const R = D / 2;
    if (head.knuckleRadiusM !== undefined) {
      const r = head.knuckleRadiusM;
      if (!Number.isFinite(r)) throw new InputError('knuckle radius', 'not-a-number', r, { min: 0, max: R, unit: 'm' });
      if (r <= 0 || r > R) throw new InputError('knuckle radius', 'inconsistent', r, { min: 0, max: R, unit: 'm' },
        `knuckle radius: ${r} m does not close the head; it must be above 0 and at most half the inner diameter (${R} m).`);
    }
    if (head.crownRadiusM !== undefined) {
      const L = head.crownRadiusM;
      const max = MAX_DIMENSION_M;
      if (!Number.isFinite(L)) throw new InputError('crown radius', 'not-a-number', L, { min: R, max, unit: 'm' });
      if (L < R || L > max) throw new InputError('crown radius', 'inconsistent', L, { min: R, max, unit: 'm' },
        `crown radius: ${L} m does not close the head; it must be at least half the inner diameter (${R} m).`);
    }
  } else if (head.kind !== 'flat' && head.kind !== 'semi-ellipsoidal-2-1' && head.kind !== 'hemispherical') {
    throw new InputError('head type', 'out-of-range', String((head as { kind: unknown }).kind), undefined,
      'head type: must be flat, semi-ellipsoidal-2-1, hemispherical or torispherical.');
  }
  if (head.kind === 'flat' && Lc === 0) {
    throw new InputError('straight length', 'inconsistent', Lc, { min: 0, max: MAX_DIMENSION_M, unit: 'm' },
      `straight length: a vessel with flat heads has no volume unless the straight length is above 0 m (valid range: above 0 to ${MAX_DIMENSION_M} m).`);
  }
}

function positive(field: string, value: number, max: number, unit: string): number {
  if (!Number.isFinite(value)) throw new InputError(field, 'not-a-number', value, { min: 0, max, unit });
  if (value <= 0 || value > max) {
    throw new InputError(field, 'out-of-range', value, { min: 0, max, unit },
      `${field}: ${value} ${unit} is outside the valid range; it must be above 0 and at most ${max} ${unit}.`);
  }
  return value;
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}
