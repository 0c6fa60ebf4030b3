// Findings about instruments, worded with the check engine's `say` so a screen can show the
// person's own units: the gauge and thermometer disagreeing steadily over the log, the
// disagreement growing towards the band, and a calibration due or overdue. The rule ids and signal
// words are ours and stable; the signal words follow ANSI Z535 / ISO 3864 use in the check engine:
// CAUTION where the instruments a verdict rests on are in doubt (the saturation check may pass air
// or flag good steam), NOTICE for what is only information.

import { kelvinDifference, say, type Caution, type CautionPart, type CautionQuantity, type SignalWord } from '../check/cautions.ts';
import { CALIBRATION_DUE_WORDS, type CalibrationDue } from './calibration-due.ts';
import { MS_PER_MONTH } from './instrument-kind.ts';
import type { LogDriftEstimate } from './log-drift.ts';

/** Every instrument rule and its signal word. */
export const INSTRUMENT_RULES = {
  'instrument-pair-offset': 'CAUTION',
  'instrument-pair-drift': 'CAUTION',
  'calibration-overdue': 'CAUTION',
  'calibration-due-soon': 'NOTICE',
  'no-calibration-on-record': 'NOTICE',
} as const satisfies Record<string, SignalWord>;
export type InstrumentRule = keyof typeof INSTRUMENT_RULES;

/** The two instruments a drift finding names; tags as the register holds them. */
export interface InstrumentPair {
  gaugeTag?: string;
  thermometerTag?: string;
}

function finding(rule: InstrumentRule, wording: { message: string; parts: CautionPart[] }): Caution {
  return { signal: INSTRUMENT_RULES[rule], message: wording.message, rule, parts: wording.parts };
}

const kPa = (Pa: number): CautionQuantity => ({ kind: 'pressure', Pa, decimals: 1 });
const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** The findings a drift estimate raises: none, the steady offset, the trend towards the band, or both (offset first). */
export function driftFindings(drift: Omit<LogDriftEstimate, 'findings'>, pair: InstrumentPair): Caution[] {
  const gauge = pair.gaugeTag === undefined ? 'the gauge' : `gauge ${pair.gaugeTag}`;
  const thermometer = pair.thermometerTag === undefined ? 'the thermometer' : `thermometer ${pair.thermometerTag}`;
  const n = drift.checksUsed;
  const out: Caution[] = [];
  const o = drift.offsetPa;
  if (o.significant) {
    const size = kPa(Math.abs(o.value));
    const pm = kPa(o.plusMinus);
    const inK = kelvinDifference(Math.abs(drift.temperatureOffsetK.value), 2);
    out.push(finding('instrument-pair-offset', o.value > 0
      ? say`Over the last ${n} checks ${gauge} reads ${size} ± ${pm} above saturation for the reading of ${thermometer} (${inK} in temperature): one of them has drifted, the atmosphere used for gauge readings is off, or gas is present. Compare both with a reference before relying on the saturation check.`
      : say`Over the last ${n} checks ${gauge} reads ${size} ± ${pm} below saturation for the reading of ${thermometer} (${inK} in temperature): one of them has drifted or the atmosphere used for gauge readings is off (gas raises the pressure, it cannot lower it). Compare both with a reference before relying on the saturation check.`));
  }
  const p = drift.projection;
  if (p !== null && p.leavesBeforeDue && drift.trendPaPerS !== null && p.leavesBandMs !== null) {
    const t = drift.trendPaPerS;
    const rate = kPa(Math.abs(t.value) * (MS_PER_MONTH / 1000));
    const pm = kPa(t.plusMinus * (MS_PER_MONTH / 1000));
    const band = kPa(p.bandPa);
    const direction = t.value > 0 ? 'rising' : 'falling';
    const when = p.leavesBandMs <= drift.lastMs ? 'it is outside that band already' : `it leaves that band about ${isoDay(p.leavesBandMs)}`;
    out.push(finding('instrument-pair-drift',
      say`Over the last ${n} checks the pressure less the saturation pressure (${gauge} against ${thermometer}) is ${direction} by ${rate} ± ${pm} a month; the check's band is ± ${band} and ${when}, before the next calibration due ${isoDay(p.dueMs)}. Compare both with a reference before then.`));
  }
  return out;
}

/** The finding for an instrument's due state: overdue, due soon, no calibration on record; null when in date. */
export function calibrationFinding(tag: string, due: CalibrationDue): Caution | null {
  switch (due.state) {
    case 'in-date':
      return null;
    case 'no-calibration':
      return finding('no-calibration-on-record', say`${tag}: ${CALIBRATION_DUE_WORDS['no-calibration']}; its limit is its class alone, with nothing known of its drift.`);
    case 'due-soon':
      return finding('calibration-due-soon', say`${tag}: calibration ${CALIBRATION_DUE_WORDS['due-soon']}, on ${isoDay(due.dueMs)}.`);
    case 'overdue':
      return finding('calibration-overdue', say`${tag}: calibration ${CALIBRATION_DUE_WORDS.overdue} since ${isoDay(due.dueMs)}; checks that use it rest on an instrument nobody has verified since.`);
  }
}
