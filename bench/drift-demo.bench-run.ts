// The closing figures of the instrument register: the drift finding on an invented demo vessel
// (DEMO-ST-01 of the demo plant, DEMO DATA), with its figures. Forty checks of the chamber with
// saturated steam over eleven weeks go through the app's own path (the register's gauge and RTD
// as vesselWithInstruments gives them to the check engine, evaluateCheck), with a gauge that
// reads 6 kPa high after its calibration; the two-phase checks go to driftFromLog as the vessel
// page sends them. Every figure is invented (bias, scatter, dates, the calibration); the scatter is
// our own: gauge 1 kPa, thermometer 0.15 K (normal, a fixed seed). Prints; asserts nothing about time.
import { it } from 'vitest';
import { evaluateCheck, saturationPressure, type Reading } from '../src/core/index.ts';
import { driftFromLog, type FittedInstrument, type SaturatedCheck } from '../src/core/instrument/index.ts';
import { vesselWithInstruments } from '../src/core/instrument/vessel-instruments.ts';
import { DEMO_PLANT } from '../src/ui/state/demo-plant.ts';

const DAY = 86_400_000;
const CALIBRATED = Date.parse('2026-09-01T09:00:00Z');
const DUE = Date.parse('2027-09-01T09:00:00Z');
const BIAS_PA = 6000;

/** mulberry32, a small seeded generator (public domain), and Box–Muller for normal deviates. */
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

it('the drift finding on DEMO-ST-01 (demo data)', () => {
  const vessel = DEMO_PLANT.find((v) => v.tag === 'DEMO-ST-01')!;
  const gauge: FittedInstrument = {
    instrumentId: 'demo-pi', spec: { tag: 'DEMO-ST-01 PI', kind: 'pressure-gauge', range: { low: 0, high: 400e3 }, tolerance: { kind: 'percent-of-span', percentOfSpan: 1 } },
    calibrations: [{ calibrationId: 'demo-cal-pi', timeMs: CALIBRATED, asFoundError: 1200, asLeftError: 150, nextDueMs: DUE }],
  };
  const rtd: FittedInstrument = {
    instrumentId: 'demo-ti', spec: { tag: 'DEMO-ST-01 TI', kind: 'rtd', range: { low: 273.15, high: 473.15 }, tolerance: { kind: 'iec-60751', sensorClass: 'A' } },
    calibrations: [{ calibrationId: 'demo-cal-ti', timeMs: CALIBRATED, asFoundError: 0.08, nextDueMs: DUE }],
  };
  const u = random(2026);
  const normal = () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
  const saturated: SaturatedCheck[] = [];
  let t = CALIBRATED + DAY;
  const outcomes = new Map<string, number>();
  for (let i = 0; i < 40; i++) {
    t += Math.round((1 + 2 * u()) * DAY);
    const trueK = (i % 2 === 0 ? 394.25 : 407.15) + 2 * u();
    const reading: Reading = {
      time: new Date(t).toISOString(),
      temperatureK: trueK + 0.15 * normal(),
      pressure: { reference: 'gauge', pressurePa: saturationPressure(trueK) + BIAS_PA + 1000 * normal() - vessel.siteAtmospherePa },
      weight: { kind: 'gross', grossKg: vessel.tareKg + 300 },
    };
    const forCheck = vesselWithInstruments(vessel, { pressure: gauge, temperature: rtd }, { nowMs: t, reading });
    const result = evaluateCheck(forCheck.vessel, reading);
    if (result.inventory.regime !== 'two-phase') continue;
    saturated.push({ timeMs: t, temperatureK: result.reading.temperatureK, absolutePressurePa: result.saturation.absolutePressurePa, pressureBandPa: result.saturation.pressureBand.plusMinus });
    const key = `${result.outcome}${result.findings[0] ? ` (${result.findings[0].rule})` : ''}`;
    outcomes.set(key, (outcomes.get(key) ?? 0) + 1);
  }
  const d = driftFromLog(saturated, { nextCalibrationDueMs: DUE, gaugeTag: 'DEMO-ST-01 PI', thermometerTag: 'DEMO-ST-01 TI' });
  console.log(`DEMO-ST-01 (DEMO DATA): ${saturated.length} two-phase checks of 40, ${new Date(saturated[0]!.timeMs).toISOString().slice(0, 10)} to ${new Date(saturated.at(-1)!.timeMs).toISOString().slice(0, 10)}; invented gauge bias +${BIAS_PA / 1000} kPa; each check's own outcome: ${[...outcomes].map(([o, n]) => `${o} ${n}`).join(', ')}`);
  if (d.estimate !== 'made') {
    console.log(`no estimate: ${d.checksUsed} checks used, ${d.minimumChecks} needed`);
    return;
  }
  const kPa = (x: number) => (x / 1000).toFixed(2);
  console.log(`mean offset p - p_sat(T): ${kPa(d.offsetPa.value)} ± ${kPa(d.offsetPa.plusMinus)} kPa (95 %), significant: ${d.offsetPa.significant}`);
  console.log(`as temperature: ${d.temperatureOffsetK.value.toFixed(2)} ± ${d.temperatureOffsetK.plusMinus.toFixed(2)} K`);
  if (d.trendPaPerS) console.log(`trend: ${kPa(d.trendPaPerS.value * 30.4375 * DAY / 1000)} ± ${kPa(d.trendPaPerS.plusMinus * 30.4375 * DAY / 1000)} kPa a month, significant: ${d.trendPaPerS.significant}`);
  console.log(`lag-1 autocorrelation ${d.lag1Autocorrelation.toFixed(2)}, about ${d.effectiveCount.toFixed(1)} independent readings; outliers set aside ${d.outliersSetAside}`);
  if (d.projection) console.log(`check band ± ${kPa(d.projection.bandPa)} kPa (${d.projection.bandSource}); at the due date ${new Date(d.projection.dueMs).toISOString().slice(0, 10)} the line is at ${kPa(d.projection.offsetAtDuePa)} kPa; leaves the band before then: ${d.projection.leavesBeforeDue}`);
  for (const f of d.findings) console.log(`${f.signal} [${f.rule}] ${f.message}`);
});
