import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { planFill, type FillRequest } from '../../../src/core/check/plan-fill.ts';
import { InputError } from '../../../src/core/errors.ts';
import { saturation } from '../../../src/core/steam/index.ts';
import { testVessel } from './test-vessel.ts';

const oneCubicMetre = testVessel({ geometry: { shape: 'stated-volume', volumeM3: 1 }, tareKg: 400 });
const request = (over: Partial<FillRequest> = {}): FillRequest => ({
  targetTemperatureK: 394.15,
  target: { kind: 'dry-saturated' },
  startTemperatureK: 293.15,
  liquidFullMarginK: 5,
  ...over,
});

describe('planFill (reference figures from python3-iapws 1.5.2 run with /usr/bin/python3, IAPWS97 T/x states)', () => {
  it('dry saturated at 121 °C in 1 m³: 1.1556 kg, gross = tare + charge, heat 2.787 MJ from 20 °C', () => {
    const p = planFill(oneCubicMetre, request({ heaterPowerW: 2000 }));
    expect(p.waterMassKg).toBeCloseTo(1.15561, 4);
    expect(p.expectedGrossWeightKg).toBeCloseTo(401.15561, 4);
    expect(p.heat!.contentsJ / 2786580).toBeCloseTo(1, 3);
    expect(p.heat!.heatUpTimeS).toBeCloseTo(p.heat!.totalJ / 2000, 9);
    expect(p.atTarget.quality).toBeCloseTo(1, 9);
  });
  it('the ideal-gas estimate of a dry saturated charge is off by Z − 1 = −2.5 % at 121 °C (computed with python3-iapws 1.5.2 (IAPWS-IF97): Z = 0.9754)', () => {
    const p = planFill(oneCubicMetre, request());
    expect(p.idealGas.errorPercent).toBeCloseTo(-2.46, 1);
  });
  it('quality 0.5 at 150 °C: 5.0814 kg, heat 7.640 MJ', () => {
    const p = planFill(oneCubicMetre, request({ targetTemperatureK: 423.15, target: { kind: 'quality', quality: 0.5 } }));
    expect(p.waterMassKg).toBeCloseTo(5.08139, 4);
    expect(p.heat!.contentsJ / 7640451).toBeCloseTo(1, 3);
  });
  it('vapor-space fraction 0.3 at 134 °C: 652.48 kg, heat 313.68 MJ; vessel heat capacity adds C·ΔT', () => {
    const p = planFill(oneCubicMetre, request({ targetTemperatureK: 407.15, target: { kind: 'vapor-space-fraction', fraction: 0.3 }, vesselHeatCapacityJPerK: 5e5 }));
    expect(p.waterMassKg).toBeCloseTo(652.484, 2);
    expect(p.atTarget.vaporSpaceFraction).toBeCloseTo(0.3, 9);
    expect(p.heat!.contentsJ / 313677307).toBeCloseTo(1, 3);
    expect(p.heat!.vesselJ).toBeCloseTo(5e5 * 114, 6);
  });
  it('the largest two-phase charge stays two-phase up to T_sat(relief) + margin: relief 0.9 MPa g → 179.9 °C, +5 K → 881.67 kg per m³', () => {
    const p = planFill(oneCubicMetre, request());
    expect(p.largestTwoPhaseCharge.limitTemperatureK).toBeCloseTo(453.0932 + 5, 3);
    expect(p.largestTwoPhaseCharge.waterMassKg).toBeCloseTo(881.667, 2);
    expect(saturation(p.largestTwoPhaseCharge.limitTemperatureK).liquid.v * p.largestTwoPhaseCharge.waterMassKg).toBeCloseTo(1, 9);
  });
  it('1.8 m³ at 220 °C with two thirds vapor space needs 518.1 kg, x = 0.0269 (Çengel & Boles, ch. 3 end-of-chapter problem, from memory; answer on a Q&A page)', () => {
    const v = testVessel({ geometry: { shape: 'stated-volume', volumeM3: 1.8 } });
    const p = planFill(v, request({ targetTemperatureK: 493.15, target: { kind: 'vapor-space-fraction', fraction: 2 / 3 } }));
    expect(p.waterMassKg).toBeCloseTo(518.1, 0);
    expect(p.atTarget.quality).toBeCloseTo(0.0269, 3);
  });
  it('a charge above the largest two-phase charge is a WARNING: it describes a plan, not the vessel now (ISO 3864-2 / ANSI Z535.4 meaning: could, not will)', () => {
    const p = planFill(oneCubicMetre, request({ target: { kind: 'quality', quality: 0 } }));
    expect(p.cautions[0]).toMatchObject({ signal: 'WARNING', rule: 'plan-exceeds-two-phase-charge' });
    expect(p.cautions[0]!.message).toMatch(/largest charge that stays two-phase up to/);
    expect(p.cautions.map((c) => c.message).join(' ')).not.toMatch(/\bsafe\b/i);
    expect(p.cautions.at(-1)?.rule).toBe('standing-note');
  });
  it('a target above the relief set pressure is a WARNING', () => {
    const p = planFill(oneCubicMetre, request({ targetTemperatureK: 455 }));
    expect(p.cautions.map((c) => c.rule)).toContain('plan-target-above-relief-set');
  });
  it('results are plain data without NaN (JSON round trip)', () => {
    const p = planFill(oneCubicMetre, request({ heaterPowerW: 1000 }));
    expect(JSON.parse(JSON.stringify(p))).toEqual(p);
  });
  it('refuses bad requests naming the field', () => {
    const cases: [Partial<FillRequest>, string][] = [
      [{ targetTemperatureK: 650 }, 'target temperature'],
      [{ startTemperatureK: 400 }, 'start temperature'],
      [{ target: { kind: 'quality', quality: 1.2 } }, 'quality'],
      [{ target: { kind: 'vapor-space-fraction', fraction: -0.1 } }, 'vapour-space fraction'],
      [{ heaterPowerW: 0 }, 'heater power'],
      [{ vesselHeatCapacityJPerK: -1 }, 'vessel heat capacity'],
      [{ liquidFullMarginK: -1 }, 'liquid-full margin'],
    ];
    for (const [over, field] of cases) {
      try {
        planFill(oneCubicMetre, request(over));
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).field).toBe(field);
      }
    }
  });
});

describe('every plan rule is raised by its scenario', () => {
  it('plan-target-above-mawp', () => {
    expect(planFill(oneCubicMetre, request({ targetTemperatureK: 460 })).cautions.map((c) => c.rule)).toContain('plan-target-above-mawp');
  });
  it('plan-above-design-temperature', () => {
    const v = testVessel({ geometry: { shape: 'stated-volume', volumeM3: 1 }, designTemperatureK: 380 });
    expect(planFill(v, request()).cautions.map((c) => c.rule)).toContain('plan-above-design-temperature');
  });
  it('plan-does-not-fit: saturated liquid at 7 °C charged at 0.01 °C, where water is less dense (density maximum near 4 °C, IF97)', () => {
    const p = planFill(oneCubicMetre, request({ targetTemperatureK: 280.15, startTemperatureK: 273.16, target: { kind: 'quality', quality: 0 } }));
    expect(p.startState.regime).toBe('liquid-full');
    expect(p.cautions[0]?.rule).toBe('plan-does-not-fit');
  });
  it('a charge planned at its target always fits when started warmer than 4 °C', () => {
    const p = planFill(oneCubicMetre, request({ targetTemperatureK: 473.15, target: { kind: 'quality', quality: 0 } }));
    expect(p.startState.regime).toBe('two-phase');
  });
  it('plan-assumes-air-removed is always there', () => {
    expect(planFill(oneCubicMetre, request()).cautions.map((c) => c.rule)).toContain('plan-assumes-air-removed');
  });
});

describe('planFill over arbitrary requests (fast-check)', () => {
  it('returns plain finite data or throws InputError, never anything else', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 260, max: 660, noNaN: true }),
        fc.double({ min: 260, max: 660, noNaN: true }),
        fc.oneof(
          fc.constant({ kind: 'dry-saturated' as const }),
          fc.record({ kind: fc.constant('quality' as const), quality: fc.double({ min: -0.1, max: 1.1, noNaN: true }) }),
          fc.record({ kind: fc.constant('vapor-space-fraction' as const), fraction: fc.double({ min: -0.1, max: 1.1, noNaN: true }) }),
        ),
        fc.double({ min: -5, max: 150, noNaN: true }),
        fc.oneof(fc.constant(undefined), fc.double({ min: -1, max: 1e6, noNaN: true })),
        (T2, T1, target, margin, power) => {
          try {
            const p = planFill(oneCubicMetre, { targetTemperatureK: T2, startTemperatureK: T1, target, liquidFullMarginK: margin, ...(power === undefined ? {} : { heaterPowerW: power }) });
            expect(JSON.parse(JSON.stringify(p))).toEqual(p);
            expect(p.waterMassKg).toBeGreaterThan(0);
          } catch (e) {
            if (!(e instanceof InputError)) throw e;
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
