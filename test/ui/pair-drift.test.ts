// Drift from the log as a vessel's screens show it: a demo vessel's log (DEMO DATA: the invented
// steriliser DEMO-ST-01 of the demo plant, its gauge reading 6 kPa high against its thermometer)
// evaluated by the check engine with its register instruments, grouped by pair, the saturated
// checks since the pair's last calibration handed to the core's estimator; a swap of gauge starts
// a new pair; checks saved before the register count the instruments fitted at their time.
import { describe, expect, it } from 'vitest';
import { evaluateCheck, saturationPressure, type Reading, type VesselSpec } from '../../src/core/index.ts';
import { vesselWithInstruments, withInstrumentFindings, type FittedForCheck } from '../../src/core/instrument/vessel-instruments.ts';
import { registerFromVessel } from '../../src/store/instrument-upgrade.ts';
import type { CheckRecord, FittingRecord, InstrumentHistory, VesselRecord } from '../../src/store/index.ts';
import { DEMO_PLANT } from '../../src/ui/state/demo-plant.ts';
import { pairDrifts } from '../../src/ui/state/pair-drift.ts';
import { driftFigures } from '../../src/ui/state/instrument-view.ts';

const DAY = 86_400_000;
const START = Date.parse('2026-10-01T07:00:00Z');
const demo = DEMO_PLANT.find((v) => v.tag === 'DEMO-ST-01')!;
const vesselRecord: VesselRecord = {
  id: '0d0d0d0d-0000-4000-8000-0000000000d1', tag: demo.tag, tagKey: demo.tag.toLowerCase(), description: demo.description, spec: demo,
  retired: false, retiredAt: null, createdAt: '2026-09-01T08:00:00Z', updatedAt: '2026-09-01T08:00:00Z',
};
let n = 0;
const register = registerFromVessel(vesselRecord, '2026-09-01T08:00:00Z', () => `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`);
const histories = new Map<string, InstrumentHistory>(register.instruments.map((i) => [i.id, { instrument: i, calibrations: [] }]));
const gaugeId = register.instruments[0]!.id;
const thermometerId = register.instruments[1]!.id;

/** A fixed-seed generator (Park–Miller), so the demo log is the same on every run. */
function random(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647) / 2147483647;
}
const gaussian = (u: () => number) => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());

/** One saved check as the Check screen would save it (the fields the drift reads), or one saved before the register. */
function demoCheck(i: number, timeMs: number, biasPa: number, u: () => number, fitted: FittedForCheck | null): CheckRecord {
  const T = 394.15 + 0.1 * gaussian(u);
  const reading: Reading = {
    time: new Date(timeMs).toISOString(), temperatureK: T,
    pressure: { reference: 'absolute', pressurePa: saturationPressure(T) + biasPa + 800 * gaussian(u) },
    weight: { kind: 'gross', grossKg: demo.tareKg + 300 },
  };
  const forCheck = fitted ? vesselWithInstruments(demo, fitted, { nowMs: timeMs }) : { vessel: demo, findings: [] };
  const result = withInstrumentFindings(evaluateCheck(forCheck.vessel, reading), forCheck.findings);
  return { id: `c${i}`, timeMs, vessel: { tag: demo.tag, spec: forCheck.vessel as VesselSpec }, result } as unknown as CheckRecord;
}

const fittedBoth = (g = gaugeId, spec = histories.get(gaugeId)!.instrument.spec): FittedForCheck => ({
  pressure: { instrumentId: g, spec, calibrations: [] },
  temperature: { instrumentId: thermometerId, spec: histories.get(thermometerId)!.instrument.spec, calibrations: [] },
});

describe('drift from the log on a demo vessel (DEMO DATA)', () => {
  it('40 daily checks with the gauge 6 kPa high: the finding names both instruments and gives the offset with its interval', () => {
    const u = random(2026);
    const checks = Array.from({ length: 40 }, (_, i) => demoCheck(i, START + i * DAY, 6000, u, fittedBoth()));
    const [pair, ...more] = pairDrifts(checks, register.fittings, histories, START + 41 * DAY);
    expect(more).toEqual([]);
    expect(pair!.gaugeTag).toBe('DEMO-ST-01 PI');
    expect(pair!.thermometerTag).toBe('DEMO-ST-01 TI');
    const d = pair!.drift;
    if (d.estimate !== 'made') throw new Error('no estimate');
    expect(d.checksUsed).toBe(40);
    expect(Math.abs(d.offsetPa.value - 6000)).toBeLessThan(d.offsetPa.plusMinus);
    expect(pair!.findings.map((f) => f.rule)).toEqual(['instrument-pair-offset']);
    expect(pair!.findings[0]!.message).toMatch(/^Over the last 40 checks gauge DEMO-ST-01 PI reads \d\.\d kPa ± \d\.\d kPa above saturation for the reading of thermometer DEMO-ST-01 TI .*one of them has drifted, the atmosphere used for gauge readings is off, or gas is present/);
    // The figures the vessel page shows beside the finding (printed for the closing note).
    console.log(`${pair!.findings[0]!.signal} ${pair!.findings[0]!.message}\n${driftFigures(pair!).detail}`);
    expect(pair!.offsets).toHaveLength(40);
  });

  it('no bias: no finding; a swapped gauge starts a new pair; checks saved before the register count the instruments fitted then', () => {
    const u = random(7);
    const spare = { ...register.instruments[0]!, id: '00000000-0000-4000-8000-0000000000aa', tag: 'DEMO-PI-SPARE', tagKey: 'demo-pi-spare', spec: { ...register.instruments[0]!.spec, tag: 'DEMO-PI-SPARE' } };
    const withSpare = new Map(histories).set(spare.id, { instrument: spare, calibrations: [] });
    const swap: FittingRecord = { id: 'f-swap', vesselId: vesselRecord.id, role: 'pressure', instrumentId: spare.id, from: '2026-11-01T00:00:00Z', fromMs: Date.parse('2026-11-01T00:00:00Z'), reason: 'swapped (demo)', enteredAt: '2026-11-01T00:00:00Z' };
    const before = Array.from({ length: 10 }, (_, i) => demoCheck(i, START + i * DAY, 0, u, null));
    const old = Array.from({ length: 10 }, (_, i) => demoCheck(10 + i, START + (10 + i) * DAY, 0, u, fittedBoth()));
    const after = Array.from({ length: 12 }, (_, i) => demoCheck(20 + i, Date.parse('2026-11-02T07:00:00Z') + i * DAY, 0, u, fittedBoth(spare.id, spare.spec)));
    const pairs = pairDrifts([...before, ...old, ...after], [...register.fittings, swap], withSpare, Date.parse('2026-12-01T00:00:00Z'));
    expect(pairs.map((p) => [p.gaugeTag, p.drift.checksUsed])).toEqual([['DEMO-PI-SPARE', 12], ['DEMO-ST-01 PI', 20]]);
    expect(pairs.flatMap((p) => p.findings)).toEqual([]);
  });
});
