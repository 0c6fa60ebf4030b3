// Generated log for the scale benchmark: invented bench data (not demo data, not measurements).
// Records are built the way appendCheck builds them (same fields, cloned to plain JSON, hashed
// into one chain per device) and written with raw puts, because saving 100 000 checks one by one
// through appendCheck would measure the seeding, not the work under test.
import { canonicalJson, computeCheckHash } from '../src/store/integrity.ts';
import { addToLog, LOG_STORES } from '../src/store/log-layout.ts';
import { getDb } from '../src/store/connection.ts';
import { GENESIS_HASH, type CheckRecord, type StoredCaution, type TypedInput, type VesselRecord } from '../src/store/records.ts';
import { formatIsoWithOffset } from '../src/store/time.ts';
import { cloneJson } from '../src/store/validate.ts';
import type { Reading } from '../src/core/index.ts';
import { inventedSpec, partialResult } from './generated-log.ts';

/** A UUID-shaped id from two numbers (deterministic, so runs compare). */
export function benchId(group: number, n: number): string {
  const g = group.toString(16).padStart(8, '0');
  const tail = n.toString(16).padStart(12, '0');
  return `${g}-0000-4000-8000-${tail}`;
}

export function benchVessels(count: number): VesselRecord[] {
  const out: VesselRecord[] = [];
  for (let i = 0; i < count; i += 1) {
    const at = '2026-01-05T07:00:00.000+01:00';
    out.push({
      id: benchId(0xbe0c0000, i + 1),
      tag: `BV-${String(i + 1).padStart(3, '0')}`,
      tagKey: `bv-${String(i + 1).padStart(3, '0')}`,
      description: `bench vessel ${i + 1}`,
      spec: cloneJson(inventedSpec(`BV-${String(i + 1).padStart(3, '0')}`, 1 + (i % 7) * 0.5, 800 + i)),
      retired: false,
      retiredAt: null,
      createdAt: at,
      updatedAt: at,
    });
  }
  return out;
}

/** The content of check `i` of a device, shaped like appendCheck's records (invented numbers). */
function content(deviceId: string, device: number, i: number, vessels: VesselRecord[]): Omit<CheckRecord, 'seq' | 'prevHash' | 'hash'> {
  const vessel = vessels[i % vessels.length]!;
  const timeMs = Date.parse('2026-01-06T06:00:00Z') + device * 1_000 + i * 600_000;
  const t = 420 + (i % 50) / 10;
  return {
    id: benchId(device, i + 1),
    deviceId,
    time: formatIsoWithOffset(new Date(timeMs), 60),
    timeMs,
    technician: ['R. Okafor', 'M. Lindqvist', 'S. Haddad', 'J. Moreau'][i % 4]!,
    note: i % 10 === 0 ? '=SUM(A1) pasted by mistake' : `round ${i % 12}`,
    vesselId: vessel.id,
    vessel: { tag: vessel.tag, spec: vessel.spec },
    inputs: cloneJson<Record<string, TypedInput>>({
      temperature: { text: (t - 273.15).toFixed(1).replace('.', ','), unit: 'degC' },
      pressure: { text: '3,9', unit: 'bar', reference: 'gauge' },
      grossWeight: { text: String(2400 + (i % 90)), unit: 'kg' },
    }),
    reading: cloneJson<Reading>({ time: formatIsoWithOffset(new Date(timeMs), 60), temperatureK: t, pressure: { reference: 'gauge', pressurePa: 390000 + (i % 997) }, weight: { kind: 'gross', grossKg: 2400 + (i % 90) } }),
    result: partialResult({
      reading: { absolutePressurePa: 491325 + (i % 997), gaugePressurePa: 390000 + (i % 997), atmospherePa: 101325, netMassKg: 1250.5 + (i % 13) },
      saturation: { saturationPressurePa: 500120.25, pressureDeviationPa: -1204.75 + (i % 997), pressureBand: { plusMinus: 9000 }, verdict: { verdict: 'consistent' } },
      inventory: { regime: 'two-phase', quality: 1.25e-7 * ((i % 97) + 1), liquidMassKg: 1249.875, vaporMassKg: 0.625, liquidLevel: { levelM: 0.8125 } },
    }),
    cautions: cloneJson<StoredCaution[]>(
      i % 3 === 0
        ? [{ signal: 'CAUTION', message: 'Gauge and thermometer disagree by more than the band; check both instruments.', rule: 'saturation-band' }]
        : [],
    ),
    appVersion: '0.1.0',
    formulationId: 'IAPWS-IF97 (R7-97(2012))',
    corrects: null,
    reason: null,
  };
}

/** `count` chained checks of one device over `vessels`. */
export async function benchChecks(device: number, count: number, vessels: VesselRecord[]): Promise<CheckRecord[]> {
  const deviceId = benchId(device, 0);
  const out: CheckRecord[] = [];
  let prevHash = GENESIS_HASH;
  for (let i = 0; i < count; i += 1) {
    const unsigned = { ...content(deviceId, device, i, vessels), seq: i + 1, prevHash };
    const record = { ...unsigned, hash: await computeCheckHash(unsigned) };
    out.push(record);
    prevHash = record.hash;
  }
  return out;
}

/** Writes records straight into the open store's log, a few thousand per transaction. */
export async function writeRaw(vessels: VesselRecord[], checks: CheckRecord[]): Promise<void> {
  const db = await getDb();
  {
    const tx = db.transaction('vessels', 'readwrite');
    for (const v of vessels) void tx.store.put(v);
    await tx.done;
  }
  for (let start = 0; start < checks.length; start += 5000) {
    const tx = db.transaction(LOG_STORES, 'readwrite');
    const entries = checks.slice(start, start + 5000).map((record) => ({ record, text: canonicalJson(record) }));
    await Promise.all([addToLog(tx, entries), tx.done]);
  }
}
