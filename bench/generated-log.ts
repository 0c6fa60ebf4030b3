// Generated benchmark and test data (invented, not demo data): a "tankside-backup" v2 file of
// vessels and a hash-chained check log of one device, written with the store's own canonical JSON
// and SHA-256 (and, when asked, signed with a key made for it, as the store's signing.ts signs) so
// it imports as a backup from another device would.
import type { CheckResult, StoredCheckResult, VesselSpec } from '../src/core/index.ts';
import { canonicalJson, computeCheckHash } from '../src/store/integrity.ts';
import { GENESIS_HASH, type CheckRecord, type PublicJwk, type VesselRecord } from '../src/store/records.ts';
import { base64url, chainHeadMessage, SIGNATURE_PARAMS, SIGNING_ALGORITHM } from '../src/store/signing.ts';
import { tagKeyOf } from '../src/store/vessels.ts';
import { testVessel } from '../test/core/check/test-vessel.ts';

/**
 * A generated result holds only the figures the review reads (verdict, deviation, quality, liquid
 * mass), invented; the store keeps any JSON, and this is the one place such a partial result is
 * given the stored-result type.
 */
export function partialResult(figures: object): StoredCheckResult {
  return figures as StoredCheckResult;
}

/** The same for a check about to be saved (appendCheck takes today's CheckResult). */
export function partialNewResult(figures: object): CheckResult {
  return figures as CheckResult;
}

/** An invented vessel spec for generated data: the check-engine tests' vessel with its own tag and volume. */
export function inventedSpec(tag: string, volumeM3: number, tareKg: number): VesselSpec {
  return testVessel({ tag, description: 'Generated vessel for benchmarks and tests (invented).', geometry: { shape: 'stated-volume', volumeM3 }, tareKg });
}

export interface LogSpec {
  deviceId: string;
  /** Vessel ids are derived from this, so two logs with the same prefix share vessels. */
  vesselPrefix: string;
  vessels: number;
  checks: number;
  /** The first check's instant, ms; checks follow every `stepMs`. */
  startMs: number;
  stepMs: number;
  technicians: readonly string[];
  seed: number;
  /** Sign every record's chain head with a key pair made for this file (a new one each run). */
  signed?: boolean;
}

/** A device's key and each record's signature, for a signed file. */
export interface GeneratedSigning {
  publicJwk: PublicJwk;
  /** Base64url signature by seq. */
  signatures: Map<number, string>;
  privateKey: CryptoKey;
}

/** Signs every record's chain head with a new P-256 key pair. */
export async function signGenerated(checks: readonly CheckRecord[]): Promise<GeneratedSigning> {
  const pair = await crypto.subtle.generateKey(SIGNING_ALGORITHM, false, ['sign', 'verify']);
  const jwk = await crypto.subtle.exportKey('jwk', pair.publicKey);
  const signatures = new Map<number, string>();
  for (const c of checks) {
    const s = await crypto.subtle.sign(SIGNATURE_PARAMS, pair.privateKey, chainHeadMessage(c.deviceId, c.seq, c.hash));
    signatures.set(c.seq, base64url(new Uint8Array(s)));
  }
  return { publicJwk: { crv: 'P-256', kty: 'EC', x: String(jwk.x), y: String(jwk.y) }, signatures, privateKey: pair.privateKey };
}

/** A small deterministic generator (mulberry32), so every run writes the same file. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function hex(n: number, width: number): string {
  return n.toString(16).padStart(width, '0').slice(-width);
}

/** A UUID-shaped id (version 4 layout) from a prefix number and an index. */
export function fakeUuid(prefix: number, index: number): string {
  return `${hex(prefix, 8)}-${hex(index >>> 16, 4)}-4${hex(index & 0xfff, 3)}-8${hex(index >>> 12, 3)}-${hex(index, 12)}`;
}

/** "2026-11-03T07:15:00+01:00" for ms (a fixed +01:00 offset, like a plant in Central Europe). */
function iso(ms: number): string {
  return new Date(ms + 3_600_000).toISOString().slice(0, 19) + '+01:00';
}

export function generatedVessels(prefix: number, count: number, createdMs: number): VesselRecord[] {
  return Array.from({ length: count }, (_, i) => {
    const tag = `GEN-${String(i + 1).padStart(4, '0')}`;
    return {
      id: fakeUuid(prefix, i),
      tag,
      tagKey: tagKeyOf(tag),
      description: 'Generated vessel for benchmarks and tests (invented).',
      spec: inventedSpec(tag, 1 + (i % 7) * 0.5, 400 + (i % 5) * 50),
      retired: false,
      retiredAt: null,
      createdAt: iso(createdMs),
      updatedAt: iso(createdMs),
    };
  });
}

const SIGNAL_SETS = [
  [],
  [],
  [],
  [{ signal: 'CAUTION', message: 'Generated caution: reading near the edge of the band.', rule: 'generated-caution' }],
  [{ signal: 'WARNING', message: 'Generated warning: pressure above saturation beyond the band.', rule: 'generated-warning' }],
  [{ signal: 'DANGER', message: 'Generated danger: fill too high to heat safely.', rule: 'generated-danger' }],
] as const;

/** The log's checks, seq 1..n, each hashed onto the previous one. */
export async function generatedChecks(spec: LogSpec, vessels: readonly VesselRecord[]): Promise<CheckRecord[]> {
  const rnd = random(spec.seed);
  const out: CheckRecord[] = [];
  let prevHash = GENESIS_HASH;
  for (let i = 0; i < spec.checks; i += 1) {
    const vessel = vessels[i % vessels.length]!;
    const timeMs = Math.floor((spec.startMs + i * spec.stepMs) / 1000) * 1000;
    const deviationPa = Math.round((rnd() - 0.45) * 40_000);
    const verdict = Math.abs(deviationPa) < 8000 ? 'consistent' : deviationPa > 0 ? 'pressure-above-saturation' : 'pressure-below-saturation';
    const quality = Math.round(rnd() * 5000) / 100_000;
    const liquidMassKg = Math.round(300 + rnd() * 900);
    const cautions = [
      ...SIGNAL_SETS[Math.floor(rnd() * SIGNAL_SETS.length)]!,
      { signal: 'NOTICE', message: 'Does not replace the inspection regime or local codes.', rule: 'standing-note' },
    ];
    const unsigned: Omit<CheckRecord, 'hash'> = {
      id: fakeUuid(spec.seed, i),
      deviceId: spec.deviceId,
      seq: i + 1,
      time: iso(timeMs),
      timeMs,
      technician: spec.technicians[i % spec.technicians.length]!,
      note: '',
      vesselId: vessel.id,
      vessel: { tag: vessel.tag, spec: vessel.spec },
      inputs: {
        temperature: { text: (140 + rnd() * 20).toFixed(1).replace('.', ','), unit: 'degC' },
        pressure: { text: (3 + rnd()).toFixed(2), unit: 'bar', reference: 'gauge' },
      },
      reading: { time: iso(timeMs), temperatureK: 420, pressure: { reference: 'gauge', pressurePa: 450_000 }, weight: { kind: 'not-weighed' } },
      result: partialResult({
        saturation: { pressureDeviationPa: deviationPa, verdict: { verdict } },
        inventory: { regime: 'two-phase', quality, liquidMassKg },
      }),
      cautions: cautions as CheckRecord['cautions'],
      appVersion: 'generated',
      formulationId: 'IAPWS-IF97 (R7-97(2012))',
      corrects: null,
      reason: null,
      prevHash,
    };
    const hash = await computeCheckHash(unsigned);
    out.push({ ...unsigned, hash });
    prevHash = hash;
  }
  return out;
}

/** The backup file text: the same layout exportBackup writes (format version 2, one canonical record per line). */
export function backupText(vessels: readonly VesselRecord[], checks: readonly CheckRecord[], exportedAt: string, signing?: GeneratedSigning): string {
  const last = checks[checks.length - 1];
  const chains = last ? [{ deviceId: last.deviceId, count: checks.length, headSeq: last.seq, headHash: last.hash, publicKey: signing?.publicJwk ?? null }] : [];
  const signatures = signing ? checks.map((c) => ({ deviceId: c.deviceId, seq: c.seq, signature: signing.signatures.get(c.seq)! })) : [];
  const lines = (items: unknown[]) => (items.length === 0 ? '' : `\n${items.map((x) => canonicalJson(x)).join(',\n')}\n`);
  return (
    `{"format":"tankside-backup","formatVersion":2,"exportedAt":${JSON.stringify(exportedAt)},\n` +
    `"vessels":[${lines([...vessels].sort((a, b) => (a.id < b.id ? -1 : 1)))}],\n` +
    `"checks":[${lines([...checks])}],\n` +
    `"signatures":[${lines(signatures)}],\n` +
    `"chains":[${lines(chains)}]}\n`
  );
}

/** A whole generated backup file. */
export async function generatedBackup(spec: LogSpec): Promise<string> {
  const vessels = generatedVessels(parseInt(spec.vesselPrefix, 16), spec.vessels, spec.startMs);
  const checks = await generatedChecks(spec, vessels);
  return backupText(vessels, checks, iso(spec.startMs + spec.checks * spec.stepMs), spec.signed ? await signGenerated(checks) : undefined);
}

/** The kinds of reading evaluatedChecks takes in turn, each a different outcome on the generated vessels. */
export const EVALUATED_KINDS = ['agrees', 'agrees', 'air', 'below-saturation', 'at-mawp', 'agrees'] as const;

/**
 * A log whose results are the check engine's own (evaluateCheck over invented readings on invented
 * vessels), hash-chained like generatedChecks: checks that agree (outcome none), with air
 * (WARNING), below saturation (CAUTION) and at MAWP (WARNING), in a fixed rotation.
 */
export async function evaluatedChecks(spec: LogSpec, vessels: readonly VesselRecord[]): Promise<CheckRecord[]> {
  const { evaluateCheck, saturationPressure, saturationTemperature, vesselVolume } = await import('../src/core/index.ts');
  const out: CheckRecord[] = [];
  let prevHash = GENESIS_HASH;
  for (let i = 0; i < spec.checks; i += 1) {
    const vessel = vessels[i % vessels.length]!;
    const timeMs = Math.floor((spec.startMs + i * spec.stepMs) / 1000) * 1000;
    const kind = EVALUATED_KINDS[i % EVALUATED_KINDS.length]!;
    // At MAWP the thermometer reads the gauge's saturation temperature, so only the limit is found.
    const T = kind === 'at-mawp' ? saturationTemperature(0.995e6 + 101325) : 394.15 + (i % 7);
    const pSat = saturationPressure(T);
    const absolute = kind === 'air' ? pSat + 60e3 : kind === 'below-saturation' ? pSat - 60e3 : pSat;
    // A third of the vessel liquid at the reading (v_f ≈ 1.06e-3 m³/kg at 121 °C): two-phase, not near liquid-full.
    const netKg = (vesselVolume(vessel.spec.geometry) / 1.06e-3) * (kind === 'at-mawp' ? 0.1 : 0.33);
    const reading = { time: iso(timeMs), temperatureK: T, pressure: { reference: 'absolute' as const, pressurePa: absolute }, weight: { kind: 'net' as const, netKg } };
    const result = evaluateCheck(vessel.spec, reading);
    const unsigned: Omit<CheckRecord, 'hash'> = {
      id: fakeUuid(spec.seed, i),
      deviceId: spec.deviceId,
      seq: i + 1,
      time: iso(timeMs),
      timeMs,
      technician: spec.technicians[i % spec.technicians.length]!,
      note: kind,
      vesselId: vessel.id,
      vessel: { tag: vessel.tag, spec: vessel.spec },
      inputs: { temperature: { text: (T - 273.15).toFixed(2), unit: 'degC' }, pressure: { text: (absolute / 1000).toFixed(1), unit: 'kPa', reference: 'absolute' } },
      reading,
      // The result as the app saves it: plain JSON.
      result: JSON.parse(JSON.stringify(result)) as typeof result,
      cautions: result.cautions.map(({ signal, message, rule }) => ({ signal, message, rule })),
      appVersion: 'generated',
      formulationId: result.formulationId,
      corrects: null,
      reason: null,
      prevHash,
    };
    const hash = await computeCheckHash(unsigned);
    out.push({ ...unsigned, hash });
    prevHash = hash;
  }
  return out;
}

/** A backup file of evaluatedChecks over generated vessels. */
export async function evaluatedBackup(spec: LogSpec): Promise<{ text: string; checks: CheckRecord[] }> {
  const vessels = generatedVessels(parseInt(spec.vesselPrefix, 16), spec.vessels, spec.startMs);
  const checks = await evaluatedChecks(spec, vessels);
  return { text: backupText(vessels, checks, iso(spec.startMs + spec.checks * spec.stepMs)), checks };
}
