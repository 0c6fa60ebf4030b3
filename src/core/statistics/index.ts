// Small statistics for the core: Student's t, a robust spread, and a mean and trend over time with
// intervals corrected for serial correlation. Pure numbers: no units of their own.
export { logGamma, regularizedIncompleteBeta, studentTCdf, studentTCritical } from './student-t.ts';
export { MAD_TO_STANDARD_DEVIATION, median, robustSpread } from './robust-spread.ts';
export { correctedLag1Autocorrelation, intervalHalfWidth, MAX_LAG1_AUTOCORRELATION, RUN_LENGTH, serialTrend } from './serial-trend.ts';
export type { SerialTrend } from './serial-trend.ts';
