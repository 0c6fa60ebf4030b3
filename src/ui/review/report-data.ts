// The printable vessel report's figures: a summary of the period and one table row per check,
// already formatted for display.
import { formatNumber, formatToBand } from '../state/format.ts';
import { OUTCOMES, stampText, verdictLabel, type Outcome } from './record-facts.ts';
import type { TrendPoint } from './trend-data.ts';

export interface ReportSummary {
  checks: number;
  /** Checks by outcome (the worst signal word among their findings, or none). */
  byOutcome: { outcome: Outcome; count: number }[];
  consistent: number;
  firstTime: string | null;
  lastTime: string | null;
}

export interface ReportRow {
  id: string;
  time: string;
  verdict: string;
  quality: string;
  liquidMass: string;
  deviation: string;
  outcome: Outcome;
  technician: string;
}

export function reportSummary(points: readonly TrendPoint[]): ReportSummary {
  return {
    checks: points.length,
    byOutcome: OUTCOMES.map((outcome) => ({ outcome, count: points.filter((p) => p.outcome === outcome).length })),
    consistent: points.filter((p) => p.verdict === 'consistent').length,
    firstTime: points[0] ? stampText(points[0].time) : null,
    lastTime: points.length ? stampText(points[points.length - 1]!.time) : null,
  };
}

const dash = '–';

/** A figure rounded to the place its ± band resolves, as the check screen showed it; a few significant digits without a band. */
function shown(value: number, band: number | null | undefined, significant: number): string {
  return band === null || band === undefined || !(band > 0) ? formatNumber(value, significant) : formatToBand(value, band);
}

export function reportRow(p: TrendPoint): ReportRow {
  const b = p.bands;
  return {
    id: p.id,
    time: stampText(p.time),
    verdict: verdictLabel(p.verdict, 'short'),
    quality: p.quality === null ? dash : `${shown(p.quality * 100, b?.quality == null ? null : b.quality * 100, 3)} %`,
    liquidMass: p.liquidMassKg === null ? dash : `${shown(p.liquidMassKg, b?.liquidMassKg, 4)} kg`,
    deviation: p.pressureDeviationPa === null ? dash : `${shown(p.pressureDeviationPa / 1000, b?.pressureDeviationPa == null ? null : b.pressureDeviationPa / 1000, 3)} kPa`,
    outcome: p.outcome,
    technician: p.technician,
  };
}

/** "2026-12-01 to 2026-12-31", or the open ends in words. */
export function periodText(from: string, to: string): string {
  if (from === '' && to === '') return 'all saved checks';
  if (from === '') return `up to ${to}`;
  if (to === '') return `from ${from}`;
  return `${from} to ${to}`;
}
