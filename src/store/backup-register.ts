// The instrument register in the backup file (format version 3 on; BACKUP-FORMAT.md, "Instrument
// register"): its three lists' validation, and the merge's decisions for them. Instruments are
// taken by their later edit, like vessels; calibrations and fittings are append-only, so one with
// an id already here is skipped (an identical copy), or kept as it is here and reported (a
// different record under the same id is damage or tampering, never an update).
import type { CalibrationEntry, FittingRecord, InstrumentRecord } from './instrument-records.ts';
import { INSTRUMENT_KIND_IDS, INSTRUMENT_ROLES } from './instrument-records.ts';
import { INSTRUMENT_TEXT_LIMITS } from './instruments.ts';
import { canonicalJson } from './integrity.ts';
import { parseIsoWithOffset } from './time.ts';
import { StoreError } from './errors.ts';
import { requireJsonObject, requireText, requireUuid } from './validate.ts';

/** The register's part of a backup document; empty for files before version 3. */
export interface BackupRegister {
  instruments: InstrumentRecord[];
  calibrations: CalibrationEntry[];
  fittings: FittingRecord[];
}

export const EMPTY_REGISTER: BackupRegister = { instruments: [], calibrations: [], fittings: [] };

export const INSTRUMENT_KEYS = ['id', 'tag', 'tagKey', 'spec', 'displayUnit', 'description', 'origin', 'retired', 'createdAt', 'updatedAt'] as const;
export const CALIBRATION_KEYS = [
  'id', 'instrumentId', 'time', 'timeMs', 'asFoundError', 'asLeftError', 'referenceValue', 'nextDue', 'nextDueMs', 'who', 'certificate', 'enteredUnit', 'note', 'enteredAt',
] as const;
export const FITTING_KEYS = ['id', 'vesselId', 'role', 'instrumentId', 'from', 'fromMs', 'reason', 'enteredAt'] as const;

type Bad = (field: string, problem: string) => StoreError;

function object(bad: Bad, field: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw bad(field, 'expected an object');
  return value as Record<string, unknown>;
}

function keys(bad: Bad, field: string, v: Record<string, unknown>, expected: readonly string[]): void {
  for (const key of Object.keys(v)) if (!expected.includes(key)) throw bad(`${field}.${key}`, 'unknown field');
  for (const key of expected) if (!(key in v)) throw bad(`${field}.${key}`, 'missing');
}

function iso(bad: Bad, field: string, value: unknown): number {
  const ms = typeof value === 'string' ? parseIsoWithOffset(value) : null;
  if (ms === null) throw bad(field, 'expected an ISO 8601 date-time with offset, e.g. 2026-12-01T22:05:00+01:00');
  return ms;
}

function finiteOrNull(bad: Bad, field: string, value: unknown): void {
  if (value !== null && (typeof value !== 'number' || !Number.isFinite(value))) throw bad(field, 'expected a finite number or null');
}

function relabel<T>(bad: Bad, fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof StoreError && error.code === 'invalid-record') throw bad(error.field ?? 'file', error.message.replace(/^[^:]*: /, ''));
    throw error;
  }
}

/** One instrument record. @throws the `bad` error naming the first bad field */
export function validateInstrumentRecord(bad: Bad, field: string, value: unknown): InstrumentRecord {
  const v = object(bad, field, value);
  keys(bad, field, v, INSTRUMENT_KEYS);
  relabel(bad, () => {
    requireUuid(`${field}.id`, v['id']);
    requireText(`${field}.tag`, v['tag'], 1, INSTRUMENT_TEXT_LIMITS.tag);
    requireJsonObject(`${field}.spec`, v['spec']);
    requireText(`${field}.displayUnit`, v['displayUnit'], 1, INSTRUMENT_TEXT_LIMITS.displayUnit);
    requireText(`${field}.description`, v['description'], 0, INSTRUMENT_TEXT_LIMITS.description);
    requireJsonObject(`${field}.origin`, v['origin']);
  });
  const tag = v['tag'] as string;
  if (tag.trim() !== tag) throw bad(`${field}.tag`, 'has spaces at the start or end');
  if (v['tagKey'] !== tag.toLowerCase()) throw bad(`${field}.tagKey`, 'does not match the tag');
  const spec = v['spec'] as Record<string, unknown>;
  if (spec['tag'] !== tag) throw bad(`${field}.spec.tag`, 'does not match the tag');
  if (!(INSTRUMENT_KIND_IDS as readonly unknown[]).includes(spec['kind'])) throw bad(`${field}.spec.kind`, `expected one of ${INSTRUMENT_KIND_IDS.join(', ')}`);
  const origin = v['origin'] as Record<string, unknown>;
  if (origin['kind'] !== 'entered' && origin['kind'] !== 'from-vessel') throw bad(`${field}.origin.kind`, 'expected "entered" or "from-vessel"');
  if (typeof v['retired'] !== 'boolean') throw bad(`${field}.retired`, 'expected true or false');
  iso(bad, `${field}.createdAt`, v['createdAt']);
  iso(bad, `${field}.updatedAt`, v['updatedAt']);
  return v as unknown as InstrumentRecord;
}

/** One calibration record. @throws the `bad` error naming the first bad field */
export function validateCalibrationRecord(bad: Bad, field: string, value: unknown): CalibrationEntry {
  const c = object(bad, field, value);
  keys(bad, field, c, CALIBRATION_KEYS);
  relabel(bad, () => {
    requireUuid(`${field}.id`, c['id']);
    requireUuid(`${field}.instrumentId`, c['instrumentId']);
    requireText(`${field}.who`, c['who'], 1, INSTRUMENT_TEXT_LIMITS.who);
    requireText(`${field}.certificate`, c['certificate'], 0, INSTRUMENT_TEXT_LIMITS.certificate);
    requireText(`${field}.enteredUnit`, c['enteredUnit'], 1, INSTRUMENT_TEXT_LIMITS.displayUnit);
    requireText(`${field}.note`, c['note'], 0, INSTRUMENT_TEXT_LIMITS.note);
  });
  if (c['timeMs'] !== iso(bad, `${field}.time`, c['time'])) throw bad(`${field}.timeMs`, 'does not match time');
  if (typeof c['asFoundError'] !== 'number' || !Number.isFinite(c['asFoundError'])) throw bad(`${field}.asFoundError`, 'expected a finite number');
  finiteOrNull(bad, `${field}.asLeftError`, c['asLeftError']);
  finiteOrNull(bad, `${field}.referenceValue`, c['referenceValue']);
  if (c['nextDue'] === null) {
    if (c['nextDueMs'] !== null) throw bad(`${field}.nextDueMs`, 'expected null when nextDue is null');
  } else if (c['nextDueMs'] !== iso(bad, `${field}.nextDue`, c['nextDue'])) throw bad(`${field}.nextDueMs`, 'does not match nextDue');
  iso(bad, `${field}.enteredAt`, c['enteredAt']);
  return c as unknown as CalibrationEntry;
}

/** One fitting record. @throws the `bad` error naming the first bad field */
export function validateFittingRecord(bad: Bad, field: string, value: unknown): FittingRecord {
  const f = object(bad, field, value);
  keys(bad, field, f, FITTING_KEYS);
  relabel(bad, () => {
    requireUuid(`${field}.id`, f['id']);
    requireUuid(`${field}.vesselId`, f['vesselId']);
    if (f['instrumentId'] !== null) requireUuid(`${field}.instrumentId`, f['instrumentId']);
    requireText(`${field}.reason`, f['reason'], 0, INSTRUMENT_TEXT_LIMITS.reason);
  });
  if (!(INSTRUMENT_ROLES as readonly unknown[]).includes(f['role'])) throw bad(`${field}.role`, `expected one of ${INSTRUMENT_ROLES.join(', ')}`);
  if (f['fromMs'] !== iso(bad, `${field}.from`, f['from'])) throw bad(`${field}.fromMs`, 'does not match from');
  iso(bad, `${field}.enteredAt`, f['enteredAt']);
  return f as unknown as FittingRecord;
}

/** What the merge writes of the register, and what it tells. */
export interface RegisterPlan {
  instruments: InstrumentRecord[];
  calibrations: CalibrationEntry[];
  fittings: FittingRecord[];
  report: { added: number; updated: number; skipped: { id: string; why: string }[] };
}

/** Decides the register's part of a merge from the file's records and those here with the same ids (undefined: not here). */
export function planRegister(file: BackupRegister, here: { instruments: (InstrumentRecord | undefined)[]; calibrations: (CalibrationEntry | undefined)[]; fittings: (FittingRecord | undefined)[] }): RegisterPlan {
  const plan: RegisterPlan = { instruments: [], calibrations: [], fittings: [], report: { added: 0, updated: 0, skipped: [] } };
  file.instruments.forEach((r, i) => {
    const h = here.instruments[i];
    if (!h) {
      plan.instruments.push(r);
      plan.report.added += 1;
    } else if (canonicalJson(h) === canonicalJson(r)) plan.report.skipped.push({ id: r.id, why: 'already here, identical' });
    else if ((parseIsoWithOffset(r.updatedAt) ?? 0) > (parseIsoWithOffset(h.updatedAt) ?? 0)) {
      plan.instruments.push(r);
      plan.report.updated += 1;
    } else plan.report.skipped.push({ id: r.id, why: 'the instrument here was edited at the same time or later; kept it' });
  });
  const appendOnly = <T extends { id: string }>(list: T[], hereList: (T | undefined)[], out: T[], what: string) => {
    list.forEach((r, i) => {
      const h = hereList[i];
      if (!h) {
        out.push(r);
        plan.report.added += 1;
      } else if (canonicalJson(h) === canonicalJson(r)) plan.report.skipped.push({ id: r.id, why: 'already here, identical' });
      else plan.report.skipped.push({ id: r.id, why: `a different ${what} with this id is here; ${what}s are never changed, so the one here was kept` });
    });
  };
  appendOnly(file.calibrations, here.calibrations, plan.calibrations, 'calibration');
  appendOnly(file.fittings, here.fittings, plan.fittings, 'fitting');
  return plan;
}
