// What plant sync needs of the instrument register (src/sync/README.md, "The register"): the
// register's records this device has not published yet, and the records pulled from the plant
// server merged in the backup import's way (planRegister: an instrument by its later edit,
// calibrations and fittings append-only, a different record under a known id kept as it is here
// and reported). What has been published, or pulled, is remembered by document key in one setting,
// so a sync sends only what is new and never sends back what it received. A fourth surface of the
// store, for src/sync alone (it loads with the sync chunk): on transfer.ts it took that chunk from
// 21.80 to 22.49 KB gzip, over its 22 KB budget (test/size/bundle-size.mjs).
import { getDb } from './connection.ts';
import { storeErrorFromWrite } from './errors.ts';
import { planRegister, type BackupRegister } from './backup-register.ts';
import { validateCalibrationRecord, validateFittingRecord, validateInstrumentRecord } from './backup-format.ts';
import { canonicalJson } from './integrity.ts';
import { getSetting, putSetting } from './settings.ts';
import { parseIsoWithOffset } from './time.ts';
import type { CalibrationEntry, FittingRecord, InstrumentRecord } from './instrument-records.ts';

/** The register's document kinds on the plant server. */
export type RegisterDocType = 'instrument' | 'calibration' | 'fitting';

/** One register record ready to send: its kind, record id, the instrument's revision (its edit time, ms), its canonical JSON. */
export interface RegisterItem {
  type: RegisterDocType;
  recordId: string;
  /** An instrument's edit time in ms (each edit is a new document); 0 for the append-only kinds. */
  revision: number;
  text: string;
}

/** What a pull of the register did. */
export interface RegisterPullReport {
  added: number;
  updated: number;
  /** Records not taken (damaged, or a different record under an id known here), and why. */
  refused: { label: string; why: string }[];
}

const PUBLISHED_KEY = 'sync:register-published';

/** The key a register item is remembered by: kind, id and (an instrument) its revision. */
export function registerItemKey(item: Pick<RegisterItem, 'type' | 'recordId' | 'revision'>): string {
  return item.type === 'instrument' ? `instrument:${item.recordId}:${item.revision}` : `${item.type}:${item.recordId}`;
}

/** An instrument's revision: its last edit's time, ms (0 if unreadable, which the server then refuses). */
export function instrumentRevision(r: InstrumentRecord): number {
  return parseIsoWithOffset(r.updatedAt) ?? 0;
}

async function publishedKeys(): Promise<Set<string>> {
  const stored = await getSetting(PUBLISHED_KEY);
  return new Set(Array.isArray(stored) ? stored.filter((k): k is string => typeof k === 'string') : []);
}

async function rememberKeys(keys: readonly string[]): Promise<void> {
  if (keys.length === 0) return;
  const known = await publishedKeys();
  for (const k of keys) known.add(k);
  await putSetting(PUBLISHED_KEY, [...known]);
}

/**
 * The register's records not yet on the plant server from here (nor pulled from it), oldest kind
 * first: instruments, then calibrations and fittings (a receiving device can then show each as
 * it lands). `kinds` limits it (a technician's device sends calibrations only).
 */
export async function registerToPublish(kinds: readonly RegisterDocType[] = ['instrument', 'calibration', 'fitting']): Promise<RegisterItem[]> {
  const db = await getDb();
  const tx = db.transaction(['instruments', 'calibrations', 'fittings']);
  const [instruments, calibrations, fittings] = await Promise.all([
    tx.objectStore('instruments').getAll(), tx.objectStore('calibrations').getAll(), tx.objectStore('fittings').getAll(), tx.done,
  ]);
  const known = await publishedKeys();
  const items: RegisterItem[] = [
    ...instruments.map((r): RegisterItem => ({ type: 'instrument', recordId: r.id, revision: instrumentRevision(r), text: canonicalJson(r) })),
    ...calibrations.map((r): RegisterItem => ({ type: 'calibration', recordId: r.id, revision: 0, text: canonicalJson(r) })),
    ...fittings.map((r): RegisterItem => ({ type: 'fitting', recordId: r.id, revision: 0, text: canonicalJson(r) })),
  ];
  return items.filter((i) => kinds.includes(i.type) && !known.has(registerItemKey(i)));
}

/** Remembers items as on the server (after a publish the server accepted). */
export async function recordRegisterPublished(items: readonly Pick<RegisterItem, 'type' | 'recordId' | 'revision'>[]): Promise<void> {
  await rememberKeys(items.map(registerItemKey));
}

/**
 * Merges register records pulled from the plant server: each text validated as the backup's
 * register lists are (a bad one refused alone, with its label), then planned as a backup import
 * plans them and written in one transaction. Every pulled item is remembered, so it is not sent back.
 * @throws StoreError('quota-exceeded' | 'write-failed')
 */
export async function applyRegisterRecords(pulled: readonly { label: string; type: RegisterDocType; text: string }[]): Promise<RegisterPullReport> {
  const report: RegisterPullReport = { added: 0, updated: 0, refused: [] };
  const file: BackupRegister = { instruments: [], calibrations: [], fittings: [] };
  const seen: { type: RegisterDocType; recordId: string; revision: number }[] = [];
  for (const p of pulled) {
    try {
      const value: unknown = JSON.parse(p.text);
      if (p.type === 'instrument') {
        const r = validateInstrumentRecord(p.label, value);
        file.instruments.push(r);
        seen.push({ type: p.type, recordId: r.id, revision: instrumentRevision(r) });
      } else if (p.type === 'calibration') {
        const r = validateCalibrationRecord(p.label, value);
        file.calibrations.push(r);
        seen.push({ type: p.type, recordId: r.id, revision: 0 });
      } else {
        const r = validateFittingRecord(p.label, value);
        file.fittings.push(r);
        seen.push({ type: p.type, recordId: r.id, revision: 0 });
      }
    } catch (e) {
      report.refused.push({ label: p.label, why: e instanceof Error ? e.message : String(e) });
    }
  }
  // Two edits of one instrument in a batch: the later edit is the one planned.
  file.instruments = latestOfEach(file.instruments);
  const db = await getDb();
  const read = db.transaction(['instruments', 'calibrations', 'fittings']);
  const [hereInstruments, hereCalibrations, hereFittings] = await Promise.all([
    Promise.all(file.instruments.map((r) => read.objectStore('instruments').get(r.id))),
    Promise.all(file.calibrations.map((r) => read.objectStore('calibrations').get(r.id))),
    Promise.all(file.fittings.map((r) => read.objectStore('fittings').get(r.id))),
    read.done,
  ]);
  const plan = planRegister(file, { instruments: hereInstruments, calibrations: hereCalibrations, fittings: hereFittings });
  // "Already here, identical" and "edited here later" are not refusals; a different append-only record under a known id is.
  for (const s of plan.report.skipped) if (s.why.startsWith('a different')) report.refused.push({ label: s.id, why: s.why });
  report.added = plan.report.added;
  report.updated = plan.report.updated;
  if (plan.instruments.length + plan.calibrations.length + plan.fittings.length > 0) {
    const tx = db.transaction(['instruments', 'calibrations', 'fittings'], 'readwrite', { durability: 'strict' });
    try {
      await Promise.all([
        ...plan.instruments.map((r) => tx.objectStore('instruments').put(r)),
        ...plan.calibrations.map((r) => tx.objectStore('calibrations').put(r)),
        ...plan.fittings.map((r) => tx.objectStore('fittings').put(r)),
        tx.done,
      ]);
    } catch (error) {
      throw storeErrorFromWrite(error, 'Saving the instrument register pulled from the plant server');
    }
  }
  await rememberKeys(seen.map(registerItemKey));
  return report;
}

function latestOfEach(list: InstrumentRecord[]): InstrumentRecord[] {
  const byId = new Map<string, InstrumentRecord>();
  for (const r of list) {
    const had = byId.get(r.id);
    if (!had || instrumentRevision(r) > instrumentRevision(had)) byId.set(r.id, r);
  }
  return [...byId.values()];
}

export type { CalibrationEntry, FittingRecord, InstrumentRecord };
