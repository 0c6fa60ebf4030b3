// The hold as the readings show it, and the equilibration before it.
//
// The hold starts when the measured temperature first reaches the band's lower limit and lasts
// while it stays at or above it (times between readings on the straight line between them). Our
// reading of the outcome, in the words of the issue: met when that first stretch lasts the hold
// time; interrupted when the temperature fell below the limit before the hold time had run and
// came back later; short when it never came back (the cycle ended early) or the readings end first;
// not reached when the temperature never got to the limit.
//
// Equilibration here is the lag between the chamber pressure and the measuring point: from the
// first time T_sat(p) reaches the band's lower limit to the first time the measured temperature
// does (0 when the temperature got there first). With one temperature channel this is not the
// load's equilibration across items, which needs probes in the load.

import { runsAtOrAbove, type Run, type Series } from './time-series.ts';

export type HoldStatus = 'met' | 'short' | 'interrupted' | 'not-reached';

export interface CycleHold {
  status: HoldStatus;
  /** The cycle type's hold time, s. */
  requiredS: number;
  /** When the temperature first reached the band's lower limit, s; null when not reached. */
  startS: number | null;
  /**
   * End of the interval the band and saturation are judged over, s: the end of the first stretch at
   * temperature (met, short), or where the hold time would have ended, at most the last reading
   * (interrupted). Null when not reached.
   */
  endS: number | null;
  /** Length of the first stretch at or above the lower limit, s. */
  achievedS: number;
  /** Longest stretch at or above the lower limit anywhere in the record, s. */
  longestRunS: number;
  /** The first stretch ended with the readings (true) rather than by the temperature falling (false). */
  endedWithRecord: boolean;
  /** For an interrupted hold: below the limit from … until (s) and the lowest temperature then, K. */
  interruption: { belowFromS: number; belowUntilS: number; lowestK: number } | null;
}

export interface Equilibration {
  /** When T_sat(p) first reached the band's lower limit, s; null if it never did. */
  pressureReachedS: number | null;
  /** When the measured temperature first did, s; null if it never did. */
  temperatureReachedS: number | null;
  /** temperatureReachedS − pressureReachedS, at least 0; null unless both were reached. */
  equilibrationS: number | null;
}

/** The hold of a temperature series (times s, temperatures K) against a lower limit K and a hold time s. */
export function findHold(temperature: Series, lowerK: number, requiredS: number): CycleHold {
  const runs = runsAtOrAbove(temperature, lowerK);
  const first: Run | undefined = runs[0];
  const lastS = temperature.timesS[temperature.timesS.length - 1]!;
  if (first === undefined) {
    return { status: 'not-reached', requiredS, startS: null, endS: null, achievedS: 0, longestRunS: 0, endedWithRecord: false, interruption: null };
  }
  const achievedS = first.endS - first.startS;
  const longestRunS = runs.reduce((m, r) => Math.max(m, r.endS - r.startS), 0);
  const base = { requiredS, startS: first.startS, achievedS, longestRunS, endedWithRecord: first.endedWithRecord };
  if (achievedS >= requiredS) return { ...base, status: 'met', endS: first.endS, interruption: null };
  const second = runs[1];
  if (second === undefined) return { ...base, status: 'short', endS: first.endS, interruption: null };
  // A stretch ends only at a reading below the limit, so at least one reading lies in the gap.
  let lowestK = lowerK;
  temperature.timesS.forEach((t, i) => {
    if (t > first.endS && t < second.startS) lowestK = Math.min(lowestK, temperature.values[i]!);
  });
  return {
    ...base,
    status: 'interrupted',
    endS: Math.min(first.startS + requiredS, lastS),
    interruption: { belowFromS: first.endS, belowUntilS: second.startS, lowestK },
  };
}

/** Equilibration from the T_sat(p) series and the measured temperature series against the lower limit K. */
export function findEquilibration(saturationTemperature: Series, temperature: Series, lowerK: number): Equilibration {
  const pressureReachedS = runsAtOrAbove(saturationTemperature, lowerK)[0]?.startS ?? null;
  const temperatureReachedS = runsAtOrAbove(temperature, lowerK)[0]?.startS ?? null;
  const equilibrationS = pressureReachedS === null || temperatureReachedS === null ? null : Math.max(0, temperatureReachedS - pressureReachedS);
  return { pressureReachedS, temperatureReachedS, equilibrationS };
}
