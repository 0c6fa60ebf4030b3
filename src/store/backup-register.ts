// The instrument register in the backup file (format version 3 on; BACKUP-FORMAT.md, "Instrument
// register"): the merge's decisions for its three lists (backup-format.ts validates them). Instruments are
// taken by their later edit, like vessels; calibrations and fittings are append-only, so one with
// an id already here is skipped (an identical copy), or kept as it is here and reported (a
// different record under the same id is damage or tampering, never an update).
import type { CalibrationEntry, FittingRecord, InstrumentRecord } from './instrument-records.ts';
import { canonicalJson } from './integrity.ts';
import { parseIsoWithOffset } from './time.ts';

/** The register's part of a backup document; empty for files before version 3. */
export interface BackupRegister {
  instruments: InstrumentRecord[];
  calibrations: CalibrationEntry[];
  fittings: FittingRecord[];
}

export const EMPTY_REGISTER: BackupRegister = { instruments: [], calibrations: [], fittings: [] };


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
