// The core's light entry: units and their conversions, reading and formatting typed numbers,
// input errors, and the standing note — what the start-up screens need, without the steam tables
// or the check engine. Everything here is also exported by index.ts; the app's start-up code
// imports this file so the engine stays in a chunk of its own, loaded right after first paint.
export { InputError, requireInRange } from './errors.ts';
export type { InputProblem } from './errors.ts';
export * from './units/index.ts';
export { STANDING_NOTE_MESSAGE } from './check/standing-note.ts';
export type { SignalWord } from './check/check-result.ts';
// The check's due state is small and needs nothing else: the Vessels screen and the overview take it from here.
export { checkDue, CHECK_DUE_ORDER, CHECK_INTERVAL_MAX_S, CHECK_INTERVAL_MIN_S } from './check/check-due.ts';
export type { CheckDue, CheckDueState } from './check/check-due.ts';
