// The cautions of a cycle record. Like the check engine's catalogue, each rule has one signal word.
// Findings say what these readings show; standing cautions apply to every cycle; the standing note
// comes last. The wording reports readings against the limits entered and defers the judgement of
// the load to the site's validated procedure, the standards it relies on and licensed practice.
// It keeps what the saturation agreement can see (gross air, at the percent level) apart from the
// non-condensable gas test's level, which no pressure-temperature agreement can see.

import { celsius, kelvinDifference, say, type Caution, type CautionWording } from '../check/cautions.ts';
import { catalogueCaution, grade, type Graded } from '../graded-result.ts';
import type { CycleFigures } from './cycle-evaluation.ts';

/** Every cycle rule and its signal word. */
export const CYCLE_CAUTION_RULES = {
  'cycle-band-not-reached': 'WARNING',
  'cycle-hold-short': 'WARNING',
  'cycle-hold-interrupted': 'WARNING',
  'cycle-not-saturated': 'WARNING',
  'cycle-band-exceeded': 'CAUTION',
  'cycle-pressure-above-saturation': 'CAUTION',
  'cycle-pressure-below-saturation': 'CAUTION',
  'cycle-instruments-coarser-than-limit': 'NOTICE',
  'cycle-readings-sparse': 'NOTICE',
  'cycle-atmosphere-assumed': 'NOTICE',
  'cycle-saturation-agreement-limits': 'NOTICE',
  'cycle-opening-the-chamber': 'CAUTION',
  'cycle-standing-note': 'NOTICE',
} as const satisfies Record<string, Caution['signal']>;

export type CycleCautionRule = keyof typeof CYCLE_CAUTION_RULES;

/** Rules that hold for every cycle whatever its readings (never part of the outcome). */
export const CYCLE_STANDING_RULES: readonly CycleCautionRule[] = ['cycle-saturation-agreement-limits', 'cycle-opening-the-chamber', 'cycle-standing-note'];

/**
 * A hold whose readings are further apart than this fraction of the hold time is flagged: the
 * straight line between two readings could hide a dip (our choice).
 */
export const SPARSE_READINGS_FRACTION_OF_HOLD = 0.1;

const rule = (r: CycleCautionRule, wording: string | CautionWording) => catalogueCaution(CYCLE_CAUTION_RULES, r, wording);

/** The note every cycle record carries (wording ours). Names only the standards the defaults rely on. */
// Marked pure so a build that does not use the cycle room leaves the wording out of the start-up JavaScript.
export const CYCLE_STANDING_NOTE: Caution = /* @__PURE__ */ rule('cycle-standing-note',
  'This record reports what the readings show at the measuring point against the band, hold time and saturation limit entered. ' +
    'Whether a load may be released is decided by the site\'s validated sterilising procedure, the standards it follows ' +
    '(such as EN 285 and ISO 17665-1) and licensed practice.');

/** A duration as minutes and seconds, for wording. */
export function durationText(seconds: number): string {
  const s = Math.max(0, seconds);
  if (s < 10) return `${s.toFixed(1)} s`;
  const whole = Math.round(s);
  if (whole < 60) return `${whole} s`;
  return `${Math.floor(whole / 60)} min ${String(whole % 60).padStart(2, '0')} s`;
}

/** Findings, standing cautions and outcome of an evaluated cycle. */
export function cycleCautions(e: CycleFigures): Graded {
  const at = (t: number) => `${durationText(t - e.firstTimeS)} after the first reading`;
  const { lowerK, upperK } = e.band;
  const h = e.hold;
  const findings: Caution[] = [];

  if (h.status === 'not-reached') {
    const highest = e.temperatureRange.maxK;
    findings.push(rule('cycle-band-not-reached',
      say`The temperature did not reach the band's lower limit (${celsius(lowerK)}); the highest reading was ${celsius(highest)}. These readings show no hold.`));
  } else if (h.status === 'short') {
    findings.push(rule('cycle-hold-short', h.endedWithRecord
      ? say`The temperature was at or above ${celsius(lowerK)} for ${durationText(h.achievedS)} when the readings end; the hold time is ${durationText(h.requiredS)}.`
      : say`The temperature was at or above ${celsius(lowerK)} for ${durationText(h.achievedS)}, then fell below it at ${at(h.startS! + h.achievedS)} and did not return; the hold time is ${durationText(h.requiredS)}.`));
  } else if (h.status === 'interrupted') {
    const i = h.interruption!;
    const later = h.longestRunS >= h.requiredS
      ? 'A later stretch at temperature lasted the hold time; whether a restarted hold counts is for the site\'s procedure.'
      : 'No later stretch at temperature lasted the hold time.';
    findings.push(rule('cycle-hold-interrupted',
      say`The temperature fell below ${celsius(lowerK)} at ${at(i.belowFromS)}, ${durationText(h.achievedS)} into the ${durationText(h.requiredS)} hold, and stayed below it for ${durationText(i.belowUntilS - i.belowFromS)} (lowest ${celsius(i.lowestK)}). ${later}`));
  }

  const x = e.bandExceeded;
  if (x) {
    findings.push(rule('cycle-band-exceeded',
      say`During the hold the temperature rose above the band's upper limit (${celsius(upperK)}) by up to ${kelvinDifference(x.byK)}, at ${at(x.timeS)}.`));
  }

  const s = e.holdSaturation;
  const limitK = e.cycleType.saturationLimitK;
  if (s && s.outsideLimit > 0 && s.largestDeviation) {
    const d = s.largestDeviation.deviationK;
    const when = at(s.largestDeviation.timeS);
    const counted = `During the hold ${s.outsideLimit} of ${s.readings} readings differ from the saturation temperature of the measured pressure by more than the`;
    findings.push(rule('cycle-not-saturated', d < 0
      ? say`${counted} ${kelvinDifference(limitK)} limit; the largest, ${kelvinDifference(-d)} below it at ${when}, points to air or another non-condensable gas in the chamber, or a low-reading thermometer.`
      : say`${counted} ${kelvinDifference(limitK)} limit; the largest, ${kelvinDifference(d)} above it at ${when}, points to superheated steam, or a thermometer or pressure reading at fault.`));
  } else if (s) {
    if (s.pressureAboveSaturation > 0 && s.coldestAboveBandK !== null) {
      findings.push(rule('cycle-pressure-above-saturation',
        say`During the hold ${s.pressureAboveSaturation} of ${s.readings} readings have the pressure above saturation for their temperature beyond the instruments' band (up to ${kelvinDifference(-s.coldestAboveBandK)} below the saturation temperature of the measured pressure), though within the ${kelvinDifference(limitK)} limit: air at the percent level, or a low-reading thermometer.`));
    }
    if (s.pressureBelowSaturation > 0 && s.hottestBelowBandK !== null) {
      findings.push(rule('cycle-pressure-below-saturation',
        say`During the hold ${s.pressureBelowSaturation} of ${s.readings} readings have the pressure below saturation for their temperature beyond the instruments' band (up to ${kelvinDifference(s.hottestBelowBandK)} above the saturation temperature of the measured pressure), though within the ${kelvinDifference(limitK)} limit: superheated steam, or a thermometer or pressure reading at fault.`));
    }
  }
  if (s && s.widestInstrumentBandK !== null && s.widestInstrumentBandK > limitK) {
    findings.push(rule('cycle-instruments-coarser-than-limit',
      say`The instruments' band reaches ±${kelvinDifference(s.widestInstrumentBandK, 2)} during the hold, wider than the ${kelvinDifference(limitK)} saturation limit: these instruments cannot show whether the readings meet that limit.`));
  }
  const gap = e.largestReadingIntervalDuringHoldS;
  if (gap !== null && gap > SPARSE_READINGS_FRACTION_OF_HOLD * e.cycleType.holdTimeS) {
    findings.push(rule('cycle-readings-sparse',
      `Readings during the hold are up to ${durationText(gap)} apart. The band and the hold are judged on straight lines between readings, so a dip between two readings would not show.`));
  }
  if (e.measurement.pressureMeasured === 'gauge' && e.measurement.atmosphereSource === 'site') {
    findings.push(rule('cycle-atmosphere-assumed',
      'The pressures were gauge readings converted with the stored site atmosphere; weather moves it by a few kPa, which widens the instruments\' band. A barometer reading narrows it.'));
  }

  const standing = [
    rule('cycle-saturation-agreement-limits',
      'Agreement of the measured temperature with the saturation temperature of the measured pressure can show gross air only, at the percent level. ' +
        'It cannot see gas at the level of the non-condensable gas test, and it does not replace the air-removal test.'),
    // Opening practice: university EHS autoclave pages (UMD ESSR, Cornell EHS, Iowa State EHS Biosafety Manual), field-practice.md §6.4.
    rule('cycle-opening-the-chamber',
      'Before opening, confirm the chamber is at zero gauge pressure; stand behind the door while residual steam escapes and wear face, eye and heat-resistant hand protection. ' +
        'Liquids in the load can boil over when moved: let them stand before taking them out.'),
  ];
  return grade(findings, standing, CYCLE_STANDING_NOTE);
}
