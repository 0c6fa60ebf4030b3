// The periodic tests as the screen offers them: for each, its fields (typed in the units shown
// beside them), its configurable limit with the core's default, and the core's evaluation of the
// typed values (SI at this edge). Each evaluation is graded like a check: findings, standing
// cautions, outcome. Defaults are the core's (field-practice.md §4.3, each marked there).
import {
  DRYNESS_VALUE_DEFAULT_MIN, EXPANSION_SUPERHEAT_DEFAULT_MAX_K, NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT,
  THROTTLING_DRYNESS_DEFAULT_MIN, VACUUM_LEAK_DEFAULT_MAX_PA_PER_MINUTE,
  evaluateAirRemovalTest, evaluateExpansionSuperheat, evaluateFlaskDryness, evaluateNoncondensableGas,
  evaluateThrottlingDryness, evaluateVacuumLeak,
} from '../../core/periodic-tests/index.ts';
import type { Graded } from '../../core/graded-result.ts';
import { massToKg, pressureFromPa, pressureToPa, temperatureFromK, temperatureToK, type PressureUnit, type TemperatureUnit } from '../../core/units/index.ts';
import { errorText } from '../state/error-text.ts';
import { formatEditable, formatNumber, readNumber } from '../state/format.ts';
import { unitLabel } from '../state/unit-labels.ts';

export type SteamTestId = 'throttling-dryness' | 'expansion-superheat' | 'noncondensable-gas' | 'vacuum-leak' | 'air-removal' | 'dryness-value';

/** One field of a test: a number in a unit, a choice, or free text. */
export interface TestField {
  id: string;
  label: string;
  kind: 'number' | 'text' | 'lines' | 'choice';
  options?: readonly { id: string; label: string }[];
  initial: string;
}

export interface SteamTestDef {
  id: SteamTestId;
  label: string;
  /** A sentence shown above the fields: what the test is, and what it is not. */
  about: string;
  fields: (u: TestUnits) => TestField[];
  evaluate: (v: Record<string, string>, u: TestUnits) => Graded & { summary: string };
}

/** The units the tests' pressures and temperatures are typed in (the person's preferred units). */
export interface TestUnits { pressure: PressureUnit; temperature: TemperatureUnit }

const num = (v: Record<string, string>, id: string, label: string) => readNumber(v[id] ?? '', label);
const pa = (v: Record<string, string>, id: string, label: string, u: TestUnits) => pressureToPa(num(v, id, label), u.pressure, label);
const kelvin = (v: Record<string, string>, id: string, label: string, u: TestUnits) => temperatureToK(num(v, id, label), u.temperature, label);
const p = (u: TestUnits) => unitLabel(u.pressure);
const t = (u: TestUnits) => unitLabel(u.temperature);
const atm = (u: TestUnits) => formatEditable(pressureFromPa(101_325, u.pressure));

export const STEAM_TESTS: readonly SteamTestDef[] = [
  {
    id: 'throttling-dryness',
    label: 'Dryness fraction (throttling calorimeter)',
    about: 'The supply steam throttled to a superheated state: its dryness fraction from h(p₁, x) = h(p₂, T₂) (IAPWS-IF97). Refused when the throttled steam is not superheated: the steam is then too wet for this method.',
    fields: (u) => [
      { id: 'line', label: `Line pressure, ${p(u)} absolute`, kind: 'number', initial: '' },
      { id: 'calP', label: `Calorimeter pressure, ${p(u)} absolute`, kind: 'number', initial: atm(u) },
      { id: 'calT', label: `Calorimeter temperature, ${t(u)}`, kind: 'number', initial: '' },
      { id: 'min', label: 'Lowest accepted dryness fraction', kind: 'number', initial: formatEditable(THROTTLING_DRYNESS_DEFAULT_MIN) },
    ],
    evaluate: (v, u) => {
      const e = evaluateThrottlingDryness(
        { linePressurePa: pa(v, 'line', 'line pressure', u), calorimeterPressurePa: pa(v, 'calP', 'calorimeter pressure', u), calorimeterTemperatureK: kelvin(v, 'calT', 'calorimeter temperature', u) },
        { minimumDryness: num(v, 'min', 'lowest accepted dryness fraction') },
      );
      return { ...e, summary: `Dryness fraction ${formatNumber(e.dryness, 3)} (lowest accepted ${formatNumber(e.limits.minimumDryness, 3)}).` };
    },
  },
  {
    id: 'expansion-superheat',
    label: 'Superheat on expansion',
    about: 'The temperature of the supply steam after free expansion to the atmosphere, and its superheat above T_sat there: measured, or predicted from the line pressure and the dryness fraction.',
    fields: (u) => [
      { id: 'how', label: 'The temperature after expansion is', kind: 'choice', options: [{ id: 'measured', label: 'measured' }, { id: 'predicted', label: 'predicted' }], initial: 'measured' },
      { id: 'down', label: `Pressure after expansion, ${p(u)} absolute`, kind: 'number', initial: atm(u) },
      { id: 'temp', label: `Measured temperature after expansion, ${t(u)} (measured)`, kind: 'number', initial: '' },
      { id: 'line', label: `Line pressure, ${p(u)} absolute (predicted)`, kind: 'number', initial: '' },
      { id: 'x', label: 'Dryness fraction of the supply (predicted)', kind: 'number', initial: '1' },
      { id: 'max', label: 'Highest accepted superheat, K', kind: 'number', initial: formatEditable(EXPANSION_SUPERHEAT_DEFAULT_MAX_K) },
    ],
    evaluate: (v, u) => {
      const downstreamPressurePa = pa(v, 'down', 'pressure after expansion', u);
      const input = v['how'] === 'predicted'
        ? { kind: 'predicted' as const, linePressurePa: pa(v, 'line', 'line pressure', u), dryness: num(v, 'x', 'dryness fraction'), downstreamPressurePa }
        : { kind: 'measured' as const, expansionTemperatureK: kelvin(v, 'temp', 'expansion temperature', u), downstreamPressurePa };
      const e = evaluateExpansionSuperheat(input, { maximumSuperheatK: num(v, 'max', 'highest accepted superheat') });
      return { ...e, summary: `Superheat ${formatNumber(e.superheatK, 3)} K above T_sat ${formatNumber(temperatureFromK(e.saturationTemperatureK, u.temperature), 4)} ${t(u)} (highest accepted ${formatNumber(e.limits.maximumSuperheatK, 3)} K).` };
    },
  },
  {
    id: 'noncondensable-gas',
    label: 'Non-condensable gases',
    about: 'Gas collected from a steam sample per 100 mL of its condensate. A cycle\'s or a check\'s saturation agreement cannot see gas at this level: this test and that agreement answer different questions.',
    fields: () => [
      { id: 'gas', label: 'Gas collected, mL', kind: 'number', initial: '' },
      { id: 'cond', label: 'Condensate collected, mL', kind: 'number', initial: '' },
      { id: 'max', label: 'Highest accepted, mL of gas per 100 mL of condensate', kind: 'number', initial: formatEditable(NONCONDENSABLE_GAS_DEFAULT_MAX_PERCENT) },
    ],
    evaluate: (v) => {
      const e = evaluateNoncondensableGas(
        { gasVolumeM3: num(v, 'gas', 'gas volume') * 1e-6, condensateVolumeM3: num(v, 'cond', 'condensate volume') * 1e-6 },
        { maximumPercentByVolume: num(v, 'max', 'highest accepted non-condensable gas') },
      );
      return { ...e, summary: `${formatNumber(e.percentByVolume, 3)} mL of gas per 100 mL of condensate (highest accepted ${formatNumber(e.limits.maximumPercentByVolume, 3)}).` };
    },
  },
  {
    id: 'vacuum-leak',
    label: 'Air leakage (vacuum hold)',
    about: 'The chamber\'s absolute pressure over a timed vacuum hold: the rise per minute by least squares, with its band from the gauge.',
    fields: (u) => [
      { id: 'readings', label: `Readings, one per line: minutes from the start, then the absolute pressure in ${p(u)}`, kind: 'lines', initial: '' },
      { id: 'span', label: `Gauge span, ${p(u)} (blank if not known)`, kind: 'number', initial: '' },
      { id: 'acc', label: 'Gauge accuracy, % of span (blank if not known)', kind: 'number', initial: '' },
      { id: 'max', label: 'Highest accepted leak rate, kPa/min', kind: 'number', initial: formatEditable(VACUUM_LEAK_DEFAULT_MAX_PA_PER_MINUTE / 1000) },
    ],
    evaluate: (v, u) => {
      const lines = (v['readings'] ?? '').split(/\r?\n/).map((l) => l.trim()).filter((l) => l !== '');
      const readings = lines.map((l, i) => {
        const [time, pressure, extra] = l.split(/\s+|;/).filter((x) => x !== '');
        if (time === undefined || pressure === undefined || extra !== undefined) throw new Error(`reading ${i + 1}: write the minutes, a space, then the pressure ("${l}")`);
        return { timeS: readNumber(time, `reading ${i + 1} time`) * 60, absolutePressurePa: pressureToPa(readNumber(pressure, `reading ${i + 1} pressure`), u.pressure, `reading ${i + 1} pressure`) };
      });
      const gauge = (v['span'] ?? '').trim() !== '' && (v['acc'] ?? '').trim() !== ''
        ? { spanPa: pa(v, 'span', 'gauge span', u), accuracyPercentOfSpan: num(v, 'acc', 'gauge accuracy') } : undefined;
      const e = evaluateVacuumLeak(readings, { maximumPaPerMinute: num(v, 'max', 'highest accepted leak rate') * 1000, ...(gauge ? { gauge } : {}) });
      const r = e.rate;
      return { ...e, summary: `Leak rate ${formatNumber(r.paPerMinute / 1000, 3)} kPa/min (${formatNumber(r.paPerMinute / 100, 3)} mbar/min) ± ${formatNumber(r.plusMinusPaPerMinute / 1000, 2)} kPa/min; highest accepted ${formatNumber(e.limits.maximumPaPerMinute / 1000, 3)} kPa/min.` };
    },
  },
  {
    id: 'air-removal',
    label: 'Air-removal test result',
    about: 'The result of a test pack run through the empty chamber, recorded with its batch, so the day\'s tests sit beside the cycles.',
    fields: () => [
      { id: 'result', label: 'Result as read from the test pack', kind: 'choice', options: [{ id: 'pass', label: 'pass' }, { id: 'fail', label: 'fail' }], initial: 'pass' },
      { id: 'batch', label: 'Test pack batch', kind: 'text', initial: '' },
      { id: 'note', label: 'What the indicator showed', kind: 'text', initial: '' },
    ],
    evaluate: (v) => {
      const e = evaluateAirRemovalTest({ result: v['result'] === 'fail' ? 'fail' : 'pass', testPackBatch: v['batch'] ?? '', note: v['note'] ?? '' });
      return { ...e, summary: `Test pack read as ${e.record.result}, batch ${e.record.testPackBatch}.` };
    },
  },
  {
    id: 'dryness-value',
    label: 'Dryness value (vacuum-flask method)',
    about: 'Condensate collected into a weighed flask of cold water: masses and temperatures before and after give the dryness value. This test value approximates the dryness fraction; it is not the same quantity as the throttling calorimeter\'s result.',
    fields: (u) => [
      { id: 'supply', label: `Supply pressure, ${p(u)} absolute`, kind: 'number', initial: '' },
      { id: 'empty', label: 'Empty flask, g', kind: 'number', initial: '' },
      { id: 'before', label: 'Flask with water before, g', kind: 'number', initial: '' },
      { id: 'after', label: 'Flask with water and condensate after, g', kind: 'number', initial: '' },
      { id: 'tBefore', label: `Water temperature before, ${t(u)}`, kind: 'number', initial: '' },
      { id: 'tAfter', label: `Water temperature after, ${t(u)}`, kind: 'number', initial: '' },
      { id: 'heat', label: 'Flask heat capacity, J/K', kind: 'number', initial: '' },
      { id: 'metal', label: 'The steriliser processes metal loads', kind: 'choice', options: [{ id: 'no', label: 'no' }, { id: 'yes', label: 'yes' }], initial: 'no' },
      { id: 'min', label: `Lowest accepted dryness value (blank: ${DRYNESS_VALUE_DEFAULT_MIN.general}, or ${DRYNESS_VALUE_DEFAULT_MIN.metalLoads} for metal loads)`, kind: 'number', initial: '' },
    ],
    evaluate: (v, u) => {
      const g = (id: string, label: string) => massToKg(num(v, id, label), 'g', label);
      const min = (v['min'] ?? '').trim();
      const e = evaluateFlaskDryness(
        {
          supplyPressurePa: pa(v, 'supply', 'supply pressure', u), emptyFlaskMassKg: g('empty', 'empty flask mass'),
          massBeforeKg: g('before', 'mass before'), massAfterKg: g('after', 'mass after'),
          temperatureBeforeK: kelvin(v, 'tBefore', 'water temperature before', u), temperatureAfterK: kelvin(v, 'tAfter', 'water temperature after', u),
          flaskHeatCapacityJPerK: num(v, 'heat', 'flask heat capacity'),
        },
        { metalLoads: v['metal'] === 'yes', ...(min === '' ? {} : { minimumDrynessValue: readNumber(min, 'lowest accepted dryness value') }) },
      );
      return { ...e, summary: `Dryness value ${formatNumber(e.result.drynessValue, 3)} (lowest accepted ${formatNumber(e.limits.minimumDrynessValue, 3)}); it approximates the dryness fraction, not the same quantity.` };
    },
  },
];

/** A test's evaluation of the typed values, or the refusal in words naming the field. */
export function evaluateTest(def: SteamTestDef, values: Record<string, string>, u: TestUnits):
  { kind: 'result'; graded: Graded & { summary: string } } | { kind: 'error'; message: string } {
  try {
    return { kind: 'result', graded: def.evaluate(values, u) };
  } catch (e) {
    return { kind: 'error', message: errorText(e) };
  }
}

/** The typed values a test starts with. */
export function initialValues(def: SteamTestDef, u: TestUnits): Record<string, string> {
  return Object.fromEntries(def.fields(u).map((f) => [f.id, f.initial]));
}
