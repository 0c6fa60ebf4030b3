// Non-condensable gases: the test figure is mL of gas per 100 mL of condensate (EN 285 via HTM 2010,
// secondary sources in field-practice.md §4.3).
import { describe, expect, it } from 'vitest';
import { evaluateNoncondensableGas, InputError, noncondensableGas, NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT } from '../../../src/core/index.ts';

const mL = (v: number) => v * 1e-6;
function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('no InputError');
}

describe('non-condensable gases', () => {
  it('3.5 mL of gas in 100 mL of condensate is 3.5 %, and 7 mL in 200 mL the same (the definition)', () => {
    expect(noncondensableGas({ gasVolumeM3: mL(3.5), condensateVolumeM3: mL(100) }).percentByVolume).toBeCloseTo(3.5, 12);
    expect(noncondensableGas({ gasVolumeM3: mL(7), condensateVolumeM3: mL(200) }).percentByVolume).toBeCloseTo(3.5, 12);
    expect(noncondensableGas({ gasVolumeM3: 0, condensateVolumeM3: mL(180) }).percentByVolume).toBe(0);
  });
  it('default highest 3.5 mL per 100 mL; 4.2 mL in 120 mL (3.5 %) passes, 4.5 mL does not', () => {
    expect(NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT).toBe(3.5);
    expect(evaluateNoncondensableGas({ gasVolumeM3: mL(4.2), condensateVolumeM3: mL(120) }).outcome).toBe('none');
    const e = evaluateNoncondensableGas({ gasVolumeM3: mL(4.5), condensateVolumeM3: mL(120) });
    expect(e.findings.map((f) => f.rule)).toEqual(['noncondensable-gas-above-limit']);
    expect(e.findings[0]!.message).toMatch(/3\.75 mL per 100 mL of condensate/);
  });
  it('its wording keeps the test apart from what a temperature-pressure comparison can see', () => {
    const e = evaluateNoncondensableGas({ gasVolumeM3: mL(1), condensateVolumeM3: mL(100) });
    expect(e.standing.map((c) => c.rule)).toContain('noncondensable-gas-not-saturation-check');
    expect(e.standing.find((c) => c.rule === 'noncondensable-gas-not-saturation-check')!.message).toMatch(/cannot be seen by comparing/);
  });
  it.each([
    ['gas volume', { gasVolumeM3: -1e-6, condensateVolumeM3: mL(100) }],
    ['gas volume', { gasVolumeM3: NaN, condensateVolumeM3: mL(100) }],
    ['condensate volume', { gasVolumeM3: mL(1), condensateVolumeM3: 0 }],
    ['condensate volume', { gasVolumeM3: mL(1), condensateVolumeM3: 1 }],
  ])('bad input: %s', (field, reading) => {
    expect(errorOf(() => noncondensableGas(reading)).field).toBe(field);
  });
  it('bad limit names the field', () => {
    expect(errorOf(() => evaluateNoncondensableGas({ gasVolumeM3: mL(1), condensateVolumeM3: mL(100) }, { maximumPercentByVolume: -1 })).field)
      .toBe('highest accepted non-condensable gas');
  });
});
